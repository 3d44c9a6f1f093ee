import { Box, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { EuLabelRow, NutritionDeclaration, UsLabelRow } from '@crumbproof/shared';
import { useMemo } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';
import { hrefFor, useCanOpenPath } from '@/components/ui/layer-path';
import { Panel, type HeadingLevel } from '@/components/ui/panel';
import { figureLabel } from '@/lib/nutrients';

/** The API prints "incomplete" where a figure is missing; the screen says so in words and weight. */
function Cell({ text, value }: { text: string; value: number | null }) {
  if (value === null || text.toLowerCase() === 'incomplete') {
    return (
      <Text as="span" fontWeight="bold" borderBottomWidth="2px" borderStyle="dashed" borderColor="border.emphasized">
        Incomplete
      </Text>
    );
  }
  return <>{text}</>;
}

const euColumn = dataTableColumns<EuLabelRow>();
const usColumn = dataTableColumns<UsLabelRow>();

function RowName({ name, indent }: { name: string; indent: boolean }) {
  return (
    <Text as="span" ps={indent ? '4' : '0'} fontWeight={indent ? 'normal' : 'bold'}>
      {name}
    </Text>
  );
}

interface NutritionPanelProps {
  nutrition: NutritionDeclaration;
  level?: HeadingLevel;
}

/** The nutrition declaration: the EU/UK table, a plain per-serving table for the US, and where each figure comes from. */
export function NutritionPanel({ nutrition, level = 'h2' }: NutritionPanelProps) {
  const canOpen = useCanOpenPath();
  const euColumns = useMemo<DataTableColumn<EuLabelRow>[]>(() => {
    const portion = nutrition.label.eu?.portionG ?? null;
    const columns: DataTableColumn<EuLabelRow>[] = [
      euColumn.accessor('name', {
        header: 'Nutrient',
        cell: (info) => <RowName name={info.row.original.name} indent={info.row.original.indent} />,
      }),
      euColumn.display({
        id: 'per100g',
        header: 'Per 100 g',
        meta: { numeric: true },
        cell: (info) => <Cell {...info.row.original.per100g} />,
      }),
    ];
    if (portion !== null) {
      columns.push(
        euColumn.display({
          id: 'perPortion',
          header: `Per portion (${portion} g)`,
          meta: { numeric: true },
          cell: (info) => {
            const cell = info.row.original.perPortion;
            return cell ? <Cell {...cell} /> : '—';
          },
        }),
      );
    }
    return columns;
  }, [nutrition]);

  const usColumns = useMemo<DataTableColumn<UsLabelRow>[]>(
    () => [
      usColumn.accessor('name', {
        header: 'Nutrient',
        cell: (info) => <RowName name={info.row.original.name} indent={info.row.original.indent} />,
      }),
      usColumn.display({
        id: 'amount',
        header: 'Amount per serving',
        meta: { numeric: true },
        cell: (info) => <Cell {...info.row.original.amount} />,
      }),
      usColumn.display({
        id: 'percentDv',
        header: '% Daily Value',
        meta: { numeric: true },
        cell: (info) => {
          const dv = info.row.original.percentDv;
          return dv ? <Cell {...dv} /> : '';
        },
      }),
    ],
    [],
  );

  const { label, missing, incomplete, sources } = nutrition;
  return (
    <Panel title="Nutrition" level={level}>
      {label.note ? <Text>{label.note}</Text> : null}
      {label.eu || label.us ? (
        <SimpleGrid
          minChildWidth="min(100%, 24rem)"
          gap="4"
          alignItems="start"
          // Narrow columns (the editor's live panel) wrap names and headings instead of scrolling, with
          // a little less room between columns, so the US table's % Daily Value stays in view.
          css={{ '& caption, & th, & td:first-of-type': { whiteSpace: 'normal' }, '& th, & td': { paddingInline: '2' } }}
        >
          {label.eu ? (
            <DataTable
              caption={`Nutrition declaration (EU and UK)${label.printed === 'eu' ? ': as this kitchen prints it' : ''}`}
              columns={euColumns}
              data={label.eu.rows}
              getRowId={(row) => row.key}
            />
          ) : null}
          {label.us ? (
            <DataTable
              caption={`Nutrition per serving (${label.us.servingG} g), United States${label.printed === 'us' ? ': as this kitchen prints it' : ''}`}
              columns={usColumns}
              data={label.us.rows}
              getRowId={(row) => row.key}
            />
          ) : null}
        </SimpleGrid>
      ) : null}
      {incomplete.length > 0 ? (
        <Box borderStartWidth="4px" borderColor="border.emphasized" borderStyle="dashed" ps="3">
          <Text fontWeight="bold">{`Incomplete: ${incomplete.map(figureLabel).join(', ')}`}</Text>
          <Box as="ul" ps="5" m="0">
            {missing.map((entry) => (
              <li key={entry.nutrient}>
                {`${figureLabel(entry.nutrient)}: no figure recorded for ${entry.ingredients.map((i) => i.name).join(', ')}`}
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
      <Box as="details" borderWidth="1px" borderColor="border.muted" rounded="md" px="3" py="2">
        <Box as="summary" cursor="pointer" fontWeight="bold" minH="8" display="list-item">
          Where the figures come from
        </Box>
        <Stack as="ul" gap="1" ps="5" m="0" mt="2">
          {sources.map((source) => (
            <li key={source.id}>
              {canOpen(hrefFor(source.id, 'ingredient')) ? (
                <Link asChild color="accent.fg" fontWeight="bold">
                  <RouterLink to={hrefFor(source.id, 'ingredient')}>{source.name}</RouterLink>
                </Link>
              ) : (
                <Text as="span" fontWeight="bold">
                  {source.name}
                </Text>
              )}
              {': '}
              {!source.hasNutrition ? 'no nutrition recorded' : source.source ? source.source : 'figures recorded, no source given'}
            </li>
          ))}
        </Stack>
        <Text color="fg.muted" textStyle="sm" mt="2">
          {nutrition.weightFrom === 'finishedWeightG'
            ? `Divided by the weight after baking${nutrition.finishedWeightG ? ` (${nutrition.finishedWeightG} g)` : ''}.`
            : `Divided by the sum of the lines${nutrition.finishedWeightG ? ` (${nutrition.finishedWeightG} g)` : ''}: no weight after baking is recorded.`}
        </Text>
      </Box>
    </Panel>
  );
}
