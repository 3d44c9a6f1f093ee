import { Box, HStack, Text } from '@chakra-ui/react';
import type { ClaimBasis, StatementOnlyLeaf } from '@crumbproof/shared';

/** The status words of a claim that holds, by what it stands on. */
export const HOLDS_ON_STATEMENTS = 'Holds on supplier statements';

/** "Caster sugar (no specification)", "Butter (specification due for review on 2026-11-28)". */
export function statementOnlyWords(leaf: StatementOnlyLeaf): string {
  return leaf.why === 'no-specification'
    ? `${leaf.name} (no specification)`
    : `${leaf.name} (specification due for review on ${leaf.reviewBy})`;
}

const ingredients = (n: number) => `${n} ingredient${n === 1 ? '' : 's'}`;

/** What a claim that holds stands on, in one sentence; the ingredients are named once, by `ClaimBasisLeaves`. */
export function claimBasisWords(basis: ClaimBasis): string {
  const { checked, statementOnly } = basis;
  if (statementOnly.length === 0)
    return checked === 1
      ? 'The one ingredient is checked against a specification on file.'
      : `All ${ingredients(checked)} checked against a specification on file.`;
  const have = statementOnly.length === 1 ? 'has' : 'have';
  return `${statementOnly.length} of ${ingredients(checked)} ${have} no specification on file or one past its review date, so the claim rests on what the supplier states (named below).`;
}

/** "Caster sugar (no specification), Butter (specification due for review on 2026-11-28) and …". */
export function statementOnlyList(basis: ClaimBasis): string {
  return new Intl.ListFormat('en-GB').format(basis.statementOnly.map(statementOnlyWords));
}

/**
 * The mark of the basis, its shape before any colour: a filed sheet with a folded corner when every
 * leaf has a current specification on file; an open speech bubble when some rest on what the
 * supplier states. Decoration: the words beside it say the same.
 */
export function ClaimBasisMark({ backed }: { backed: boolean }) {
  return (
    <Box
      as="span"
      aria-hidden="true"
      data-basis-mark={backed ? 'sheet' : 'bubble'}
      display="inline-flex"
      flexShrink={0}
      color="fg"
      css={{ '& .glyph': { stroke: 'bg.panel' } }}
    >
      <svg width="1em" height="1em" viewBox="0 0 16 16" focusable="false">
        {backed ? (
          <>
            <path d="M3 1.5h6.5l3.5 3.5v9.5h-10z" fill="currentColor" />
            <path d="M9.5 1.5v3.5h3.5" fill="none" className="glyph" strokeWidth="1.4" strokeLinejoin="round" />
          </>
        ) : (
          <path d="M2 2.5h12v8h-7l-3.5 3v-3h-1.5z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
        )}
      </svg>
    </Box>
  );
}

/** Beside a claim that holds: how many ingredients it was checked against, and which rest on a supplier statement alone. */
export function ClaimBasisLine({ basis }: { basis: ClaimBasis }) {
  const backed = basis.statementOnly.length === 0;
  return (
    <HStack as="span" display="flex" gap="1.5" align="flex-start" textStyle="sm" data-testid="claim-basis">
      <Box as="span" pt="0.2em">
        <ClaimBasisMark backed={backed} />
      </Box>
      <Text as="span">{claimBasisWords(basis)}</Text>
    </HStack>
  );
}

/**
 * Once beneath the claims, when any holds on supplier statements: the ingredients it rests on and
 * why each, so the same names are not repeated beside every claim.
 */
export function ClaimBasisLeaves({ basis }: { basis: ClaimBasis }) {
  if (basis.statementOnly.length === 0) return null;
  return (
    <HStack as="p" gap="1.5" align="flex-start" textStyle="sm" m="0" data-testid="claim-basis-leaves">
      <Box as="span" pt="0.2em">
        <ClaimBasisMark backed={false} />
      </Box>
      <Text as="span">{`Resting on a supplier statement alone: ${statementOnlyList(basis)}.`}</Text>
    </HStack>
  );
}
