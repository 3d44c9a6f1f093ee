import { Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable, type ColumnDef, type RowData } from '@tanstack/react-table';
import type { ReactNode } from 'react';

/** The features every Crumbproof table registers. Module scope keeps them stable between renders. */
export const dataTableFeatures = tableFeatures({});
export type DataTableFeatures = typeof dataTableFeatures;

/** A column helper bound to the DataTable's features: `const column = dataTableColumns<User>()`. */
export function dataTableColumns<TData extends RowData>() {
  return createColumnHelper<DataTableFeatures, TData>();
}

export interface DataTableColumnMeta {
  /** Right-align and use tabular figures (quantities, dates, counts). */
  numeric?: boolean;
}

export type DataTableColumn<TData extends RowData> = ColumnDef<DataTableFeatures, TData, any>;

interface DataTableProps<TData extends RowData> {
  /** Names the table for assistive technology; shown above it unless `captionHidden`. */
  caption: string;
  captionHidden?: boolean;
  columns: DataTableColumn<TData>[];
  data: TData[];
  getRowId?: (row: TData) => string;
  /** Shown in place of rows when there are none. */
  empty?: ReactNode;
}

/** The one wrapper over TanStack Table: semantic markup, sticky header, our tokens. */
export function DataTable<TData extends RowData>({
  caption,
  captionHidden = false,
  columns,
  data,
  getRowId,
  empty = 'Nothing recorded yet.',
}: DataTableProps<TData>) {
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
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
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id} bg="bg.subtle">
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as DataTableColumnMeta | undefined;
                return (
                  <Table.ColumnHeader
                    key={header.id}
                    scope="col"
                    colSpan={header.colSpan}
                    color="fg"
                    fontWeight="bold"
                    bg="bg.subtle"
                    textAlign={meta?.numeric ? 'end' : 'start'}
                  >
                    {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                  </Table.ColumnHeader>
                );
              })}
            </Table.Row>
          ))}
        </Table.Header>
        <Table.Body>
          {rows.length === 0 ? (
            <Table.Row>
              <Table.Cell colSpan={table.getAllLeafColumns().length} color="fg.muted">
                {typeof empty === 'string' ? <Text>{empty}</Text> : empty}
              </Table.Cell>
            </Table.Row>
          ) : (
            rows.map((row) => (
              <Table.Row key={row.id} bg="bg.panel">
                {row.getAllCells().map((cell) => {
                  const meta = cell.column.columnDef.meta as DataTableColumnMeta | undefined;
                  return (
                    <Table.Cell
                      key={cell.id}
                      borderColor="border.subtle"
                      textAlign={meta?.numeric ? 'end' : 'start'}
                      textStyle={meta?.numeric ? 'quantity' : undefined}
                    >
                      <table.FlexRender cell={cell} />
                    </Table.Cell>
                  );
                })}
              </Table.Row>
            ))
          )}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
