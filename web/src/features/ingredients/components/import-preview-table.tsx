import { Box, Text } from '@chakra-ui/react';
import type { ImportAction, ImportPreview, ImportRow } from '@crumbproof/shared';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';

const ACTION_WORDS: Record<ImportAction, string> = {
  create: 'Add new',
  update: 'Update',
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
  return (
    <Box>
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
    cell: (info) => {
      const name = info.row.original.ingredient?.name;
      return name ? (
        <Text as="span" fontWeight="bold">
          {name}
        </Text>
      ) : (
        <Text as="span" color="fg.muted">
          Not readable
        </Text>
      );
    },
  }),
  column.display({ id: 'id', header: 'Id', cell: (info) => info.row.original.ingredient?.id ?? '' }),
  column.display({
    id: 'action',
    header: 'Action',
    cell: (info) => (info.row.original.problems.length > 0 ? 'Not imported' : ACTION_WORDS[info.row.original.action]),
  }),
  column.display({ id: 'problems', header: 'Problems', cell: (info) => <Problems problems={info.row.original.problems} /> }),
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
