import { Box, Link, Text } from '@chakra-ui/react';
import type { SourceEntry } from '@crumbproof/shared';
import { Fragment, useMemo } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { Quantity } from '@/components/ui/quantity';
import { StatusMark } from '@/components/ui/status-mark';
import { dataTableColumns, type DataTableColumn, type DataTableColumnMeta } from '@/components/ui/data-table';
import { VirtualDataTable } from '@/components/ui/virtual-data-table';
import { formatDate } from '@/lib/format';
import { describeEntry, yesNoUnknown } from '../utils/ingredient-facts';
import type { LibraryRow } from '../utils/library-filters';

const column = dataTableColumns<LibraryRow>();

/** The library's columns, in order, with the names the Columns menu shows. */
export const LIBRARY_COLUMNS = [
  { id: 'name', label: 'Name', locked: true },
  { id: 'contains', label: 'Contains' },
  { id: 'mayContain', label: 'May contain' },
  { id: 'vegan', label: 'Vegan' },
  { id: 'vegetarian', label: 'Vegetarian' },
  { id: 'supplier', label: 'Supplier' },
  { id: 'supplierCode', label: 'Supplier code' },
  { id: 'code', label: 'Code' },
  { id: 'specification', label: 'Specification' },
  { id: 'revision', label: 'Revision' },
  { id: 'updated', label: 'Updated' },
] as const;
export type LibraryColumnId = (typeof LIBRARY_COLUMNS)[number]['id'];

/** Shown unless the chef hides them; the supplier's own code starts hidden. */
export const DEFAULT_COLUMN_VISIBILITY: Record<string, boolean> = { supplierCode: false };

function meta(value: DataTableColumnMeta): DataTableColumnMeta {
  return value;
}

function EntryList({ entries }: { entries: readonly SourceEntry[] }) {
  return (
    <Text as="span">
      {entries.map((entry, index) => (
        <Fragment key={`${describeEntry(entry)}-${index}`}>
          {index > 0 ? ', ' : null}
          <Text as="strong" fontWeight="bold">
            {describeEntry(entry)}
          </Text>
        </Fragment>
      ))}
    </Text>
  );
}

function Muted({ children }: { children: string }) {
  return (
    <Text as="span" color="fg.muted">
      {children}
    </Text>
  );
}

function DietCell({ value }: { value: boolean | null | undefined }) {
  const words = yesNoUnknown(value);
  return words === 'Not known' ? <Muted>Not known</Muted> : <>{words}</>;
}

function SpecificationCell({ row }: { row: LibraryRow }) {
  switch (row.specification) {
    case undefined:
      return <Muted>Not checked</Muted>;
    case 'missing':
      return (
        <Text as="span" fontWeight="bold">
          Missing
        </Text>
      );
    case 'overdue':
      return (
        <Text as="span" fontWeight="bold">
          Review overdue
        </Text>
      );
    case 'current':
      return <Text as="span">Current</Text>;
  }
}

const columns: DataTableColumn<LibraryRow>[] = [
  column.accessor((row) => row.ingredient.name, {
    id: 'name',
    header: 'Name',
    sortFn: 'text',
    enableHiding: false,
    meta: meta({ width: 200, sticky: true }),
    cell: (info) => (
      <Link asChild color="accent.fg" fontWeight="bold">
        <RouterLink to={`/ingredients/${encodeURIComponent(info.row.original.ingredient.id)}`}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  column.accessor((row) => (row.ingredient.contains === undefined ? undefined : row.ingredient.contains.map(describeEntry).join(', ')), {
    id: 'contains',
    header: 'Contains',
    sortFn: 'text',
    sortUndefined: 'last',
    meta: meta({ width: 180 }),
    cell: (info) => {
      const contains = info.row.original.ingredient.contains;
      if (contains === undefined) return <StatusMark status="not-known" />;
      if (contains.length === 0) return <StatusMark status="stated-none" />;
      return <EntryList entries={contains} />;
    },
  }),
  column.accessor((row) => (row.ingredient.mayContain ?? []).map(describeEntry).join(', '), {
    id: 'mayContain',
    header: 'May contain',
    sortFn: 'text',
    meta: meta({ width: 160 }),
    cell: (info) => {
      const mayContain = info.row.original.ingredient.mayContain ?? [];
      return mayContain.length === 0 ? <StatusMark status="stated-none" /> : <EntryList entries={mayContain} />;
    },
  }),
  column.accessor((row) => yesNoUnknown(row.ingredient.vegan), {
    id: 'vegan',
    header: 'Vegan',
    sortFn: 'text',
    meta: meta({ width: 105 }),
    cell: (info) => <DietCell value={info.row.original.ingredient.vegan} />,
  }),
  column.accessor((row) => yesNoUnknown(row.ingredient.vegetarian), {
    id: 'vegetarian',
    header: 'Vegetarian',
    sortFn: 'text',
    meta: meta({ width: 115 }),
    cell: (info) => <DietCell value={info.row.original.ingredient.vegetarian} />,
  }),
  column.accessor((row) => row.ingredient.supplier ?? '', {
    id: 'supplier',
    header: 'Supplier',
    sortFn: 'text',
    meta: meta({ width: 140 }),
    cell: (info) => info.row.original.ingredient.supplier || <Muted>Not recorded</Muted>,
  }),
  column.accessor((row) => row.ingredient.supplierCode ?? '', {
    id: 'supplierCode',
    header: 'Supplier code',
    sortFn: 'text',
    meta: meta({ width: 130 }),
    cell: (info) => info.row.original.ingredient.supplierCode || <Muted>Not recorded</Muted>,
  }),
  column.accessor((row) => row.ingredient.id, {
    id: 'code',
    header: 'Code',
    sortFn: 'text',
    meta: meta({ width: 130 }),
    cell: (info) => (
      <Text as="span" textStyle="sm">
        {info.getValue()}
      </Text>
    ),
  }),
  column.accessor((row) => row.specification ?? '', {
    id: 'specification',
    header: 'Specification',
    sortFn: 'text',
    meta: meta({ width: 165 }),
    cell: (info) => <SpecificationCell row={info.row.original} />,
  }),
  column.accessor((row) => row.ingredient.revision, {
    id: 'revision',
    header: 'Revision',
    sortFn: 'basic',
    meta: meta({ width: 100, numeric: true }),
    cell: (info) => <Quantity>{info.getValue()}</Quantity>,
  }),
  column.accessor((row) => row.ingredient.updatedAt, {
    id: 'updated',
    header: 'Updated',
    sortFn: 'text',
    meta: meta({ width: 125, numeric: true }),
    cell: (info) => <Quantity>{formatDate(info.row.original.ingredient.updatedAt)}</Quantity>,
  }),
];

interface IngredientsTableProps {
  rows: LibraryRow[];
  columnVisibility: Record<string, boolean>;
  /** Said when filters leave nothing. */
  empty: string;
}

export function IngredientsTable({ rows, columnVisibility, empty }: IngredientsTableProps) {
  const data = useMemo(() => rows, [rows]);
  return (
    <Box>
      <VirtualDataTable
        caption="Ingredients in the library"
        columns={columns}
        data={data}
        getRowId={(row) => row.ingredient.id}
        columnVisibility={columnVisibility}
        initialSorting={[{ id: 'name', desc: false }]}
        empty={empty}
      />
    </Box>
  );
}
