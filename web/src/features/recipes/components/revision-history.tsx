import { Box, Button, Text } from '@chakra-ui/react';
import type { RecipeRevisionView } from '@crumbproof/shared';
import { useState } from 'react';
import { DeclarationDiffView } from '@/components/ui/declaration-diff-view';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { ItemLookup } from '@/components/ui/layer-path';
import { Loading } from '@/components/ui/loading';
import { Panel, type HeadingLevel } from '@/components/ui/panel';
import { Quantity } from '@/components/ui/quantity';
import { useRevisions } from '../api/get-revisions';
import { formatDateTime } from '@/lib/format';

/** How many revisions show before "Show earlier revisions". */
export const REVISIONS_SHOWN = 3;

function RevisionItem({ revision, lookup, oldest }: { revision: RecipeRevisionView; lookup: ItemLookup; oldest: boolean }) {
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
    <Panel title="Revision history" level={level}>
      {revisions.isPending ? (
        <Loading size="sm">Loading revisions…</Loading>
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
    </Panel>
  );
}
