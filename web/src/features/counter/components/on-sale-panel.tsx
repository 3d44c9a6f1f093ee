import { Box, Button, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { KITCHEN_WRITERS, type CounterDayView, type CounterProduct, type CounterProductsView } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { CheckboxInput } from '@/components/ui/choice-inputs';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { isApiError } from '@/lib/api-client';
import { formatDate, formatDateTime } from '@/lib/format';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useCounterDay, useSetCounterDay } from '../api/on-sale';

interface OnSalePanelProps {
  /** The counter's products view (CounterProductsView): the server's day (`date`, today) and every product for sale. */
  view: { date: CounterProductsView['date']; products: readonly Pick<CounterProduct, 'id' | 'name'>[] };
}

const DAY_PATTERN = /^\d{4}-\d{2}-\d{2}$/;

/**
 * The products on sale on a day. The manager and pastry chef tick today's (or a later day's)
 * products and save; front of house reads the list; a past day can be looked up, read only, with
 * who marked it and when.
 */
export function OnSalePanel({ view }: OnSalePanelProps) {
  const me = useSignedInUser();
  const [date, setDate] = useState(view.date);
  const picked = DAY_PATTERN.test(date);
  const day = useCounterDay(date, picked);
  const canMark = KITCHEN_WRITERS.includes(me.role) && picked && date >= view.date;
  const isToday = date === view.date;

  return (
    <Stack gap="5" fontSize="xl">
      <Heading as="h2" size="2xl">
        On sale
      </Heading>
      <Box maxW="20rem">
        <FormField label="Day" hint={isToday ? 'Today' : undefined} error={picked ? undefined : 'Pick a day.'}>
          <TextInput type="date" value={date} onChange={(e) => setDate(e.currentTarget.value)} />
        </FormField>
      </Box>
      {!picked ? null : day.isPending ? (
        <Loading>Loading the day’s products…</Loading>
      ) : day.isError ? (
        <LoadFailed title="The day’s products could not be loaded" error={day.error} onRetry={() => void day.refetch()} />
      ) : canMark ? (
        // A fresh form for each day, so ticks never carry from one day to another.
        <MarkDay key={date} day={day.data} products={view.products} isToday={isToday} />
      ) : (
        <DayList day={day.data} products={view.products} isToday={isToday} />
      )}
    </Stack>
  );
}

type Products = OnSalePanelProps['view']['products'];

function dayWords(date: string, isToday: boolean) {
  return isToday ? 'today' : `on ${formatDate(date)}`;
}

function MarkedBy({ day }: { day: CounterDayView }) {
  if (!day.setBy || !day.setAt) return null;
  return (
    <Text color="fg.muted" fontSize="lg">
      Marked by {day.setBy}, {formatDateTime(day.setAt)}.
    </Text>
  );
}

/** A day as it was marked, read only. Products no longer for sale are still named, by their id. */
function DayList({ day, products, isToday }: { day: CounterDayView; products: Products; isToday: boolean }) {
  const names = new Map(products.map((p) => [p.id, p.name]));
  if (day.products.length === 0) {
    return <Text>{isToday ? 'Nothing is marked on sale today yet.' : `Nothing was marked on sale on ${formatDate(day.date)}.`}</Text>;
  }
  const listed = day.products
    .map((id) => ({ id, name: names.get(id) }))
    .sort((a, b) => (a.name ?? a.id).localeCompare(b.name ?? b.id, 'en-GB'));
  return (
    <Stack gap="3">
      <Text fontWeight="bold">
        {day.products.length === 1 ? '1 product' : `${day.products.length} products`} on sale {dayWords(day.date, isToday)}
      </Text>
      <MarkedBy day={day} />
      <Stack as="ul" gap="1" m="0" ps="5" aria-label={`On sale ${dayWords(day.date, isToday)}`}>
        {listed.map((p) => (
          <li key={p.id}>{p.name ?? `${p.id} (no longer for sale)`}</li>
        ))}
      </Stack>
    </Stack>
  );
}

interface MarkDayProps {
  day: CounterDayView;
  products: Products;
  isToday: boolean;
}

