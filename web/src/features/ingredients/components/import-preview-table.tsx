import { Box, Table, Text } from '@chakra-ui/react';
import type { ImportPreview, ImportPreviewRow } from '../api/types';

const ACTION_WORDS: Record<ImportPreviewRow['action'], string> = {
  create: 'Add new',
  update: 'Update',
  unchanged: 'No change',
};

/** Each spreadsheet row, what importing would do with it, and its problems in words. */
export function ImportPreviewTable({ preview }: { preview: ImportPreview }) {
  return (
    <Table.ScrollArea borderWidth="1px" borderColor="border.muted" rounded="md" bg="bg.panel" maxH="70vh">
      <Table.Root size="sm" stickyHeader interactive={false} css={{ '& th, & td': { textStyle: 'md' } }}>
        <Table.Caption srOnly>Rows of the spreadsheet</Table.Caption>
        <Table.Header>
          <Table.Row bg="bg.subtle">
            {['Row', 'Ingredient', 'Id', 'Action', 'Problems'].map((label) => (
              <Table.ColumnHeader
                key={label}
                scope="col"
                bg="bg.subtle"
                color="fg"
                fontWeight="bold"
                textAlign={label === 'Row' ? 'end' : 'start'}
              >
                {label}
              </Table.ColumnHeader>
            ))}
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {preview.rows.map((row) => {
            const problem = row.problems.length > 0;
            return (
              <Table.Row
                key={row.row}
                bg={problem ? 'bg.error' : 'bg.panel'}
                borderStartWidth={problem ? '4px' : undefined}
                borderStartColor={problem ? 'border.error' : undefined}
                data-problem={problem ? 'true' : undefined}
              >
                <Table.Cell textAlign="end" textStyle="quantity">
                  {row.row}
                </Table.Cell>
                <Table.Cell fontWeight="bold">
                  {row.ingredient?.name ?? (
                    <Text as="span" color="fg.muted" fontWeight="normal">
                      Not readable
                    </Text>
                  )}
                </Table.Cell>
                <Table.Cell>{row.ingredient?.id ?? ''}</Table.Cell>
                <Table.Cell>{problem ? 'Not imported' : ACTION_WORDS[row.action]}</Table.Cell>
                <Table.Cell>
                  {problem ? (
                    <Box>
                      <Text as="span" fontWeight="bold" color="fg.error">
                        {row.problems.length === 1 ? 'Problem: ' : `${row.problems.length} problems: `}
                      </Text>
                      {row.problems.length === 1 ? (
                        <Text as="span">{row.problems[0]}</Text>
                      ) : (
                        <Box as="ul" ps="5" m="0">
                          {row.problems.map((message, index) => (
                            <li key={index}>{message}</li>
                          ))}
                        </Box>
                      )}
                    </Box>
                  ) : (
                    <Text as="span" color="fg.muted">
                      None
                    </Text>
                  )}
                </Table.Cell>
              </Table.Row>
            );
          })}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
