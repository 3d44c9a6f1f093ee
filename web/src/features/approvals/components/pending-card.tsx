import { Box, Button, Heading, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type PendingApproval } from '@crumbproof/shared';
import { ApprovalMark } from '@/components/ui/approval-mark';
import { formatDateTime } from '@/lib/format';
import { WordList } from './word-list';

interface PendingCardProps {
  pending: PendingApproval;
  /** Given for the manager only: the pastry chef reads. */
  onApprove?: () => void;
  approving: boolean;
}

/** One product waiting for approval: the change in words (before and after), what caused it, and the manager's approve button. */
export function PendingCard({ pending, onApprove, approving }: PendingCardProps) {
  const headingId = `pending-${pending.product}`;
  return (
    <Box
      as="article"
      aria-labelledby={headingId}
      borderWidth="1px"
      borderColor="border"
      borderStartWidth={pending.addsAllergen ? '6px' : '1px'}
      rounded="md"
      p="4"
      bg="bg.panel"
    >
      <Stack gap="3">
        <Stack direction={{ base: 'column', md: 'row' }} justify="space-between" gap="2">
          <Stack gap="1">
            <Heading as="h3" size="md" id={headingId}>
              {pending.name}
            </Heading>
            <Text color="fg.muted">
              {pending.approved
                ? `Changed since ${pending.approved.by} approved it on ${formatDateTime(pending.approved.at)}.`
                : 'Never approved: its first approval.'}
            </Text>
          </Stack>
          <Stack gap="1" align={{ md: 'flex-end' }}>
            {pending.addsAllergen ? <ApprovalMark flag="adds-allergen" /> : null}
            {pending.reason === 'first-approval' ? <ApprovalMark flag="not-yet-approved" /> : <ApprovalMark flag="waiting" />}
          </Stack>
        </Stack>
        <Box>
          <Text fontWeight="bold">{pending.reason === 'first-approval' ? 'What it declares' : 'What changes, approved → now'}</Text>
          <WordList words={pending.words} />
        </Box>
        {pending.causes.length > 0 ? (
          <Box>
            <Text fontWeight="bold">What caused it</Text>
            <Box as="ul" ps="5" m="0">
              {pending.causes.map((c) => (
                <Box as="li" key={`${c.at}-${c.summary}`}>
                  {formatDateTime(c.at)}, {c.by ?? 'no one signed in'}
                  {c.role ? ` (${ROLE_LABELS[c.role]})` : ''}: {c.summary}
                </Box>
              ))}
            </Box>
          </Box>
        ) : pending.reason === 'changed' ? (
          <Text color="fg.muted">
            No write since the approval is in the audit trail for it (a change of the reference data reaches it).
          </Text>
        ) : null}
        {onApprove ? (
          <Box>
            <Button onClick={onApprove} loading={approving} loadingText="Approving…">
              Approve {pending.name}
            </Button>
          </Box>
        ) : null}
      </Stack>
    </Box>
  );
}
