import { Box, Stack, Text } from '@chakra-ui/react';
import { Loading } from '@/components/ui/loading';
import { Panel } from '@/components/ui/panel';
import { Quantity } from '@/components/ui/quantity';
import { useIngredientRevisions } from '../api/get-ingredient-revisions';
import { formatDateTime } from '@/lib/format';
import { allergenStatementOf, describeEntry } from '../utils/ingredient-facts';

/** Every saved revision, newest first, with what its allergen statement said. */
export function RevisionsPanel({ code }: { code: string }) {
  const revisions = useIngredientRevisions(code);
  return (
    <Panel title="Revisions" size="md">
      {revisions.isPending ? (
        <Loading size="sm">Loading revisions…</Loading>
      ) : revisions.isError ? (
        <Text color="fg.error">The revisions could not be loaded: {revisions.error.message}</Text>
      ) : (
        <Stack as="ol" aria-label="Revisions, newest first" gap="2" listStyleType="none" m="0" p="0" maxH="80" overflowY="auto">
          {revisions.data.map((revision) => {
            const statement = allergenStatementOf(revision.body);
            return (
              <Box as="li" key={revision.revision} borderBottomWidth="1px" borderColor="border.subtle" pb="2">
                <Text>
                  <Text as="span" fontWeight="bold">
                    Revision <Quantity>{revision.revision}</Quantity>
                  </Text>{' '}
                  <Text as="span" color="fg.muted" textStyle="sm">
                    {formatDateTime(revision.createdAt)}
                    {revision.authorName ? ` · ${revision.authorName}` : ''}
                  </Text>
                </Text>
                {revision.note ? <Text textStyle="sm">{revision.note}</Text> : null}
                <Text textStyle="sm" color="fg.muted">
                  {statement === 'unknown'
                    ? 'Allergen statement: not known'
                    : statement === 'none'
                      ? 'Allergen statement: none'
                      : `Contains: ${(revision.body.contains ?? []).map(describeEntry).join(', ')}`}
                </Text>
              </Box>
            );
          })}
        </Stack>
      )}
    </Panel>
  );
}
