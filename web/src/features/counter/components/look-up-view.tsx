import { Box, Field, Grid, Input, Stack, Text } from '@chakra-ui/react';
import type { CounterProductsView } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { avoidLabels as labelsOf, lookUp, type CounterAsk } from '../utils/lookup';
import { AvoidPicker } from './avoid-picker';
import { ProductCard } from './product-card';
import { ResultsList } from './results-list';

interface LookUpViewProps {
  view: CounterProductsView;
  ask: CounterAsk;
  onAskChange: (ask: CounterAsk) => void;
}

/** "Look up": pick what the customer avoids and wants, type a name, read each product's verdict and open its card. */
export function LookUpView({ view, ask, onAskChange }: LookUpViewProps) {
  const [search, setSearch] = useState('');
  const [openId, setOpenId] = useState<string | null>(null);
  const result = useMemo(() => lookUp(view.products, view.rules, ask, search), [view, ask, search]);
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
          <AvoidPicker rules={view.rules} ask={ask} onChange={onAskChange} />
        </Stack>
      </Box>
      <Stack gap="4" minW="0" aria-live="polite">
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
