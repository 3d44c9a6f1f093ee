import { Box, Button, Spinner, Stack, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { DeclarationDiffView } from '@/components/ui/declaration-diff-view';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { ItemLookup } from '@/components/ui/layer-path';
import { Quantity } from '@/components/ui/quantity';
import { useRevisions } from '../api/get-revisions';
import type { RecipeRevision } from '../api/types';
import { formatDateTime } from '@/lib/format';
import { PanelSection, type HeadingLevel } from './panel-section';

/** How many revisions show before "Show earlier revisions". */
export const REVISIONS_SHOWN = 3;

function RevisionItem({ revision, lookup, oldest }: { revision: RecipeRevision; lookup: ItemLookup; oldest: boolean }) {
  return (
    <Box as="li" borderTopWidth="1px" borderColor="border.subtle" pt="3">
      <Text>
        <Text as="span" fontWeight="bold">{`Revision ${revision.revision}`}</Text>
        {' · '}
        <Quantity>{formatDateTime(revision.createdAt)}</Quantity>
        {' · '}
        {revision.authorName ?? 'Unknown author'}
        {revision.note ? ` · ${revision.note}` : ''}
      </Text>
      <Box mt="2">
        {revision.diff ? (
          <DeclarationDiffView diff={revision.diff} lookup={lookup} />
        ) : (
          <Text color="fg.muted">
            {oldest ? 'The first revision: nothing earlier to compare with.' : 'No declaration was recorded for this revision.'}
          </Text>
        )}
      </Box>
    </Box>
  );
}

interface RevisionHistoryProps {
  code: string;
  lookup: ItemLookup;
  level?: HeadingLevel;
}

/** Every saved revision, newest first, with what it changed in the declaration. */
export function RevisionHistory({ code, lookup, level = 'h2' }: RevisionHistoryProps) {
  const revisions = useRevisions(code);
  const [showAll, setShowAll] = useState(false);

  return (
    <PanelSection title="Revision history" level={level}>
      {revisions.isPending ? (
        <Stack role="status" direction="row" align="center" gap="3">
          <Spinner color="accent.solid" size="sm" />
          <Text>Loading revisions…</Text>
        </Stack>
      ) : revisions.isError ? (
        <ErrorAlert title="The revision history could not be loaded">{revisions.error.message}</ErrorAlert>
      ) : revisions.data.length === 0 ? (
        <Text>No revisions recorded.</Text>
      ) : (
        <>
          <Box as="ol" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="3">
            {(showAll ? revisions.data : revisions.data.slice(0, REVISIONS_SHOWN)).map((revision) => (
              <RevisionItem
                key={revision.revision}
                revision={revision}
                lookup={lookup}
                oldest={revision.revision === revisions.data.at(-1)?.revision}
              />
            ))}
          </Box>
          {revisions.data.length > REVISIONS_SHOWN ? (
            <Button
              variant="outline"
              size="md"
              alignSelf="flex-start"
              aria-expanded={showAll}
              onClick={() => setShowAll((value) => !value)}
            >
              {showAll
                ? 'Show fewer revisions'
                : `Show ${revisions.data.length - REVISIONS_SHOWN} earlier ${revisions.data.length - REVISIONS_SHOWN === 1 ? 'revision' : 'revisions'}`}
            </Button>
          ) : null}
        </>
      )}
    </PanelSection>
  );
}
