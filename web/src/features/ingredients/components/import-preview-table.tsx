import { Box, Text } from '@chakra-ui/react';
import type { ImportAction, ImportPreview, ImportRow } from '@crumbproof/shared';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';
import { ImportRowSummary } from './import-row-summary';

const ACTION_WORDS: Record<ImportAction, string> = {
  create: 'Add new',
  update: 'Revise',
  unchanged: 'No change',
};

function Problems({ problems }: { problems: readonly string[] }) {
  if (problems.length === 0) {
    return (
      <Text as="span" color="fg.muted">
        None
      </Text>
    );
  }
  // Problems wrap at any width and are never cut short: each is the whole sentence the import gave.
  return (
    <Box whiteSpace="normal" overflowWrap="anywhere" minW="12rem">
      <Text as="span" fontWeight="bold" color="fg.error">
        {problems.length === 1 ? 'Problem: ' : `${problems.length} problems: `}
      </Text>
      {problems.length === 1 ? (
        <Text as="span">{problems[0]}</Text>
      ) : (
        <Box as="ul" ps="5" m="0">
          {problems.map((message, index) => (
            <li key={index}>{message}</li>
          ))}
        </Box>
      )}
    </Box>
  );
}

const column = dataTableColumns<ImportRow>();

const COLUMNS: DataTableColumn<ImportRow>[] = [
  column.accessor('row', { header: 'Row', meta: { numeric: true } }),
  column.display({
    id: 'ingredient',
    header: 'Ingredient',
    // Named by its name cell even when other cells cannot be read.
    cell: (info) => {
      const name = info.row.original.ingredient?.name ?? info.row.original.nameCell;
      return name ? (
        <Text as="span" fontWeight="bold" overflowWrap="anywhere">
          {name}
        </Text>
      ) : (
        <Text as="span" color="fg.muted">
          No name given
        </Text>
      );
    },
  }),
  column.display({
    id: 'id',
    header: 'Id',
    cell: (info) => info.row.original.ingredient?.id ?? (info.row.original.idCell || 'No id given'),
  }),
  column.display({
    id: 'action',
    header: 'Action',
    cell: (info) => (info.row.original.problems.length > 0 ? 'Not imported' : ACTION_WORDS[info.row.original.action]),
  }),
  // One column for both, so that at tablet width a row's problems sit in view beside its name.
  column.display({
    id: 'records',
    header: 'What it records, or its problems',
    cell: (info) =>
      info.row.original.problems.length > 0 ? (
        <Problems problems={info.row.original.problems} />
      ) : (
        <ImportRowSummary ingredient={info.row.original.ingredient} />
      ),
  }),
];

/** Each spreadsheet row, what importing would do with it, and its problems in words. */
export function ImportPreviewTable({ preview }: { preview: ImportPreview }) {
  return (
    <DataTable
      caption="Rows of the spreadsheet"
      captionHidden
      columns={COLUMNS}
      data={preview.rows}
      getRowId={(row) => String(row.row)}
      rowTone={(row) => (row.problems.length > 0 ? 'attention' : undefined)}
      maxH="70vh"
    />
  );
}
