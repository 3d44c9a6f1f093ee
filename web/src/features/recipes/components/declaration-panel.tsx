import { Box, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { CLAIMS, EXEMPT_FORM_LABELS, SOURCE_LABELS, type Claim, type ClaimBasis, type Declaration } from '@crumbproof/shared';
import { ClaimBasisLeaves, ClaimBasisLine, HOLDS_ON_STATEMENTS } from '@/components/ui/claim-basis';
import { ClaimReasonList } from '@/components/ui/claim-reasons';
import { ClaimStatusLine } from '@/components/ui/claim-status';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LayerPath, morePathsText, pathsCount, type ItemLookup } from '@/components/ui/layer-path';
import { Panel, type HeadingLevel } from '@/components/ui/panel';
import { QUID_KIND } from '@/components/ui/percent-kinds';
import { Quantity } from '@/components/ui/quantity';
import { StatusMark } from '@/components/ui/status-mark';
import { TitledList } from '@/components/ui/titled-list';
import { SulphiteSummary } from './sulphite-summary';

export const DECLARATION_CAUTION =
  'Computed from the recipes and supplier information recorded in Crumbproof. Check it against current supplier specifications before relying on it; local law and your kitchen’s food-safety system decide.';

interface DeclarationPanelProps {
  declaration: Declaration;
  lookup: ItemLookup;
  level?: HeadingLevel;
  /**
   * The claims the kitchen wants to make (the recipe's sale details). Shown beside each result so
   * that what the kitchen intends is never read as what the recipe supports; left out for a
   * sub-recipe.
   */
  wanted?: readonly Claim[];
  /** What a claim that holds stands on, as of today (served with the declaration, never kept). */
  claimBasis?: ClaimBasis;
}

/** The heading of the engine's claim results, worded apart from "Claims you want to make". */
export const CLAIMS_SUPPORTED_TITLE = 'What the recipe supports';

interface PathsProps {
  paths: readonly string[][];
  /** Paths the declaration left out of the list (Provenance.viaMore). */
  more?: number;
  productName: string;
  lookup: ItemLookup;
}

function Paths({ paths, more, productName, lookup }: PathsProps) {
  if (paths.length === 0) return null;
  const moreText = morePathsText(more, productName);
  return (
    <>
      <Box display="flex" flexWrap="wrap" gap="3" mt="2">
        {paths.map((path) => (
          <Box key={path.join('/')} minW="10rem" maxW="16rem">
            <LayerPath path={path} lookup={lookup} />
          </Box>
        ))}
      </Box>
      {moreText ? (
        <Text color="fg.muted" textStyle="sm" mt="1">
          {moreText}
        </Text>
      ) : null}
    </>
  );
}

/** "From contact with Butter (greasing, dusting)", naming each item that reaches the product by contact once. */
function contactWords(paths: readonly string[][], more: number | undefined, lookup: ItemLookup): string {
  const names = [...new Set(paths.map((path) => lookup(path.at(-1) ?? '')?.name ?? path.at(-1) ?? ''))];
  const others = more ? `, and by ${pathsCount(more, 'more')} through the same parts` : '';
  return `From contact with ${new Intl.ListFormat('en-GB').format(names)} (a contact line: greasing or dusting)${others}`;
}

