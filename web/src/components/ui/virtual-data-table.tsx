import { Box, Table } from '@chakra-ui/react';
import { flexRender, useTable, type ColumnVisibilityState, type Row, type RowData, type SortingState } from '@tanstack/react-table';
import { observeElementRect, useVirtualizer, type Virtualizer } from '@tanstack/react-virtual';
import { memo, useRef, type ReactNode } from 'react';
import {
  columnMeta,
  dataTableFeatures,
  EmptyRow,
  TableHead,
  type DataTableColumn,
  type DataTableFeatures,
  type RowTone,
} from './data-table';

const ROW_ESTIMATE_PX = 45;
/** jsdom and not-yet-laid-out boxes report no height; assume a screenful so rows still render. */
const FALLBACK_VIEWPORT_PX = 720;

function observeRectWithFallback(instance: Virtualizer<HTMLDivElement, Element>, cb: (rect: { width: number; height: number }) => void) {
  return observeElementRect(instance, (rect) => cb(rect.height > 0 ? rect : { width: rect.width, height: FALLBACK_VIEWPORT_PX }));
}

/**
 * Body rows are plain <tr>/<td> styled from here rather than one styled component per cell:
 * scrolling 2,000 rows renders dozens of rows a frame, and this keeps each one cheap.
 */
const BODY_CSS = {
  '& th, & td': { textStyle: 'md' },
  '& tbody tr[data-row]': { bg: 'bg.panel' },
  '& tbody tr[data-tone=attention]': { bg: 'bg.error' },
  '& tbody td[data-cell]': {
    px: '3',
    py: '2',
    borderBottomWidth: '1px',
    borderColor: 'border.subtle',
    verticalAlign: 'top',
    overflowWrap: 'anywhere',
    textAlign: 'start',
  },
  '& tbody td[data-numeric]': { textAlign: 'end', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  // Borders of a collapsed table stay behind when a cell sticks; shadows travel with it.
  '& tbody td[data-sticky]': {
    position: 'sticky',
    insetStart: 0,
    zIndex: 1,
    bg: 'inherit',
    borderBottomWidth: '0',
    boxShadow: 'inset -1px 0 0 var(--chakra-colors-border-muted), inset 0 -1px 0 var(--chakra-colors-border-subtle)',
  },
  // The header row stays above the sticky body cells that scroll under it.
  '& thead tr': { zIndex: 3 },
} as const;

interface VirtualRowProps<TFeatures extends DataTableFeatures, TData extends RowData> {
  row: Row<TFeatures, TData>;
  index: number;
  tone: RowTone;
  measure: (element: Element | null) => void;
  /** The visible column ids and the column definitions: a change re-renders the row. */
  visibility: string;
  columns: unknown;
}

/** One body row; memoised so rows already on screen do not re-render as the list scrolls. */
const VirtualRow = memo(function VirtualRow<TData extends RowData>({
  row,
  index,
  tone,
  measure,
}: VirtualRowProps<DataTableFeatures, TData>) {
  return (
    <tr ref={measure} data-index={index} data-row="" data-tone={tone} aria-rowindex={index + 2}>
      {row.getVisibleCells().map((cell) => {
        const meta = columnMeta(cell.column);
        return (
          <td key={cell.id} data-cell="" data-numeric={meta.numeric ? '' : undefined} data-sticky={meta.sticky ? '' : undefined}>
            {flexRender(cell.column.columnDef.cell, cell.getContext())}
          </td>
        );
      })}
    </tr>
  );
}) as <TData extends RowData>(props: VirtualRowProps<DataTableFeatures, TData>) => ReactNode;

interface VirtualDataTableProps<TData extends RowData> {
  /** Names the table (and its scroll region) for assistive technology. */
  caption: string;
  columns: DataTableColumn<TData>[];
  data: TData[];
  getRowId: (row: TData) => string;
  columnVisibility: ColumnVisibilityState;
  initialSorting?: SortingState;
  /** Shown in place of rows when there are none. */
  empty?: ReactNode;
  /** Marks a row (e.g. one with problems); return an accessible description in words too. */
  rowTone?: (row: TData) => RowTone;
}

/**
 * A table for thousands of rows: only the rows in view are in the document (with spacer rows
 * above and below, so it stays a real table), the header row sticks, columns sort by their
 * header button and can be hidden. Row and column counts are announced with aria-rowcount.
 *
 * Parallel to DataTable on purpose: the features, columns, header and empty row are DataTable's
 * own; only the body differs, because drawing the rows in view is what makes 2,000 rows scroll.
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
    features: dataTableFeatures,
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

  // eslint-disable-next-line react-hooks/incompatible-library -- this component is not memoised by the compiler; it reads the virtualizer afresh each render, and the rows it memoises are given their props explicitly
  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => ROW_ESTIMATE_PX,
    overscan: 6,
    observeElementRect: observeRectWithFallback,
    // A row with no layout (jsdom, a hidden tab) keeps its estimate rather than collapsing to 0.
    measureElement: (element) => element.getBoundingClientRect().height || ROW_ESTIMATE_PX,
    getItemKey: (index) => rows[index]?.id ?? index,
  });
  const items = virtualizer.getVirtualItems();
  const visibilityKey = leafColumns.map((column) => column.id).join(' ');
  const padTop = items[0]?.start ?? 0;
  const padBottom = items.length > 0 ? virtualizer.getTotalSize() - (items.at(-1)?.end ?? 0) : 0;
  const widthOf = (column: (typeof leafColumns)[number]) => columnMeta(column).width ?? 140;
  const minWidth = leafColumns.reduce((sum, column) => sum + widthOf(column), 0);

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
        css={BODY_CSS}
      >
        <Table.Caption srOnly>{caption}</Table.Caption>
        <colgroup>
          {leafColumns.map((column) => (
            <col key={column.id} style={{ width: `${widthOf(column)}px` }} />
          ))}
        </colgroup>
        <TableHead table={table} px="3" rowIndex />
        <Table.Body>
          {rows.length === 0 ? (
            <EmptyRow columns={leafColumns.length}>{empty}</EmptyRow>
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
                return (
                  <VirtualRow
                    key={row.id}
                    row={row}
                    index={item.index}
                    tone={rowTone?.(row.original)}
                    measure={virtualizer.measureElement}
                    visibility={visibilityKey}
                    columns={columns}
                  />
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
