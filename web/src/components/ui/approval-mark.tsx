import { Box, HStack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

/**
 * Where a product's declaration stands against its approval, as a counter card or the Approvals
 * page shows it: words first, then a diamond of its own (no allergen mark is a diamond), so it is
 * never read as contains, may contain or not known. Colour never carries it alone.
 */
export type ApprovalFlag = 'adds-allergen' | 'waiting' | 'not-yet-approved';

export const APPROVAL_FLAG_WORDS: Record<ApprovalFlag, string> = {
  'adds-allergen': 'Adds an allergen',
  waiting: 'Waiting for approval',
  'not-yet-approved': 'Not yet approved',
};

const diamond = {
  display: 'inline-block',
  flexShrink: 0,
  width: '0.7em',
  height: '0.7em',
  marginInline: '0.1em',
  transform: 'rotate(45deg)',
  borderColor: 'mark.ink',
  borderWidth: '2px',
} as const;

/** Solid diamond: the change adds an allergen; outlined: waiting; dashed outline: never approved. Decoration: the words say it. */
export function ApprovalMarkShape({ flag }: { flag: ApprovalFlag }) {
  switch (flag) {
    case 'adds-allergen':
      return <Box aria-hidden="true" data-mark="diamond-solid" {...diamond} bg="mark.ink" />;
    case 'waiting':
      return <Box aria-hidden="true" data-mark="diamond" {...diamond} />;
    case 'not-yet-approved':
      return <Box aria-hidden="true" data-mark="diamond-dashed" {...diamond} borderStyle="dashed" />;
  }
}

export function ApprovalMark({ flag, children }: { flag: ApprovalFlag; children?: ReactNode }) {
  return (
    <HStack as="span" display="inline-flex" flexWrap="wrap" gap="1.5" align="center" color="fg">
      <ApprovalMarkShape flag={flag} />
      <Text as="span" fontWeight="bold" whiteSpace="nowrap">
        {APPROVAL_FLAG_WORDS[flag]}
      </Text>
      {children ? <Text as="span">{children}</Text> : null}
    </HStack>
  );
}