/** A product's declaration as Crumbproof computed it, in the order a label reads. */
export function DeclarationPanel({ declaration, lookup, level = 'h2', wanted, claimBasis }: DeclarationPanelProps) {
  const { contains, mayContain, unknown, exempt, claims, warnings, errors } = declaration;
  return (
    <Stack gap="4">
      <Text borderStartWidth="4px" borderColor="accent.solid" bg="accent.subtle" px="3" py="2" rounded="sm" maxW="80ch">
        {DECLARATION_CAUTION}
      </Text>

      {errors.length > 0 ? (
        <ErrorAlert title="Labels cannot be printed until these are fixed">
          <Box as="ul" ps="5" m="0">
            {errors.map((error, index) => (
              <li key={`${error.code}-${index}`}>{error.message}</li>
            ))}
          </Box>
        </ErrorAlert>
      ) : null}

      <SimpleGrid minChildWidth="min(100%, 18rem)" gap="4" alignItems="start">
        <Panel title="Contains" level={level}>
          {contains.length === 0 ? (
            <StatusMark status="none-recorded">allergens</StatusMark>
          ) : (
            <Box as="ul" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="4">
              {contains.map((group) => (
                <Box as="li" key={group.allergen}>
                  <StatusMark status="contains">{group.label}</StatusMark>
                  <Text color="fg.muted" textStyle="sm">
                    {`From ${group.sources.map((source) => SOURCE_LABELS[source] ?? source).join(', ')}`}
                    {group.species && group.species.length > 0 ? ` (species: ${group.species.join(', ')})` : ''}
                  </Text>
                  {group.contactVia && group.contactVia.length > 0 ? (
                    <Text textStyle="sm" mt="1">
                      {`${contactWords(group.contactVia, group.contactViaMore, lookup)}: it is still in the food, so it is declared here, not as a may-contain.`}
                    </Text>
                  ) : null}
                  <Paths paths={group.via} more={group.viaMore} productName={declaration.name} lookup={lookup} />
                </Box>
              ))}
            </Box>
          )}
        </Panel>

        <Panel title="May contain" level={level}>
          {mayContain.length === 0 ? (
            <Text>No may-contain recorded.</Text>
          ) : (
            <Box as="ul" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="3">
              {mayContain.map((group) => (
                <Box as="li" key={group.allergen}>
                  <StatusMark status="may-contain">{group.label}</StatusMark>
                  <Box as="ul" ps="5" m="0" mt="1">
                    {group.why.map((why) => (
                      <li key={why}>{why}</li>
                    ))}
                  </Box>
                </Box>
              ))}
            </Box>
          )}
        </Panel>

        <Panel title="Not known" level={level}>
          {unknown.length === 0 ? (
            <Text>Every ingredient has an allergen statement recorded.</Text>
          ) : (
            <Box as="ul" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="3">
              {unknown.map((leaf) => (
                <Box as="li" key={leaf.ingredient}>
                  <StatusMark status="not-known">{leaf.name}</StatusMark>
                  <Text color="fg.muted" textStyle="sm">
                    {`${leaf.name} has no allergen statement, so nothing about it can be proved.`}
                  </Text>
                  <Paths paths={leaf.via} more={leaf.viaMore} productName={declaration.name} lookup={lookup} />
                </Box>
              ))}
            </Box>
          )}
          <TitledList
            title={`Exempt from declaration under ${declaration.regime}`}
            items={exempt}
            itemKey={(use) => `${use.ingredient}-${use.source}`}
          >
            {(use) =>
              `${use.name}: ${SOURCE_LABELS[use.source] ?? use.source} as ${EXEMPT_FORM_LABELS[use.form] ?? use.form} (${use.basis})`
            }
          </TitledList>
        </Panel>
      </SimpleGrid>

      <Panel title={CLAIMS_SUPPORTED_TITLE} level={level}>
        <Text color="fg.muted" textStyle="sm" maxW="80ch">
          {`Crumbproof's check of each claim against every ingredient in the recipe. ${
            wanted
              ? 'Whether the kitchen makes a claim is set under “Claims you want to make” in the sale details. Holding is not the same as wanting it.'
              : 'A sub-recipe makes no claim of its own.'
          }`}
        </Text>
        <SimpleGrid as="ul" listStyleType="none" m="0" p="0" minChildWidth="min(100%, 26rem)" columnGap="6" rowGap="3" alignItems="start">
          {CLAIMS.filter((claim) => claims[claim]).map((claim) => (
            <Box as="li" key={claim} data-claim={claim}>
              <ClaimStatusLine
                claim={claim}
                status={claims[claim].status}
                words={claims[claim].status === 'ok' && claimBasis && claimBasis.statementOnly.length > 0 ? HOLDS_ON_STATEMENTS : undefined}
              />
              {claims[claim].status === 'ok' && claimBasis ? <ClaimBasisLine basis={claimBasis} /> : null}
              {wanted ? (
                <Text color="fg.muted" textStyle="sm" data-testid="claim-wanted">
                  {wanted.includes(claim) ? 'You want to make this claim.' : 'Not among the claims you want to make.'}
                </Text>
              ) : null}
              {claims[claim].status !== 'ok' ? <ClaimReasonList reasons={claims[claim].reasons} lookup={lookup} /> : null}
            </Box>
          ))}
        </SimpleGrid>
        {claimBasis && CLAIMS.some((claim) => claims[claim]?.status === 'ok') ? <ClaimBasisLeaves basis={claimBasis} /> : null}
      </Panel>

      <Panel title="Ingredients as printed" level={level}>
        <Text maxW="80ch" data-testid="ingredients-text">
          {declaration.ingredientsSegments.map((segment, index) =>
            segment.emphasis ? (
              <Text as="strong" fontWeight="bold" key={index}>
                {segment.text}
              </Text>
            ) : (
              <span key={index}>{segment.text}</span>
            ),
          )}
        </Text>
        {declaration.mayContainText ? <Text fontWeight="bold">{declaration.mayContainText}</Text> : null}
        <TitledList title="Quantity of ingredients (QUID)" items={declaration.quid} itemKey={(entry) => entry.ingredient}>
          {(entry) => <Quantity>{entry.text}</Quantity>}
        </TitledList>
        {declaration.quid.length > 0 ? (
          <Text color="fg.muted" textStyle="sm" data-testid="quid-kind">
            {QUID_KIND}
          </Text>
        ) : null}
        <SulphiteSummary sulphites={declaration.sulphites} />
        <Text color="fg.muted" textStyle="sm">
          <Quantity>{`Finished weight ${declaration.finishedWeightG} g; mix ${declaration.mixWeightG} g${
            declaration.portionG ? `; portion ${declaration.portionG} g` : ''
          }.`}</Quantity>
        </Text>
        <TitledList title="Warnings" items={warnings} itemKey={(warning, index) => `${warning.code}-${index}`}>
          {(warning) => warning.message}
        </TitledList>
      </Panel>
    </Stack>
  );
}
