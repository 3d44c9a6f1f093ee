import { Text } from '@chakra-ui/react';
import { addedName, CLAIM_LABELS, type CounterApproval } from '@crumbproof/shared';
import { ApprovalMark } from '@/components/ui/approval-mark';
import { formatDate } from '@/lib/format';
import { listed } from '../utils/lookup';

/** What a product's approval means for what the counter shows, in one sentence; null when nothing waits. */
export function approvalSentence(approval: CounterApproval): string | null {
  switch (approval.state) {
    case 'approved':
      return null;
    case 'never-approved':
      return 'Shown as worked out now: a manager has not approved this declaration yet.';
    case 'pending': {
      if (approval.serves === 'approved')
        return `A change waits for a manager’s approval; shown as approved on ${formatDate(approval.approvedAt)}.`;
      const what = [
        ...(approval.adds.length > 0 ? [`adds ${listed(approval.adds.map(addedName))}`] : []),
        ...(approval.notKnown.length > 0 ? [`makes the allergens of ${listed(approval.notKnown)} not known`] : []),
        ...(approval.losesClaims.length > 0 ? [`loses ${listed(approval.losesClaims.map((c) => CLAIM_LABELS[c]))}`] : []),
      ];
      return `A change not approved yet ${listed(what)}: shown here now, as worked out after it.`;
    }
  }
}

/** The flag a counter row and card carry while a product's declaration is not its approved one. */
export function ApprovalFlag({ approval, size = 'md' }: { approval: CounterApproval; size?: 'md' | 'lg' }) {
  const sentence = approvalSentence(approval);
  if (!sentence) return null;
  const flag =
    approval.state === 'never-approved'
      ? 'not-yet-approved'
      : approval.state === 'pending' && approval.adds.length > 0
        ? 'adds-allergen'
        : 'waiting';
  return (
    <Text as="span" display="block" fontSize={size} data-approval={approval.state}>
      <ApprovalMark flag={flag}>{sentence}</ApprovalMark>
    </Text>
  );
}
