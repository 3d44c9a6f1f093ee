import { Box, Stack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, type ClaimChange, type DeclarationDiff, type GroupChange, type PrintedChange } from '@crumbproof/shared';
import { ClaimReasonList } from './claim-reasons';
import { CLAIM_STATUS_WORDS, ClaimMark } from './claim-status';
import type { ItemLookup } from './layer-path';
import { MIX_SHARE_KIND, QUID_KIND, formatMixShare } from './percent-kinds';
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

/** A printed line of the label, before and after, each in full so the reader compares them as printed. */
function PrintedLine({ title, change, absent, testId }: { title: string; change: PrintedChange | null; absent: string; testId: string }) {
  if (!change) return null;
  return (
    <Box data-testid={testId}>
      <Text fontWeight="bold">{title}</Text>
      <Box as="dl" m="0" display="grid" gridTemplateColumns="auto 1fr" columnGap="3" rowGap="1">
        <Text as="dt" color="fg.muted">
          Before
        </Text>
        <Text as="dd" m="0" maxW="80ch">
          {change.before ?? absent}
        </Text>
        <Text as="dt" color="fg.muted">
          After
        </Text>
        <Text as="dd" m="0" maxW="80ch" fontWeight="bold">
          {change.after ?? absent}
        </Text>
      </Box>
    </Box>
  );
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

/** What changed between two declarations of one product: allergens, may contain, claims, the printed lines, QUID, shares, errors. */
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
      <PrintedLine
        title="Ingredient list as printed"
        change={diff.ingredientsText}
        absent="No ingredient list."
        testId="ingredients-text-change"
      />
      <PrintedLine
        title="May-contain line as printed"
        change={diff.mayContainText}
        absent="No may-contain line."
        testId="may-contain-text-change"
      />
      {diff.quid.length > 0 ? (
        <Box>
          <TitledList title="QUID as printed" items={diff.quid} itemKey={(entry) => entry.ingredient}>
            {(entry) => (
              <Quantity>{`${entry.before ?? `${entry.name}: not given`} → ${entry.after ?? `${entry.name}: not given`}`}</Quantity>
            )}
          </TitledList>
          <Text color="fg.muted" textStyle="sm">
            {QUID_KIND}
          </Text>
        </Box>
      ) : null}
      {diff.shares.length > 0 ? (
        <Box>
          <TitledList title="Share of the mix" items={diff.shares} itemKey={(share) => share.id}>
            {(share) => <Quantity>{`${share.name}: ${formatMixShare(share.before)} → ${formatMixShare(share.after)}`}</Quantity>}
          </TitledList>
          <Text color="fg.muted" textStyle="sm">
            {MIX_SHARE_KIND}
          </Text>
        </Box>
      ) : null}
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
