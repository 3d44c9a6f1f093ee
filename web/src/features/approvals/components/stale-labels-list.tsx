import { Box, Button, Heading, Stack, Text } from '@chakra-ui/react';
import type { StaleLabel } from '@crumbproof/shared';
import { useState } from 'react';
import { ApprovalMark } from '@/components/ui/approval-mark';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { formatDateTime } from '@/lib/format';
import { useMarkStaleHandled } from '../api/stale-labels';
import { WordList } from './word-list';

/** One printed item out of date: what to do in one sentence, what the label says that is no longer so, and the manager's handled mark. */
function StaleItem({ stale, canHandle }: { stale: StaleLabel; canHandle: boolean }) {
  const [note, setNote] = useState('');
  const handled = useMarkStaleHandled();
  const error = handled.error;
  return (
    <Box as="li" listStyleType="none" borderWidth="1px" borderColor="border" rounded="md" p="4" bg="bg.panel">
      <Stack gap="2">
        <Heading as="h3" size="sm">
          {stale.action}
        </Heading>
        {stale.addsAllergen ? <ApprovalMark flag="adds-allergen">since the print</ApprovalMark> : null}
        <Text color="fg.muted">
          {stale.chart ? 'Allergen chart' : `${stale.quantity} labels, batch ${stale.batch}`}, printed {formatDateTime(stale.printedAt)}{' '}
          (run {stale.run}); approved change of {formatDateTime(stale.approvedAt)}.
        </Text>
        <WordList words={stale.words} />
        {canHandle ? (
          <Stack direction={{ base: 'column', md: 'row' }} align={{ md: 'flex-end' }} gap="3">
            <FormField label={`What was done (${stale.name}, run ${stale.run})`} error={error?.message}>
              <TextInput value={note} onChange={(e) => setNote(e.currentTarget.value)} placeholder="Withdrawn and relabelled" />
            </FormField>
            <Button
              variant="outline"
              loading={handled.isPending}
              loadingText="Saving…"
              disabled={note.trim() === ''}
              onClick={() => handled.mutate({ id: stale.id, note })}
            >
              Mark handled
            </Button>
          </Stack>
        ) : null}
        {error && !canHandle ? <ErrorAlert>{error.message}</ErrorAlert> : null}
      </Stack>
    </Box>
  );
}

export function StaleLabelsList({ items, canHandle }: { items: StaleLabel[]; canHandle: boolean }) {
  if (items.length === 0) return <Text>No printed label or chart is out of date: every print says what is approved now.</Text>;
  return (
    <Stack as="ul" gap="3" m="0" p="0">
      {items.map((s) => (
        <StaleItem key={s.id} stale={s} canHandle={canHandle} />
      ))}
    </Stack>
  );
}
