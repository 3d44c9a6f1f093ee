import { chakra, Stack, Text } from '@chakra-ui/react';
import type { RenderProblem } from '@crumbproof/shared/labels';
import { useEffect, useMemo } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { Loading } from '@/components/ui/loading';

const Frame = chakra('iframe');

export type PreviewState =
  | { status: 'idle' }
  | { status: 'drawing' }
  | { status: 'drawn'; pdf: Blob; labels: number; notes: string[] }
  | { status: 'refused'; problems: RenderProblem[] }
  | { status: 'blocked'; message: string };

interface LabelPreviewProps {
  state: PreviewState;
  /** Product id → name, to say whose label each refusal is. */
  nameOf: (product: string) => string;
}

/** The refusals in words, each under the product it is about. */
export function RefusalList({
  problems,
  nameOf,
}: {
  problems: readonly { message: string; product?: string }[];
  nameOf: (product: string) => string;
}) {
  return (
    <Stack as="ul" gap="1" ps="5" m="0">
      {problems.map((problem, i) => (
        <li key={i}>
          {problem.product ? (
            <Text as="span" fontWeight="bold">
              {nameOf(problem.product)}:{' '}
            </Text>
          ) : null}
          {problem.message}
        </li>
      ))}
    </Stack>
  );
}

/** The run as it will print, drawn in the browser by the same renderer the API prints with. */
export function LabelPreview({ state, nameOf }: LabelPreviewProps) {
  const pdf = state.status === 'drawn' ? state.pdf : null;
  const url = useMemo(() => (pdf ? URL.createObjectURL(pdf) : null), [pdf]);
  useEffect(() => () => (url ? URL.revokeObjectURL(url) : undefined), [url]);

  switch (state.status) {
    case 'idle':
      return <Text color="fg.muted">Pick products and a quantity, then preview the labels as they will print.</Text>;
    case 'drawing':
      return <Loading size="sm">Drawing the labels…</Loading>;
    case 'blocked':
      return <Text>{state.message}</Text>;
    case 'refused':
      return (
        <ErrorAlert title="These labels cannot be printed">
          <RefusalList problems={state.problems} nameOf={nameOf} />
        </ErrorAlert>
      );
    case 'drawn':
      return (
        <Stack gap="2">
          <Text>
            {state.labels === 1 ? '1 label' : `${state.labels} labels`}, as they will print.{' '}
            {state.notes.map((note) => (
              <Text as="span" key={note} color="fg.muted">
                {note}{' '}
              </Text>
            ))}
          </Text>
          <Frame
            title="Preview of the labels"
            src={url ? `${url}#navpanes=0&view=Fit` : undefined}
            w="100%"
            h={{ base: '32rem', lg: '40rem' }}
            borderWidth="1px"
            borderColor="border"
            rounded="md"
            bg="white"
          />
        </Stack>
      );
  }
}
