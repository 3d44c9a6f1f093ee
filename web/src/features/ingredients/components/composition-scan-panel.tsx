import { Box, Stack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, SOURCE_LABELS, type CompositionTerms, type SourceEntry, type TermHit } from '@crumbproof/shared';
import type { ReactNode } from 'react';
import { Loading } from '@/components/ui/loading';
import { Panel } from '@/components/ui/panel';
import { TitledList } from '@/components/ui/titled-list';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useCompositionScan } from '../api/scan-composition';

type HitKind = 'allergen' | 'precautionary' | 'animal' | 'vague';

interface Segment {
  text: string;
  kinds: Set<HitKind>;
}

/** Cuts the text at every hit's start and end, so overlapping hits (whey: milk and animal) both show. */
export function segmentText(text: string, scan: CompositionTerms): Segment[] {
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
  const debouncedText = useDebouncedValue(text, 400);
  const debouncedContains = useDebouncedValue(contains, 400);
  const scan = useCompositionScan({ text: debouncedText, ...(debouncedContains !== undefined ? { contains: debouncedContains } : {}) });

  if (debouncedText.trim() === '' && text.trim() === '') return null;

  const data = scan.data;
  // Highlight against the text the scan was made for, so offsets match.
  const scannedText = debouncedText;

  return (
    <Panel
      title="Found in the composition"
      level="h3"
      size="sm"
      aside={scan.isFetching || text !== debouncedText ? <Loading size="xs">Checking…</Loading> : null}
    >
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
              <TitledList
                title="Differences from the supplier’s allergen list"
                items={data.discrepancies}
                itemKey={(item, index) => `${item.source}-${item.term}-${index}`}
              >
                {(item) => item.message}
              </TitledList>
            </Box>
          ) : null}
          <ScanLists scan={data} />
        </>
      ) : null}
    </Panel>
  );
}

function ScanLists({ scan }: { scan: CompositionTerms }) {
  const empty = scan.allergens.length + scan.precautionary.length + scan.animal.length + scan.vague.length === 0;
  if (empty) return <Text color="fg.muted">No allergen, animal-derived or vague terms found.</Text>;
  const at = (hit: TermHit, index: number) => `${hit.start}-${index}`;
  return (
    <Stack gap="2" textStyle="sm">
      <TitledList title="Allergen sources named" items={scan.allergens} itemKey={at}>
        {(hit) => (
          <>
            <strong>{hit.matched}</strong> — {SOURCE_LABELS[hit.source]}
            {hit.species ? ` (${hit.species})` : ''}
          </>
        )}
      </TitledList>
      <TitledList title="Named in a may-contain clause" items={scan.precautionary} itemKey={at}>
        {(hit) => (
          <>
            <strong>{hit.matched}</strong> — may contain {SOURCE_LABELS[hit.source]}
          </>
        )}
      </TitledList>
      <TitledList title="Animal-derived" items={scan.animal} itemKey={at}>
        {(hit) => (
          <>
            {hit.matched}
            {hit.fails.length > 0 ? ` — not ${listDiets(hit.fails)}` : ''}
            {hit.unverified.length > 0 ? ` — ${listDiets(hit.unverified)} not verified` : ''}
          </>
        )}
      </TitledList>
      <TitledList title="Vague terms" items={scan.vague} itemKey={at}>
        {(hit) => (
          <>
            “{hit.matched}”: {hit.message}
            {hit.unverifies.length > 0 ? ` (cannot verify: ${hit.unverifies.map((claim) => CLAIM_LABELS[claim]).join(', ')})` : ''}
          </>
        )}
      </TitledList>
    </Stack>
  );
}
