import { chakra, Table, Text } from '@chakra-ui/react';
import {
  columnVisibilityFeature,
  createColumnHelper,
  createSortedRowModel,
  FlexRender,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type Column,
  type ColumnDef,
  type ReactTable,
  type RowData,
} from '@tanstack/react-table';
import type { ReactNode } from 'react';

/**
 * The features every Crumbproof table registers: sorting by header and hiding columns (a table
 * turns them on where it wants them). Module scope keeps them stable between renders.
 */
export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  columnVisibilityFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, datetime: sortFn_datetime, text: sortFn_text },
});
export type DataTableFeatures = typeof dataTableFeatures;

/** A column helper bound to the tables' features: `const column = dataTableColumns<User>()`. */
export function dataTableColumns<TData extends RowData>() {
  return createColumnHelper<DataTableFeatures, TData>();
}

export interface DataTableColumnMeta {
  /** The column's name where the header is not plain text (the Columns menu uses it). */
  label?: string;
  /** Width in px (long tables lay their columns out by it); the columns share any extra room. */
  width?: number;
  /** Right-align and use tabular figures (quantities, dates, counts). */
  numeric?: boolean;
  /** Keep the column in view when the table scrolls sideways (the column that names the row). */
  sticky?: boolean;
  /**
   * A lesser column, left out below this breakpoint (md 768 px, lg 1024 px, xl 1280 px) so the
   * columns that matter stay in view on a tablet; what it shows must be on the row's own page too.
   * Only the table of tens of rows honours it (the long table has its Columns menu instead).
   */
  hideBelow?: 'md' | 'lg' | 'xl';
  /** The widest the column's text may run before it wraps (a CSS length), e.g. a list of claims. */
  maxW?: string;
}

/** The style props a column's meta gives each of its cells, header and body alike. */
function fitProps(meta: DataTableColumnMeta) {
  return {
    ...(meta.hideBelow ? { hideBelow: meta.hideBelow } : {}),
    ...(meta.maxW ? { maxW: meta.maxW, whiteSpace: 'normal', overflowWrap: 'anywhere' } : {}),
  } as const;
}

/** A table's columns hold values of different types, so the value type is left open here, as TanStack Table's own column arrays do. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each column's own definition types its value; an array of them cannot name one type
export type DataTableColumn<TData extends RowData> = ColumnDef<DataTableFeatures, TData, any>;

export function columnMeta<TData extends RowData>(column: Column<DataTableFeatures, TData, unknown>): DataTableColumnMeta {
  const meta: DataTableColumnMeta | undefined = column.columnDef.meta;
  return meta ?? {};
}

/** Marks a row (one with problems, say); the row must say so in words too. */
export type RowTone = 'attention' | undefined;

const focusRing = { outline: '2px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' } as const;
const stickyCell = {
  position: 'sticky',
  insetStart: 0,
  zIndex: 1,
  boxShadow: 'inset -1px 0 0 var(--chakra-colors-border-muted)',
} as const;

const HeaderButton = chakra('button');
const ARIA_SORT = { asc: 'ascending', desc: 'descending' } as const;

interface TableHeadProps<TData extends RowData> {
  table: ReactTable<DataTableFeatures, TData>;
  /** Padding of the header cells; the long table's are tighter. */
  px?: string;
  /** Row numbers are announced (aria-rowindex) where only part of the body is in the document. */
  rowIndex?: boolean;
}