/** The day's products as ticks, with a search, select all or none, and save. */
function MarkDay({ day, products, isToday }: MarkDayProps) {
  const save = useSetCounterDay();
  // null follows what is saved; the first tick starts a draft of the person's own.
  const [draft, setDraft] = useState<{ ids: Set<string>; from: string | null } | null>(null);
  const [search, setSearch] = useState('');
  const [saved, setSaved] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  const forSale = useMemo(() => [...products].sort((a, b) => a.name.localeCompare(b.name, 'en-GB')), [products]);
  const forSaleIds = new Set(forSale.map((p) => p.id));
  const ticked = draft?.ids ?? new Set(day.products);
  const needle = search.trim().toLocaleLowerCase('en-GB');
  const shown = needle === '' ? forSale : forSale.filter((p) => p.name.toLocaleLowerCase('en-GB').includes(needle));
  // Marked that day but no longer for sale: saving leaves them off, and says so.
  const gone = day.products.filter((id) => !forSaleIds.has(id));
  const markedAgain = draft !== null && draft.from !== day.setAt;
  const names = new Map(products.map((p) => [p.id, p.name]));

  function change(update: (ids: Set<string>) => void) {
    setSaved(null);
    setError(null);
    const ids = new Set(ticked);
    update(ids);
    setDraft({ ids, from: draft?.from ?? day.setAt });
  }

  function handleSave() {
    setSaved(null);
    setError(null);
    const ids = forSale.filter((p) => ticked.has(p.id)).map((p) => p.id);
    save.mutate(
      { date: day.date, products: ids },
      {
        onSuccess: (result) => {
          setDraft(null);
          const count = result.products.length === 1 ? '1 product' : `${result.products.length} products`;
          setSaved(`Saved: ${count} on sale ${dayWords(result.date, isToday)}.`);
        },
        onError: (failure) => {
          if (!isApiError(failure)) return setError('The day was not saved. Try again in a moment.');
          // The API names a refused product by its place in the list sent.
          const named = failure.fields.map((f) => {
            const index = /^products\.(\d+)$/.exec(f.path)?.[1];
            const id = index === undefined ? undefined : ids[Number(index)];
            return id === undefined ? f.message : `${names.get(id) ?? id}: ${f.message}`;
          });
          setError(named.length > 0 ? named.join(' ') : failure.message);
        },
      },
    );
  }

  const filtered = needle !== '';
  return (
    <Stack gap="4">
      <Stack gap="1">
        <Text fontWeight="bold" role="status">
          {ticked.size === 0 && draft === null
            ? isToday
              ? 'Nothing is marked on sale today yet.'
              : `Nothing is marked on sale on ${formatDate(day.date)} yet.`
            : `${[...ticked].filter((id) => forSaleIds.has(id)).length} of ${forSale.length} products ticked for ${isToday ? 'today' : formatDate(day.date)}`}
        </Text>
        <MarkedBy day={day} />
      </Stack>
      {markedAgain ? (
        <ErrorAlert title="Marked again while you were changing it">
          {day.setBy} saved this day at {day.setAt ? formatDateTime(day.setAt) : 'a moment ago'}. Saving now replaces their list with your
          ticks.
        </ErrorAlert>
      ) : null}
      {gone.length > 0 ? (
        <Text color="fg.muted" fontSize="lg">
          Marked that day but no longer for sale, and left off when you save: {gone.join(', ')}.
        </Text>
      ) : null}
      {error ? <ErrorAlert title="The day was not saved">{error}</ErrorAlert> : null}
      {forSale.length === 0 ? (
        <Text>No product is for sale yet. A recipe is put on sale in the recipe editor.</Text>
      ) : (
        <>
          <Stack direction={{ base: 'column', md: 'row' }} gap="3" align={{ md: 'flex-end' }}>
            <Box flex="1" maxW={{ md: '24rem' }}>
              <FormField label="Find a product">
                <TextInput type="search" autoComplete="off" value={search} onChange={(e) => setSearch(e.currentTarget.value)} />
              </FormField>
            </Box>
            <HStack gap="3" wrap="wrap">
              <Button
                size="lg"
                minH="12"
                variant="outline"
                disabled={shown.length === 0}
                onClick={() => change((ids) => shown.forEach((p) => ids.add(p.id)))}
              >
                {filtered ? 'Select all shown' : 'Select all'}
              </Button>
              <Button
                size="lg"
                minH="12"
                variant="outline"
                disabled={shown.length === 0}
                onClick={() => change((ids) => shown.forEach((p) => ids.delete(p.id)))}
              >
                {filtered ? 'Select none shown' : 'Select none'}
              </Button>
            </HStack>
          </Stack>
          <Box as="fieldset" borderWidth="0" m="0" p="0">
            <Text as="legend" srOnly>
              Products on sale {dayWords(day.date, isToday)}
            </Text>
            {shown.length === 0 ? (
              <Text>No product for sale is called “{search.trim()}”.</Text>
            ) : (
              <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} columnGap="6" rowGap="1">
                {shown.map((p) => (
                  <CheckboxInput
                    key={p.id}
                    label={p.name}
                    checked={ticked.has(p.id)}
                    onChange={(e) => {
                      const on = e.currentTarget.checked;
                      change((ids) => (on ? ids.add(p.id) : ids.delete(p.id)));
                    }}
                  />
                ))}
              </SimpleGrid>
            )}
          </Box>
          <HStack gap="4" wrap="wrap">
            <Button size="xl" minH="12" onClick={handleSave} loading={save.isPending} loadingText="Saving…">
              Save {isToday ? 'today’s' : 'the day’s'} products
            </Button>
            <Text role="status">{saved ?? (draft ? 'Not saved yet.' : null)}</Text>
          </HStack>
        </>
      )}
    </Stack>
  );
}
