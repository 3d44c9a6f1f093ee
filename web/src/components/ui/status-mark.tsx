import { Box, HStack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

/**
 * 'none-recorded': a product's declaration with nothing to declare; 'stated-none': an
 * ingredient whose supplier states it has none (never to be read as "not known").
 */
export type AllergenStatus = 'contains' | 'may-contain' | 'not-known' | 'none-recorded' | 'stated-none';

export const STATUS_WORDS: Record<AllergenStatus, string> = {
  contains: 'Contains',
  'may-contain': 'May contain',
  'not-known': 'Not known',
  'none-recorded': 'None recorded',
  'stated-none': 'Supplier states none',
};

interface StatusMarkProps {
  status: AllergenStatus;
  /** The allergen, in the bold face as on the printed label: "Contains **milk**". */
  children?: ReactNode;
}

const markBase = {
  display: 'inline-block',
  flexShrink: 0,
  width: '0.875em',
  height: '0.875em',
  borderRadius: 'sm',
  borderColor: 'mark.ink',
  borderWidth: '2px',
} as const;

/**
 * The counter's verdict "suitable as recorded" has a shape of its own, a ring: an open outline
 * that is none of the others, never a tick alone.
 */
export type MarkShape = AllergenStatus | 'suitable-as-recorded';

/** The shape carries the status; colour never does on its own. Decoration: the words beside it say the status. */
export function Mark({ status }: { status: MarkShape }) {
  switch (status) {
    case 'contains':
      return <Box aria-hidden="true" data-mark="solid" {...markBase} bg="mark.ink" />;
    case 'may-contain':
      return (
        <Box
          aria-hidden="true"
          data-mark="striped"
          {...markBase}
          bgImage="repeating-linear-gradient(135deg, currentColor 0 2px, transparent 2px 5px)"
          color="mark.ink"
        />
      );
    case 'not-known':
      return <Box aria-hidden="true" data-mark="dashed" {...markBase} borderStyle="dashed" />;
    case 'suitable-as-recorded':
      return <Box aria-hidden="true" data-mark="ring" {...markBase} borderRadius="full" borderWidth="3px" />;
    case 'none-recorded':
    case 'stated-none':
      return null;
  }
}

/**
 * An allergen status as words first, mark second:
 * contains = solid mark, may contain = outlined striped mark, not known = dashed outline,
 * none recorded = no mark.
 */
export function StatusMark({ status, children }: StatusMarkProps) {
  return (
    <HStack as="span" display="inline-flex" gap="1.5" align="center" color="fg">
      <Mark status={status} />
      <Text as="span">
        {STATUS_WORDS[status]}
        {children ? (
          <>
            {' '}
            <Text as="strong" fontWeight="bold">
              {children}
            </Text>
          </>
        ) : null}
      </Text>
    </HStack>
  );
}