/** The header rows of every table: sticky, bold, a sort button where the column sorts. */
export function TableHead<TData extends RowData>({ table, px, rowIndex = false }: TableHeadProps<TData>) {
  return (
    <Table.Header>
      {table.getHeaderGroups().map((group) => (
        <Table.Row key={group.id} bg="bg.subtle" aria-rowindex={rowIndex ? 1 : undefined}>
          {group.headers.map((header) => {
            const meta = columnMeta(header.column);
            const sorted = header.column.getIsSorted();
            return (
              <Table.ColumnHeader
                key={header.id}
                scope="col"
                colSpan={header.colSpan}
                color="fg"
                fontWeight="bold"
                bg="bg.subtle"
                textAlign={meta.numeric ? 'end' : 'start'}
                aria-sort={sorted ? ARIA_SORT[sorted] : undefined}
                px={px}
                {...fitProps(meta)}
                {...(meta.sticky ? { ...stickyCell, zIndex: 2 } : {})}
              >
                {header.isPlaceholder ? null : header.column.getCanSort() ? (
                  <HeaderButton
                    type="button"
                    display="inline-flex"
                    alignItems="center"
                    gap="1"
                    fontWeight="bold"
                    textAlign="inherit"
                    cursor="pointer"
                    minH="8"
                    rounded="sm"
                    onClick={header.column.getToggleSortingHandler()}
                    _focusVisible={focusRing}
                    _hover={{ textDecoration: 'underline' }}
                  >
                    <FlexRender header={header} />
                    <Text as="span" aria-hidden="true" color={sorted ? 'fg' : 'fg.muted'} fontSize="xs">
                      {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                    </Text>
                  </HeaderButton>
                ) : (
                  <FlexRender header={header} />
                )}
              </Table.ColumnHeader>
            );
          })}
        </Table.Row>
      ))}
    </Table.Header>
  );
}

/** The one row of a table with no rows: says so, across every column. */
export function EmptyRow({ columns, children }: { columns: number; children: ReactNode }) {
  return (
    <Table.Row>
      <Table.Cell colSpan={Math.max(columns, 1)} color="fg.muted">
        {typeof children === 'string' ? <Text>{children}</Text> : children}
      </Table.Cell>
    </Table.Row>
  );
}

interface DataTableProps<TData extends RowData> {
  /** Names the table for assistive technology; shown above it unless `captionHidden`. */
  caption: string;
  captionHidden?: boolean;
  columns: DataTableColumn<TData>[];
  data: TData[];
  getRowId?: (row: TData) => string;
  /** Shown in place of rows when there are none. */
  empty?: ReactNode;
  rowTone?: (row: TData) => RowTone;
  /** Caps the height; the header stays in view as the rows scroll. */
  maxH?: string;
}

/**
 * A table of tens of rows: every row in the document, columns in the order given. For thousands
 * of rows, sorted and with columns to hide, use VirtualDataTable (same features, header and
 * columns; only the rows in view are drawn).
 */
export function DataTable<TData extends RowData>({
  caption,
  captionHidden = false,
  columns,
  data,
  getRowId,
  empty = 'Nothing recorded yet.',
  rowTone,
  maxH,
}: DataTableProps<TData>) {
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
    enableSorting: false,
  });
  const rows = table.getRowModel().rows;

  return (
    // Focusable and named, so a table wider than its column can be scrolled from the keyboard.
    <Table.ScrollArea
      borderWidth="1px"
      borderColor="border.muted"
      rounded="md"
      bg="bg.panel"
      tabIndex={0}
      role="region"
      aria-label={caption}
      maxH={maxH}
    >
      {/* Body text stays at 16 px in tables too. */}
      <Table.Root size="md" stickyHeader interactive={false} css={{ '& th, & td': { textStyle: 'md' } }}>
        <Table.Caption
          captionSide="top"
          textAlign="start"
          fontWeight="bold"
          textStyle="md"
          color="fg"
          px="4"
          py="3"
          {...(captionHidden ? { srOnly: true } : {})}
        >
          {caption}
        </Table.Caption>
        <TableHead table={table} />
        <Table.Body>
          {rows.length === 0 ? (
            <EmptyRow columns={table.getAllLeafColumns().length}>{empty}</EmptyRow>
          ) : (
            rows.map((row) => {
              const tone = rowTone?.(row.original);
              return (
                <Table.Row
                  key={row.id}
                  bg={tone === 'attention' ? 'bg.error' : 'bg.panel'}
                  borderStartWidth={tone === 'attention' ? '4px' : undefined}
                  borderStartColor={tone === 'attention' ? 'border.error' : undefined}
                  data-tone={tone}
                >
                  {row.getAllCells().map((cell) => {
                    const meta = columnMeta(cell.column);
                    return (
                      <Table.Cell
                        key={cell.id}
                        borderColor="border.subtle"
                        textAlign={meta.numeric ? 'end' : 'start'}
                        textStyle={meta.numeric ? 'quantity' : undefined}
                        verticalAlign="top"
                        {...fitProps(meta)}
                        {...(meta.sticky ? { ...stickyCell, bg: 'inherit' } : {})}
                      >
                        <FlexRender cell={cell} />
                      </Table.Cell>
                    );
                  })}
                </Table.Row>
              );
            })
          )}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
