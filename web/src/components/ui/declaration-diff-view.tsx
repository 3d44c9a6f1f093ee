import { Box, Stack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, type ClaimChange, type DeclarationDiff, type GroupChange } from '@crumbproof/shared';
import { ClaimReasonList } from './claim-reasons';
import { CLAIM_STATUS_WORDS, ClaimMark } from './claim-status';
import type { ItemLookup } from './layer-path';
import { Quantity } from './quantity';
import { StatusMark } from './status-mark';
import { TitledList } from './titled-list';

interface DeclarationDiffViewProps {
  diff: DeclarationDiff;
  lookup: ItemLookup;
  /** 'changed' (revision history) or 'all' (swap check: every claim, before → after). */
  claims?: 'changed' | 'all';
  /** Show the reasons that remain under each claim (swap check). */
  showReasons?: boolean;
}

function formatPercent(value: number | null): string {
  if (value === null) return 'not used';
  return `${value.toLocaleString('en-GB', { maximumFractionDigits: 2 })}%`;
}

interface GroupListProps {
  label: string;
  groups: GroupChange[];
  status: 'contains' | 'may-contain';
  removed?: boolean;
}

function GroupList({ label, groups, status, removed = false }: GroupListProps) {
  if (groups.length === 0) return null;
  return (
    <Box>
      <Text fontWeight="bold">{label}</Text>
      <Box as="ul" ps="5" m="0">
        {groups.map((group) => (
          <Box as="li" key={group.allergen}>
            {removed ? (
              <Text as="span">
                {status === 'contains' ? 'No longer contains ' : 'No longer may contain '}
                <Text as="strong" fontWeight="bold">
                  {group.label}
                </Text>
              </Text>
            ) : (
              <StatusMark status={status}>{group.label}</StatusMark>
            )}
          </Box>
        ))}
      </Box>
    </Box>
  );
}

function ClaimChangeRow({ change, lookup, showReasons }: { change: ClaimChange; lookup: ItemLookup; showReasons: boolean }) {
  const label = CLAIM_LABELS[change.claim];
  const moved = change.before !== change.after;
  return (
    <Box as="li" data-changed={moved ? 'true' : 'false'} className="claim-change">
      <Box display="inline-flex" alignItems="center" gap="1.5" flexWrap="wrap">
        <ClaimMark status={change.after} />
        <Text as="span" fontWeight={moved ? 'bold' : 'normal'}>
          {moved
            ? `${label}: ${CLAIM_STATUS_WORDS[change.before]} → ${CLAIM_STATUS_WORDS[change.after]}`
            : `${label}: ${CLAIM_STATUS_WORDS[change.after]} (unchanged)`}
        </Text>
      </Box>
      {showReasons && change.after !== 'ok' ? <ClaimReasonList reasons={change.reasons} lookup={lookup} /> : null}
    </Box>
  );
}

/** What changed between two declarations of one product: allergens, may contain, claims, shares, errors. */
export function DeclarationDiffView({ diff, lookup, claims = 'changed', showReasons = false }: DeclarationDiffViewProps) {
  const claimRows = claims === 'all' ? diff.claims : diff.claims.filter((c) => c.before !== c.after);
  const nothing = !diff.changed && diff.errorsAdded.length === 0 && diff.errorsRemoved.length === 0 && claims === 'changed';
  if (nothing) return <Text color="fg.muted">No change to the declaration.</Text>;

  return (
    <Stack gap="3">
      <GroupList label="Allergens added" groups={diff.containsAdded} status="contains" />
      <GroupList label="Allergens removed" groups={diff.containsRemoved} status="contains" removed />
      <GroupList label="May contain added" groups={diff.mayContainAdded} status="may-contain" />
      <GroupList label="May contain removed" groups={diff.mayContainRemoved} status="may-contain" removed />
      {claimRows.length > 0 ? (
        <Box>
          <Text fontWeight="bold">Claims</Text>
          <Box as="ul" listStyleType="none" ps="0" m="0" display="flex" flexDirection="column" gap="1.5">
            {claimRows.map((change) => (
              <ClaimChangeRow key={change.claim} change={change} lookup={lookup} showReasons={showReasons} />
            ))}
          </Box>
        </Box>
      ) : null}
      <TitledList title="Ingredient shares" items={diff.shares} itemKey={(share) => share.id}>
        {(share) => <Quantity>{`${share.name}: ${formatPercent(share.before)} → ${formatPercent(share.after)}`}</Quantity>}
      </TitledList>
      {diff.finishedWeightG.before !== diff.finishedWeightG.after ? (
        <Text textStyle="quantity">{`Weight after baking: ${diff.finishedWeightG.before} g → ${diff.finishedWeightG.after} g`}</Text>
      ) : null}
      <TitledList
        title="New errors (labels cannot be printed until fixed)"
        items={diff.errorsAdded}
        itemKey={(message) => message}
        tone="error"
      >
        {(message) => message}
      </TitledList>
      <TitledList title="Errors fixed" items={diff.errorsRemoved} itemKey={(message) => message}>
        {(message) => message}
      </TitledList>
      {!diff.changed && claims === 'all' ? <Text color="fg.muted">Nothing a label or the counter shows would change.</Text> : null}
    </Stack>
  );
}
