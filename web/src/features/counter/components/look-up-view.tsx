import { Box, Button, Field, Grid, Input, Stack, Text } from '@chakra-ui/react';
import { COUNTER_CAUTION, COUNTER_VERDICTS, type CounterProductsView } from '@crumbproof/shared';
import { useId, useMemo, useState } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { avoidLabels as labelsOf, isEmptyAsk, listed, timedLookUp, type CounterAsk, type LookupRow } from '../utils/lookup';
import { AvoidPicker } from './avoid-picker';
import { ProductCard } from './product-card';
import { ResultsList } from './results-list';
import { VERDICT_WORDS } from './verdict-line';

/** "5 products: 1 suitable as recorded, 2 may contain, 2 contains", said once the results change. */
function countsOf(rows: readonly LookupRow[]): string {
  const total = `${rows.length} ${rows.length === 1 ? 'product' : 'products'}`;
  if (rows.length === 0 || rows.every((r) => r.verdict === null)) return total;
  const counts = COUNTER_VERDICTS.map((v) => [v, rows.filter((r) => r.verdict?.verdict === v).length] as const)
    .filter(([, n]) => n > 0)
    .map(([v, n]) => `${n} ${VERDICT_WORDS[v].toLowerCase()}`);
  return `${total}: ${listed(counts)}`;
}

/** "Avoids eggs and milk; wants vegan." */
function picksOf(ask: CounterAsk, labels: readonly string[]): string {
  const parts = [
    ...(labels.length > 0 ? [`avoids ${listed([...labels])}`] : []),
    ...(ask.want.length > 0 ? [`wants ${listed(ask.want)}`] : []),
  ];
  if (parts.length === 0) return 'Nothing picked yet.';
  const sentence = `The customer ${parts.join('; ')}.`;
  return sentence;
}

interface LookUpViewProps {
  view: CounterProductsView;
  ask: CounterAsk;
  onAskChange: (ask: CounterAsk) => void;
}

/** "Look up": pick what the customer avoids and wants, type a name, read each product's verdict and open its card. */

export function LookUpView({ view, ask, onAskChange }: LookUpViewProps) {
  const [search, setSearch] = useState('');
  const [openId, setOpenId] = useState<string | null>(null);
  // Below desk width the choices fold away so the results are in view; at desk width they stay beside them.
  const [choicesOpen, setChoicesOpen] = useState(true);
  const choicesId = useId();
  const result = useMemo(() => timedLookUp(view.products, view.rules, ask, search), [view, ask, search]);
  const labels = useMemo(() => labelsOf(ask, view.rules), [ask, view.rules]);
  const rows = [...result.onSale, ...result.rest];
  // The card follows the data: a pushed change shows in it at once; a product gone from sale closes it.
  const openRow = rows.find((r) => r.product.id === openId) ?? null;
  const nothing = rows.length === 0 && result.problems.length === 0;

  return (
    <Grid templateColumns={{ base: '1fr', lg: 'minmax(0, 5fr) minmax(0, 6fr)' }} gap="6" alignItems="start">
      <Box position={{ lg: 'sticky' }} top={{ lg: '4' }} bg="bg.canvas" minW="0">
        <Stack gap="4">
          <Field.Root>
            <Field.Label fontSize="xl" fontWeight="bold">
              Find a product
            </Field.Label>
            <Input
              type="search"
              value={search}
              onChange={(e) => setSearch(e.currentTarget.value)}
              placeholder="Type part of its name"
              size="xl"
              fontSize="xl"
              minH="12"
              bg="bg.panel"
              borderColor="border"
            />
          </Field.Root>
          <Stack hideFrom="lg" direction="row" gap="3" align="center" wrap="wrap">
            <Button
              variant="outline"
              minH="12"
              fontSize="lg"
              aria-expanded={choicesOpen}
              aria-controls={choicesId}
              onClick={() => setChoicesOpen((open) => !open)}
            >
              {choicesOpen ? 'Hide the choices' : 'Change the choices'}
            </Button>
            <Text fontSize="lg">{picksOf(ask, labels)}</Text>
          </Stack>
          <Box id={choicesId} display={{ base: choicesOpen ? 'block' : 'none', lg: 'block' }}>
            <AvoidPicker rules={view.rules} ask={ask} onChange={onAskChange} />
          </Box>
        </Stack>
      </Box>
      <Stack gap="4" minW="0">
        <Text role="status" fontSize="lg" color="fg.muted">
          {countsOf(rows)}
        </Text>
        {/* Beside every verdict, what it rests on: never "safe", always "as recorded", with the caution. */}
        {isEmptyAsk(ask) ? null : (
          <Text fontSize="md" borderStartWidth="4px" borderColor="accent.solid" bg="accent.subtle" px="3" py="2" rounded="sm">
            {COUNTER_CAUTION}
          </Text>
        )}
        {result.problems.length > 0 ? <ErrorAlert title="This ask cannot be answered here">{result.problems.join(' ')}</ErrorAlert> : null}
        {nothing ? (
          <Text fontSize="xl">
            {search.trim() ? `No product for sale is called anything like “${search.trim()}”.` : 'No product is for sale yet.'}
          </Text>
        ) : null}
        <ResultsList onSale={result.onSale} rest={result.rest} onOpen={setOpenId} />
      </Stack>
      <ProductCard row={openRow} rules={view.rules} avoid={ask.avoid} avoidLabels={labels} onClose={() => setOpenId(null)} />
    </Grid>
  );
}
