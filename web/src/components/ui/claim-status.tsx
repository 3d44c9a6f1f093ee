import { Box, HStack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, type Claim, type ClaimStatus } from '@crumbproof/shared';

export const CLAIM_STATUS_WORDS: Record<ClaimStatus, string> = {
  ok: 'Holds',
  fails: 'Fails',
  unverified: 'Not verified',
};

/** The shape says it before the colour does: a tick, a cross, a dashed question. */
export function ClaimMark({ status }: { status: ClaimStatus }) {
  const color = status === 'ok' ? 'accent.fg' : status === 'fails' ? 'fg.error' : 'fg.muted';
  return (
    <Box
      as="span"
      aria-hidden="true"
      data-claim-mark={status}
      display="inline-flex"
      flexShrink={0}
      color={color}
      css={{ '& .glyph': { stroke: 'bg.panel' } }}
    >
      <svg width="1em" height="1em" viewBox="0 0 16 16" focusable="false">
        {status === 'ok' ? (
          <>
            <circle cx="8" cy="8" r="7" fill="currentColor" />
            <path d="M4.5 8.3l2.3 2.3 4.7-5" fill="none" className="glyph" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
          </>
        ) : status === 'fails' ? (
          <>
            <rect x="1" y="1" width="14" height="14" rx="2" fill="currentColor" />
            <path d="M5 5l6 6M11 5l-6 6" className="glyph" strokeWidth="2" strokeLinecap="round" />
          </>
        ) : (
          <>
            <circle cx="8" cy="8" r="6.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="2.5 1.8" />
            <path
              d="M6.3 6.3a1.8 1.8 0 1 1 2.4 1.7c-.5.2-.7.6-.7 1.1"
              fill="none"
              stroke="currentColor"
              strokeWidth="1.5"
              strokeLinecap="round"
            />
            <circle cx="8" cy="11.4" r="0.9" fill="currentColor" />
          </>
        )}
      </svg>
    </Box>
  );
}

interface ClaimStatusLineProps {
  claim: Claim;
  status: ClaimStatus;
  /** Said in place of the status words, e.g. "Holds on supplier statements". */
  words?: string;
}

/** "Vegan: Fails", as one run of text with the mark before it. */
export function ClaimStatusLine({ claim, status, words }: ClaimStatusLineProps) {
  return (
    <HStack as="span" display="inline-flex" gap="1.5" align="center">
      <ClaimMark status={status} />
      <Text as="span" fontWeight="bold">{`${CLAIM_LABELS[claim]}: ${words ?? CLAIM_STATUS_WORDS[status]}`}</Text>
    </HStack>
  );
}
