import { Link, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, CLAIMS, type RecipeView, type ServedDeclaration } from '@crumbproof/shared';
import { useMemo } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';
import { Quantity } from '@/components/ui/quantity';
import { workedOutAt } from '@/components/ui/declaration-basis';
import { formatDate } from '@/lib/format';

export interface RecipeRow {
  recipe: RecipeView;
  declaration: ServedDeclaration | undefined;
}

const column = dataTableColumns<RecipeRow>();

interface RecipesTableProps {
  rows: RecipeRow[];
  /** False while the declarations are still being computed. */
  declarationsReady: boolean;
  empty: string;
}

export function RecipesTable({ rows, declarationsReady, empty }: RecipesTableProps) {
  const columns = useMemo<DataTableColumn<RecipeRow>[]>(
    () => [
      column.accessor((row) => row.recipe.name, {
        id: 'name',
        header: 'Name',
        meta: { sticky: true, maxW: '12rem' },
        cell: (info) => (
          <Link asChild color="accent.fg" fontWeight="bold">
            <RouterLink to={`/recipes/${encodeURIComponent(info.row.original.recipe.id)}`}>{info.getValue()}</RouterLink>
          </Link>
        ),
      }),
      column.accessor((row) => (row.recipe.sale ? 'For sale' : 'Sub-recipe'), { id: 'kind', header: 'Kind' }),
      column.display({
        id: 'claims',
        header: 'What the recipe supports',
        meta: { maxW: '14rem' },
        cell: (info) => {
          const { recipe, declaration } = info.row.original;
          if (!recipe.sale) return <Text color="fg.muted">Not declared alone</Text>;
          if (!declaration) return <Text color="fg.muted">{declarationsReady ? 'Not computed' : 'Computing…'}</Text>;
          const held = CLAIMS.filter((claim) => declaration.claims[claim]?.status === 'ok').map((claim) => CLAIM_LABELS[claim]);
          return held.length === 0 ? <Text color="fg.muted">None hold</Text> : held.join(', ');
        },
      }),
      column.display({
        id: 'errors',
        header: 'Errors',
        meta: { maxW: '10rem' },
        cell: (info) => {
          const errors = info.row.original.declaration?.errors.length ?? 0;
          if (errors === 0) return info.row.original.declaration ? 'None' : '';
          return (
            <Text as="span" color="fg.error" fontWeight="bold">
              {`${errors} ${errors === 1 ? 'error' : 'errors'}: labels blocked`}
            </Text>
          );
        },
      }),
      column.display({
        id: 'worked-out',
        header: 'Declaration worked out',
        // On a tablet the product's own page says when its declaration was worked out, and from which revision.
        meta: { hideBelow: 'xl', maxW: '14rem' },
        cell: (info) => {
          const { recipe, declaration } = info.row.original;
          if (!declaration) return '';
          const from = declaration.basis.items[0]?.revision;
          return (
            <Quantity>
              {`${workedOutAt(declaration.basis.computedAt)}, from revision ${from}`}
              {from !== recipe.revision ? ` (the recipe is now at revision ${recipe.revision})` : ''}
            </Quantity>
          );
        },
      }),
      column.accessor((row) => row.recipe.revision, { id: 'revision', header: 'Revision', meta: { numeric: true, hideBelow: 'lg' } }),
      column.accessor((row) => row.recipe.updatedAt, {
        id: 'updated',
        header: 'Updated',
        meta: { numeric: true, hideBelow: 'lg' },
        cell: (info) => <Quantity>{formatDate(info.row.original.recipe.updatedAt)}</Quantity>,
      }),
    ],
    [declarationsReady],
  );

  return (
    <DataTable caption="Recipes and products" captionHidden columns={columns} data={rows} getRowId={(row) => row.recipe.id} empty={empty} />
  );
}
