import { Box, chakra, Table, Text } from '@chakra-ui/react';
import {
  columnVisibilityFeature,
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type ColumnVisibilityState,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { observeElementRect, useVirtualizer, type Virtualizer } from '@tanstack/react-virtual';
import { useRef, type ReactNode } from 'react';

/**
 * The features of a long table: sorting by header and hiding columns. Module scope keeps them
 * stable between renders.
 */
export const virtualTableFeatures = tableFeatures({
  rowSortingFeature,
  columnVisibilityFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, datetime: sortFn_datetime, text: sortFn_text },
});
export type VirtualTableFeatures = typeof virtualTableFeatures;

/** A column helper bound to the long table's features: `const column = virtualTableColumns<Row>()`. */
export function virtualTableColumns<TData extends RowData>() {
  return createColumnHelper<VirtualTableFeatures, TData>();
}

export interface VirtualTableColumnMeta {
  /** The column's name where the header is not plain text (the Columns menu uses it). */
  label?: string;
  /** Width in px; the columns share any extra room in proportion. */
  width?: number;
  /** Right-align and use tabular figures (quantities, dates, counts). */
  numeric?: boolean;
}

export type VirtualTableColumn<TData extends RowData> = ColumnDef<VirtualTableFeatures, TData, any>;

const ROW_ESTIMATE_PX = 45;
/** jsdom and not-yet-laid-out boxes report no height; assume a screenful so rows still render. */
const FALLBACK_VIEWPORT_PX = 720;

function observeRectWithFallback(instance: Virtualizer<HTMLDivElement, Element>, cb: (rect: { width: number; height: number }) => void) {
  return observeElementRect(instance, (rect) => cb(rect.height > 0 ? rect : { width: rect.width, height: FALLBACK_VIEWPORT_PX }));
}

const HeaderButton = chakra('button');

const ARIA_SORT = { asc: 'ascending', desc: 'descending' } as const;

interface VirtualDataTableProps<TData extends RowData> {
  /** Names the table (and its scroll region) for assistive technology. */
  caption: string;
  columns: VirtualTableColumn<TData>[];
  data: TData[];
  getRowId: (row: TData) => string;
  columnVisibility: ColumnVisibilityState;
  initialSorting?: SortingState;
  /** Shown in place of rows when there are none. */
  empty?: ReactNode;
  /** Marks a row (e.g. one with problems); return an accessible description in words too. */
  rowTone?: (row: TData) => 'attention' | undefined;
}

/**
 * A table for thousands of rows: only the rows in view are in the document (with spacer rows
 * above and below, so it stays a real table), the header row sticks, columns sort by their
 * header button and can be hidden. Row and column counts are announced with aria-rowcount.
 */
