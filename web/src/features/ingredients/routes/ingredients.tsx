import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import type { SpecificationStatus } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { useIngredients, useIngredientSearch } from '@/api/ingredients';
import { ColumnsMenu } from '@/components/ui/columns-menu';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useSpecificationStatus } from '../api/get-specification-status';
import { DEFAULT_COLUMN_VISIBILITY, IngredientsTable, LIBRARY_COLUMNS } from '../components/ingredients-table';
import { LibraryFiltersBar } from '../components/library-filters-bar';
import { filterLibrary, NO_FILTERS, searchOf, toLibraryRows, type LibraryFilters } from '../utils/library-filters';

const countFormat = new Intl.NumberFormat('en-GB');
/** The search goes to the API once typing pauses. */
export const SEARCH_DELAY_MS = 300;

export function IngredientsRoute() {
  const library = useIngredients();
  const status = useSpecificationStatus();
  const [filters, setFilters] = useState<LibraryFilters>(NO_FILTERS);
  const [columnVisibility, setColumnVisibility] = useState<Record<string, boolean>>(DEFAULT_COLUMN_VISIBILITY);
  const typed = useDebouncedValue(filters.search, SEARCH_DELAY_MS);
  const search = searchOf({ ...filters, search: typed });
  const searching = search.q !== undefined || search.source !== undefined;
  const matches = useIngredientSearch(search, { enabled: searching });

  const statusByCode = useMemo(
    () => (status.data ? new Map<string, SpecificationStatus>(status.data.map((entry) => [entry.ingredient, entry])) : undefined),
    [status.data],
  );
  const found = searching ? matches.data : library.data;
  const rows = useMemo(() => toLibraryRows(found ?? [], statusByCode), [found, statusByCode]);
  const shown = useMemo(() => filterLibrary(rows, filters), [rows, filters]);
  const total = library.data?.length ?? 0;
  const waiting = searching && (matches.isPending || matches.isPlaceholderData || typed !== filters.search);

  return (
    <Page
      title="Ingredients"
      lead="Bought-in ingredients with their supplier allergen statements, dietary status and nutrition."
      actions={
        <HStack gap="3" flexWrap="wrap">
          <Button asChild size="md">
            <RouterLink to="/ingredients/new">New ingredient</RouterLink>
          </Button>
          <Button asChild size="md" variant="outline">
            <RouterLink to="/ingredients/import">Import from spreadsheet</RouterLink>
          </Button>
        </HStack>
      }
    >
      {library.isPending ? (
        <Loading>Loading ingredients…</Loading>
      ) : library.isError ? (
        <LoadFailed title="The ingredients could not be loaded" error={library.error} onRetry={() => void library.refetch()} />
      ) : (
        <Stack gap="3">
          <LibraryFiltersBar filters={filters} onChange={setFilters} specificationsKnown={statusByCode !== undefined} />
          <HStack justify="space-between" gap="3" flexWrap="wrap">
            <Text role="status" color="fg.muted">
              {waiting
                ? 'Searching…'
                : shown.length === total
                  ? `${countFormat.format(total)} ingredients`
                  : `Showing ${countFormat.format(shown.length)} of ${countFormat.format(total)} ingredients`}
            </Text>
            <ColumnsMenu columns={LIBRARY_COLUMNS} visibility={columnVisibility} onChange={setColumnVisibility} />
          </HStack>
          {searching && matches.isError ? <ErrorAlert title="The search could not be run">{matches.error.message}</ErrorAlert> : null}
          <IngredientsTable
            rows={shown}
            columnVisibility={columnVisibility}
            empty={
              waiting
                ? 'Searching…'
                : total === 0
                  ? 'No ingredients yet. Add the first one, or import a spreadsheet.'
                  : 'No ingredient matches these filters.'
            }
          />
        </Stack>
      )}
    </Page>
  );
}
