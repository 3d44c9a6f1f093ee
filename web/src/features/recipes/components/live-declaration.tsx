import { Alert, Badge, Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { Claim, PreviewDeclaration } from '@crumbproof/shared';
import { useId } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { ItemLookup } from '@/components/ui/layer-path';
import { Loading } from '@/components/ui/loading';
import { DeclarationPanel } from './declaration-panel';
import { NutritionPanel } from './nutrition-panel';
import { wantedClaimNotices } from './wanted-claims';

interface LiveDeclarationProps {
  declaration: PreviewDeclaration | undefined;
  /** The preview request is running (typing paused, answer not back yet). */
  computing: boolean;
  /** The form has changes that are not saved. */
  unsaved: boolean;
  /** Why there is no preview yet (the form is incomplete), or null. */
  incomplete: string | null;
  /** The API refused to declare the recipe as edited. */
  error: string | null;
  wantedClaims: readonly Claim[];
  /** The recipe is for sale (only then does it make claims of its own). */
  forSale: boolean;
  lookup: ItemLookup;
}

/** The declaration of the recipe as edited, before anything is saved: beside the form, or in the drawer its summary opens on narrow screens. */
export function LiveDeclaration({
  declaration,
  computing,
  unsaved,
  incomplete,
  error,
  wantedClaims,
  forSale,
  lookup,
}: LiveDeclarationProps) {
  const headingId = useId();
  const notices = declaration && !error && !incomplete ? wantedClaimNotices(wantedClaims, declaration, lookup) : [];
  return (
    <Box as="section" aria-labelledby={headingId} minW="0">
      <Stack gap="3">
        <Stack direction="row" justify="space-between" align="center" gap="3" wrap="wrap">
          <Heading as="h2" size="lg" id={headingId}>
            Live declaration
          </Heading>
          <Badge size="lg" variant={unsaved ? 'solid' : 'outline'} colorPalette="accent">
            {unsaved ? 'Not saved yet' : 'As saved'}
          </Badge>
        </Stack>
        <Text color="fg.muted" textStyle="sm" role="status" aria-live="polite">
          {computing
            ? 'Computing the declaration…'
            : unsaved
              ? 'What the label would say if you saved now.'
              : 'What the saved recipe declares.'}
        </Text>
        {notices.length > 0 ? (
          <Alert.Root
            role="alert"
            status="warning"
            bg="bg.panel"
            color="fg"
            borderWidth="2px"
            borderColor="border.emphasized"
            borderStartWidth="6px"
          >
            <Alert.Content>
              <Alert.Title fontWeight="bold">A claim you want does not hold</Alert.Title>
              <Alert.Description>
                <Box as="ul" ps="5" m="0">
                  {notices.map((notice) => (
                    <li key={notice}>{notice}</li>
                  ))}
                </Box>
              </Alert.Description>
            </Alert.Content>
          </Alert.Root>
        ) : null}
        {error ? <ErrorAlert title="This recipe cannot be declared as it stands">{error}</ErrorAlert> : null}
        {incomplete && !error ? <Text>{incomplete}</Text> : null}
        {declaration ? (
          <Box opacity={computing || error || incomplete ? 0.55 : 1} aria-busy={computing || undefined}>
            <Stack gap="4">
              <DeclarationPanel
                declaration={declaration}
                lookup={lookup}
                level="h3"
                wanted={forSale ? wantedClaims : undefined}
                claimBasis={declaration.claimBasis}
              />
              <NutritionPanel nutrition={declaration.nutrition} level="h3" />
            </Stack>
          </Box>
        ) : !incomplete && !error ? (
          <Loading>Computing the declaration…</Loading>
        ) : null}
      </Stack>
    </Box>
  );
}