export function VirtualDataTable<TData extends RowData>({
  caption,
  columns,
  data,
  getRowId,
  columnVisibility,
  initialSorting = [],
  empty = 'Nothing recorded yet.',
  rowTone,
}: VirtualDataTableProps<TData>) {
  const table = useTable({
    features: virtualTableFeatures,
    columns,
    data,
    getRowId: (row) => getRowId(row),
    initialState: { sorting: initialSorting },
    state: { columnVisibility },
    enableSortingRemoval: false,
    // Every column sorts A→Z / low→high on the first click, whatever its type.
    sortDescFirst: false,
  });
  const rows = table.getRowModel().rows;
  const leafColumns = table.getVisibleLeafColumns();
  const scrollRef = useRef<HTMLDivElement>(null);

  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => ROW_ESTIMATE_PX,
    overscan: 10,
    observeElementRect: observeRectWithFallback,
    // A row with no layout (jsdom, a hidden tab) keeps its estimate rather than collapsing to 0.
    measureElement: (element) => element.getBoundingClientRect().height || ROW_ESTIMATE_PX,
    getItemKey: (index) => rows[index]?.id ?? index,
  });
  const items = virtualizer.getVirtualItems();
  const padTop = items[0]?.start ?? 0;
  const padBottom = items.length > 0 ? virtualizer.getTotalSize() - (items.at(-1)?.end ?? 0) : 0;
  const minWidth = leafColumns.reduce(
    (sum, column) => sum + ((column.columnDef.meta as VirtualTableColumnMeta | undefined)?.width ?? 140),
    0,
  );

  return (
    <Box
      ref={scrollRef}
      role="region"
      aria-label={caption}
      tabIndex={0}
      overflow="auto"
      maxH="min(70vh, 760px)"
      borderWidth="1px"
      borderColor="border.muted"
      rounded="md"
      bg="bg.panel"
      _focusVisible={{ outline: '2px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' }}
    >
      <Table.Root
        size="sm"
        stickyHeader
        interactive={false}
        aria-rowcount={rows.length + 1}
        tableLayout="fixed"
        width="100%"
        minW={`${minWidth}px`}
        css={{ '& th, & td': { textStyle: 'md' } }}
      >
        <Table.Caption srOnly>{caption}</Table.Caption>
        <colgroup>
          {leafColumns.map((column) => (
            <col key={column.id} style={{ width: `${(column.columnDef.meta as VirtualTableColumnMeta | undefined)?.width ?? 140}px` }} />
          ))}
        </colgroup>
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id} bg="bg.subtle" aria-rowindex={1}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as VirtualTableColumnMeta | undefined;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <Table.ColumnHeader
                    key={header.id}
                    scope="col"
                    colSpan={header.colSpan}
                    color="fg"
                    fontWeight="bold"
                    bg="bg.subtle"
                    textAlign={meta?.numeric ? 'end' : 'start'}
                    aria-sort={sorted ? ARIA_SORT[sorted] : undefined}
                    px="3"
                  >
                    {header.isPlaceholder ? null : canSort ? (
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
                        _focusVisible={{ outline: '2px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' }}
                        _hover={{ textDecoration: 'underline' }}
                      >
                        <table.FlexRender header={header} />
                        <Text as="span" aria-hidden="true" color={sorted ? 'fg' : 'fg.muted'} fontSize="xs">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </Text>
                      </HeaderButton>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </Table.ColumnHeader>
                );
              })}
            </Table.Row>
          ))}
        </Table.Header>
        <Table.Body>
          {rows.length === 0 ? (
            <Table.Row>
              <Table.Cell colSpan={Math.max(leafColumns.length, 1)} color="fg.muted">
                {typeof empty === 'string' ? <Text>{empty}</Text> : empty}
              </Table.Cell>
            </Table.Row>
          ) : (
            <>
              {padTop > 0 ? (
                <tr aria-hidden="true" style={{ height: `${padTop}px` }}>
                  <td colSpan={leafColumns.length} />
                </tr>
              ) : null}
              {items.map((item) => {
                const row = rows[item.index];
                if (!row) return null;
                const tone = rowTone?.(row.original);
                return (
                  <Table.Row
                    key={row.id}
                    data-index={item.index}
                    ref={virtualizer.measureElement}
                    aria-rowindex={item.index + 2}
                    bg={tone === 'attention' ? 'bg.error' : 'bg.panel'}
                  >
                    {row.getVisibleCells().map((cell) => {
                      const meta = cell.column.columnDef.meta as VirtualTableColumnMeta | undefined;
                      return (
                        <Table.Cell
                          key={cell.id}
                          px="3"
                          borderColor="border.subtle"
                          textAlign={meta?.numeric ? 'end' : 'start'}
                          textStyle={meta?.numeric ? 'quantity' : undefined}
                          verticalAlign="top"
                          overflowWrap="anywhere"
                        >
                          <table.FlexRender cell={cell} />
                        </Table.Cell>
                      );
                    })}
                  </Table.Row>
                );
              })}
              {padBottom > 0 ? (
                <tr aria-hidden="true" style={{ height: `${padBottom}px` }}>
                  <td colSpan={leafColumns.length} />
                </tr>
              ) : null}
            </>
          )}
        </Table.Body>
      </Table.Root>
    </Box>
  );
}
