import { Button, HStack, Spinner, Stack, Text } from '@chakra-ui/react';
import { useDeferredValue, useMemo, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { ColumnsMenu } from '@/components/ui/columns-menu';
import { ErrorAlert } from '@/components/ui/error-alert';
import { Page } from '@/components/ui/page';
import { useIngredients } from '@/api/ingredients';
import { useSpecificationStatus } from '../api/get-specification-status';
import type { SpecificationState } from '../api/types';
import { DEFAULT_COLUMN_VISIBILITY, IngredientsTable, LIBRARY_COLUMNS } from '../components/ingredients-table';
import { LibraryFiltersBar } from '../components/library-filters-bar';
import { filterLibrary, NO_FILTERS, toLibraryRows, type LibraryFilters } from '../utils/library-filters';

const countFormat = new Intl.NumberFormat('en-GB');

export function IngredientsRoute() {
  const ingredients = useIngredients();
  const status = useSpecificationStatus();
  const [filters, setFilters] = useState<LibraryFilters>(NO_FILTERS);
  const [columnVisibility, setColumnVisibility] = useState<Record<string, boolean>>(DEFAULT_COLUMN_VISIBILITY);
  // Typing in the search box stays quick with 2,000 rows: filtering follows a beat behind.
  const deferredFilters = useDeferredValue(filters);

  const statusByCode = useMemo(() => {
    if (!status.data) return undefined;
    return new Map<string, { state: SpecificationState; reviewBy?: string }>(
      status.data.map((entry) => [entry.ingredient, { state: entry.state, reviewBy: entry.latest?.reviewBy }]),
    );
  }, [status.data]);
  const rows = useMemo(() => toLibraryRows(ingredients.data ?? [], statusByCode), [ingredients.data, statusByCode]);
  const shown = useMemo(() => filterLibrary(rows, deferredFilters), [rows, deferredFilters]);

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
      {ingredients.isPending ? (
        <Stack role="status" direction="row" align="center" gap="3">
          <Spinner color="accent.solid" />
          <Text>Loading ingredients…</Text>
        </Stack>
      ) : ingredients.isError ? (
        <Stack gap="3">
          <ErrorAlert title="The ingredients could not be loaded">{ingredients.error.message}</ErrorAlert>
          <Button alignSelf="flex-start" size="lg" variant="outline" onClick={() => void ingredients.refetch()}>
            Try again
          </Button>
        </Stack>
      ) : (
        <Stack gap="3">
          <LibraryFiltersBar filters={filters} onChange={setFilters} specificationsKnown={statusByCode !== undefined} />
          <HStack justify="space-between" gap="3" flexWrap="wrap">
            <Text role="status" color="fg.muted">
              {shown.length === rows.length
                ? `${countFormat.format(rows.length)} ingredients`
                : `Showing ${countFormat.format(shown.length)} of ${countFormat.format(rows.length)} ingredients`}
            </Text>
            <ColumnsMenu columns={LIBRARY_COLUMNS} visibility={columnVisibility} onChange={setColumnVisibility} />
          </HStack>
          <IngredientsTable
            rows={shown}
            columnVisibility={columnVisibility}
            empty={
              rows.length === 0 ? 'No ingredients yet. Add the first one, or import a spreadsheet.' : 'No ingredient matches these filters.'
            }
          />
        </Stack>
      )}
    </Page>
  );
}
