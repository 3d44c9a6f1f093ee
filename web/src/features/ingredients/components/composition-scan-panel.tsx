import { Box, Heading, HStack, Spinner, Stack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, SOURCE_LABELS, type SourceEntry } from '@crumbproof/shared';
import { useId, type ReactNode } from 'react';
import { useCompositionScan } from '../api/scan-composition';
import type { CompositionScan } from '../api/types';
import { useDebouncedValue } from '../hooks/use-debounced-value';

type HitKind = 'allergen' | 'precautionary' | 'animal' | 'vague';

interface Segment {
  text: string;
  kinds: Set<HitKind>;
}

/** Cuts the text at every hit's start and end, so overlapping hits (whey: milk and animal) both show. */
export function segmentText(text: string, scan: CompositionScan): Segment[] {
  const hits: { start: number; end: number; kind: HitKind }[] = [
    ...scan.allergens.map((hit) => ({ ...hit, kind: 'allergen' as const })),
    ...scan.precautionary.map((hit) => ({ ...hit, kind: 'precautionary' as const })),
    ...scan.animal.map((hit) => ({ ...hit, kind: 'animal' as const })),
    ...scan.vague.map((hit) => ({ ...hit, kind: 'vague' as const })),
  ].filter((hit) => hit.start >= 0 && hit.end <= text.length && hit.start < hit.end);
  const cuts = [...new Set([0, text.length, ...hits.flatMap((hit) => [hit.start, hit.end])])].sort((a, b) => a - b);
  const segments: Segment[] = [];
  for (let index = 0; index < cuts.length - 1; index += 1) {
    const start = cuts[index] as number;
    const end = cuts[index + 1] as number;
    const kinds = new Set(hits.filter((hit) => hit.start <= start && end <= hit.end).map((hit) => hit.kind));
    segments.push({ text: text.slice(start, end), kinds });
  }
  return segments;
}

function Highlighted({ segment }: { segment: Segment }) {
  let node: ReactNode = segment.text;
  const { kinds } = segment;
  if (kinds.size === 0) return <>{node}</>;
  if (kinds.has('allergen') || kinds.has('precautionary')) {
    node = (
      <Text as="strong" fontWeight="bold" data-kind={kinds.has('allergen') ? 'allergen' : 'precautionary'}>
        {node}
      </Text>
    );
  }
  const underline = kinds.has('animal') ? 'solid' : kinds.has('vague') ? 'dotted' : undefined;
  return (
    <Text
      as="span"
      data-kinds={[...kinds].join(' ')}
      textDecorationLine={underline ? 'underline' : undefined}
      textDecorationStyle={underline}
      textDecorationThickness="2px"
      textUnderlineOffset="3px"
      bg={kinds.has('vague') ? 'accent.subtle' : undefined}
    >
      {node}
    </Text>
  );
}

function listDiets(diets: readonly string[]): string {
  return diets.join(' or ');
}

interface CompositionScanPanelProps {
  text: string;
  contains: SourceEntry[] | undefined;
}

/** What the rules engine finds in the composition text, as the chef types (a beat behind). */
export function CompositionScanPanel({ text, contains }: CompositionScanPanelProps) {
  const headingId = useId();
  const debouncedText = useDebouncedValue(text, 400);
  const debouncedContains = useDebouncedValue(contains, 400);
  const scan = useCompositionScan({ text: debouncedText, ...(debouncedContains !== undefined ? { contains: debouncedContains } : {}) });

  if (debouncedText.trim() === '' && text.trim() === '') return null;

  const data = scan.data;
  // Highlight against the text the scan was made for, so offsets match.
  const scannedText = debouncedText;

  return (
    <Box as="section" aria-labelledby={headingId} borderWidth="1px" borderColor="border.muted" rounded="md" p="3" bg="bg.panel">
      <Stack gap="3">
        <HStack justify="space-between" gap="2">
          <Heading as="h3" size="sm" id={headingId}>
            Found in the composition
          </Heading>
          <Box role="status" aria-live="polite" color="fg.muted" textStyle="sm">
            {scan.isFetching || text !== debouncedText ? (
              <HStack gap="1.5">
                <Spinner size="xs" color="accent.solid" />
                <span>Checking…</span>
              </HStack>
            ) : null}
          </Box>
        </HStack>
        {scan.isError ? (
          <Text color="fg.error">The composition could not be checked: {scan.error.message}</Text>
        ) : data ? (
          <>
            <Text data-testid="composition-highlight" whiteSpace="pre-wrap" lineHeight="1.8">
              {segmentText(scannedText, data).map((segment, index) => (
                <Highlighted key={index} segment={segment} />
              ))}
            </Text>
            <Text textStyle="xs" color="fg.muted">
              Bold: names an allergen source. Underlined: animal-derived. Dotted and shaded: vague, check with the supplier.
            </Text>
            {data.discrepancies.length > 0 ? (
              <Box borderStartWidth="4px" borderColor="accent.solid" ps="3">
                <Text fontWeight="bold">Differences from the supplier’s allergen list</Text>
                <Box as="ul" ps="5" m="0">
                  {data.discrepancies.map((item, index) => (
                    <li key={`${item.source}-${item.term}-${index}`}>{item.message}</li>
                  ))}
                </Box>
              </Box>
            ) : null}
            <ScanLists scan={data} />
          </>
        ) : null}
      </Stack>
    </Box>
  );
}

function ScanLists({ scan }: { scan: CompositionScan }) {
  const empty = scan.allergens.length + scan.precautionary.length + scan.animal.length + scan.vague.length === 0;
  if (empty) return <Text color="fg.muted">No allergen, animal-derived or vague terms found.</Text>;
  return (
    <Stack gap="2" textStyle="sm">
      {scan.allergens.length > 0 ? (
        <Box>
          <Text fontWeight="bold">Allergen sources named</Text>
          <Box as="ul" ps="5" m="0">
            {scan.allergens.map((hit, index) => (
              <li key={`a-${hit.start}-${index}`}>
                <strong>{hit.matched}</strong> — {SOURCE_LABELS[hit.source]}
                {hit.species ? ` (${hit.species})` : ''}
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
      {scan.precautionary.length > 0 ? (
        <Box>
          <Text fontWeight="bold">Named in a may-contain clause</Text>
          <Box as="ul" ps="5" m="0">
            {scan.precautionary.map((hit, index) => (
              <li key={`p-${hit.start}-${index}`}>
                <strong>{hit.matched}</strong> — may contain {SOURCE_LABELS[hit.source]}
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
      {scan.animal.length > 0 ? (
        <Box>
          <Text fontWeight="bold">Animal-derived</Text>
          <Box as="ul" ps="5" m="0">
            {scan.animal.map((hit, index) => (
              <li key={`n-${hit.start}-${index}`}>
                {hit.matched}
                {hit.fails.length > 0 ? ` — not ${listDiets(hit.fails)}` : ''}
                {hit.unverified.length > 0 ? ` — ${listDiets(hit.unverified)} not verified` : ''}
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
      {scan.vague.length > 0 ? (
        <Box>
          <Text fontWeight="bold">Vague terms</Text>
          <Box as="ul" ps="5" m="0">
            {scan.vague.map((hit, index) => (
              <li key={`v-${hit.start}-${index}`}>
                “{hit.matched}”: {hit.message}
                {hit.unverifies.length > 0 ? ` (cannot verify: ${hit.unverifies.map((claim) => CLAIM_LABELS[claim]).join(', ')})` : ''}
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
    </Stack>
  );
}
