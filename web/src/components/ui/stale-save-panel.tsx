import { Box, Button, Heading, List, Stack, Text } from '@chakra-ui/react';
import type { OtherSave, StaleBase } from '@crumbproof/shared';
import { useEffect, useId, useRef } from 'react';
import { formatDateTime } from '@/lib/format';

interface StaleSavePanelProps {
  stale: StaleBase;
  /** Shows their version in the form: the person's unsaved values are dropped. */
  onReload: () => void;
  /** Saves the person's values again, as a new revision on top of theirs. */
  onSaveMine: () => void;
  saving: boolean;
}

const who = (save: OtherSave) => save.authorName ?? 'Someone without a kitchen account';

/**
 * A save refused because someone else saved the item first: who saved which revision when, what
 * they changed, and the two ways on. Nothing happens until the person chooses.
 */
export function StaleSavePanel({ stale, onReload, onSaveMine, saving }: StaleSavePanelProps) {
  const headingId = useId();
  const box = useRef<HTMLElement>(null);
  // The save button is at the foot of a long form: bring the panel into view when it appears.
  useEffect(() => {
    // A block body: scrollIntoView may answer a promise, which React would take for a cleanup.
    void box.current?.scrollIntoView?.({ block: 'start', behavior: 'smooth' });
  }, []);
  const next = stale.currentRevision + 1;
  return (
    <Box
      ref={box}
      as="section"
      role="alert"
      aria-labelledby={headingId}
      bg="bg.error"
      color="fg"
      borderWidth="1px"
      borderColor="border.error"
      borderStartWidth="4px"
      rounded="md"
      p="4"
    >
      <Stack gap="3">
        <Heading as="h2" size="md" id={headingId}>
          Someone else saved this while you were editing
        </Heading>
        <Text>
          Nothing of yours was saved. You started from revision {stale.baseRevision}; {stale.name} is now at revision{' '}
          {stale.currentRevision}.
        </Text>
        {stale.saves.map((save) => (
          <Box key={save.revision}>
            <Text fontWeight="bold">
              {who(save)} saved revision {save.revision} on {formatDateTime(save.savedAt)}
              {save.note && save.note !== 'Edited' ? ` (${save.note})` : ''}.
            </Text>
            {save.changes.length > 0 ? (
              <List.Root ps="5" aria-label={`What revision ${save.revision} changed`}>
                {save.changes.map((change) => (
                  <List.Item key={change.field}>{change.text}</List.Item>
                ))}
              </List.Root>
            ) : (
              <Text>It changed no field.</Text>
            )}
          </Box>
        ))}
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'flex-start' }}>
          <Stack gap="1" flex="1">
            <Button type="button" variant="outline" onClick={onReload} disabled={saving}>
              Reload their version
            </Button>
            <Text color="fg.muted" fontSize="sm">
              The form shows revision {stale.currentRevision}; your unsaved changes are dropped.
            </Text>
          </Stack>
          <Stack gap="1" flex="1">
            <Button type="button" onClick={onSaveMine} loading={saving} loadingText="Saving…">
              Save my values over theirs
            </Button>
            <Text color="fg.muted" fontSize="sm">
              Saves what you see in the form as revision {next}, replacing the changes listed above.
            </Text>
          </Stack>
        </Stack>
      </Stack>
    </Box>
  );
}
