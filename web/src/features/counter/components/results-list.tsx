import { Box, chakra, Heading, Stack, Text } from '@chakra-ui/react';
import { LayoutGroup, motion, useReducedMotion } from 'framer-motion';
import { memo, useId } from 'react';
import type { LookupRow } from '../utils/lookup';
import { ApprovalFlag } from './approval-flag';
import { VerdictLine } from './verdict-line';

interface ResultsSectionProps {
  title: string;
  rows: readonly LookupRow[];
  onOpen: (productId: string) => void;
}

/** One section of results: each product a large row that opens its card. Rows move to their new place when the verdicts re-order them. */
function ResultsSection({ title, rows, onOpen }: ResultsSectionProps) {
  const headingId = useId();
  const reduceMotion = useReducedMotion();
  if (rows.length === 0) return null;
  return (
    <Box as="section" aria-labelledby={headingId}>
      <Heading as="h2" id={headingId} fontSize="xl" mb="2">
        {title}
      </Heading>
      <Stack as="ul" gap="2" listStyleType="none" m="0" p="0">
        {rows.map((row) => (
          <motion.li key={row.product.id} layout={reduceMotion ? false : 'position'} transition={{ duration: reduceMotion ? 0 : 0.2 }}>
            <chakra.button
              type="button"
              onClick={() => onOpen(row.product.id)}
              w="full"
              textAlign="start"
              bg="bg.panel"
              borderWidth="1px"
              borderColor="border.muted"
              borderStartWidth="4px"
              borderStartColor={row.verdict?.verdict === 'contains' ? 'fg' : 'border.muted'}
              rounded="md"
              px="4"
              py="3"
              minH="12"
              cursor="pointer"
              _hover={{ bg: 'bg.subtle' }}
              _focusVisible={{ outline: '3px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' }}
            >
              <Stack gap="1">
                <Text as="span" fontSize="xl" fontWeight="bold">
                  {row.product.name}
                </Text>
                {row.verdict ? <VerdictLine verdict={row.verdict.verdict} /> : null}
                <Text as="span" fontSize="lg" color="fg.muted">
                  {row.reason}
                </Text>
                <ApprovalFlag approval={row.product.approval} />
              </Stack>
            </chakra.button>
          </motion.li>
        ))}
      </Stack>
    </Box>
  );
}

interface ResultsListProps {
  onSale: readonly LookupRow[];
  rest: readonly LookupRow[];
  onOpen: (productId: string) => void;
}

/**
 * Products on sale today first, then the rest of the products for sale. Drawn again only when the
 * results change, so the rows move only when the verdicts re-order them (not when a banner above
 * them comes or goes).
 */
export const ResultsList = memo(function ResultsList({ onSale, rest, onOpen }: ResultsListProps) {
  return (
    <LayoutGroup>
      <Stack gap="6">
        <ResultsSection title="On sale today" rows={onSale} onOpen={onOpen} />
        <ResultsSection title="Not marked on sale today" rows={rest} onOpen={onOpen} />
      </Stack>
    </LayoutGroup>
  );
});
