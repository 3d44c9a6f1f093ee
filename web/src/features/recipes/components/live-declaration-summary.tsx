import { Box, Button, CloseButton, Drawer, HStack, Portal, Stack, Text } from '@chakra-ui/react';
import { CLAIM_LABELS, CLAIMS, type Claim, type ClaimStatus, type ProductDeclaration } from '@crumbproof/shared';
import { useId, type ReactNode } from 'react';
import { CLAIM_STATUS_WORDS, ClaimMark } from '@/components/ui/claim-status';
import { Mark } from '@/components/ui/status-mark';

interface LiveDeclarationSummaryProps {
  declaration: ProductDeclaration | undefined;
  /** The preview request is running or typing has not paused yet. */
  computing: boolean;
  unsaved: boolean;
  /** Why the declaration is not up to date (the form is incomplete, or the API refused it), or null. */
  problem: string | null;
  /** The claims the kitchen wants; the summary says how each stands, or counts them all when none is wanted. */
  wantedClaims: readonly Claim[];
  /** The full live declaration, shown in the drawer the summary opens. */
  children: ReactNode;
}

const CLAIM_ORDER: readonly ClaimStatus[] = ['fails', 'unverified', 'ok'];

/** "2 hold, 1 fails": how many claims stand each way, worst first. */
export function claimCounts(declaration: ProductDeclaration): string {
  const statuses = CLAIMS.filter((claim) => declaration.claims[claim]).map((claim) => declaration.claims[claim].status);
  if (statuses.length === 0) return 'None checked';
  return CLAIM_ORDER.filter((status) => statuses.includes(status))
    .map((status) => `${statuses.filter((s) => s === status).length} ${CLAIM_STATUS_WORDS[status].toLowerCase()}`)
    .join(', ');
}

/** How many notices the declaration carries: warnings, and the errors that stop its labels. */
export function noticeCount(declaration: ProductDeclaration): string {
  const warnings = declaration.warnings.length;
  const errors = declaration.errors.length;
  const parts = [`${warnings} ${warnings === 1 ? 'warning' : 'warnings'}`];
  if (errors > 0) parts.push(`${errors} ${errors === 1 ? 'error stops' : 'errors stop'} the labels`);
  return parts.join('; ');
}

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <HStack as="div" gap="2" align="baseline" wrap="wrap" minW="0">
      <Text as="dt" fontWeight="bold" flexShrink={0}>
        {`${term}:`}
      </Text>
      <Box as="dd" m="0" minW="0" display="flex" flexWrap="wrap" columnGap="3" rowGap="1" alignItems="center">
        {children}
      </Box>
    </HStack>
  );
}

function Allergens({ labels, status }: { labels: readonly string[]; status: 'contains' | 'may-contain' }) {
  if (labels.length === 0) return <Text as="span">None recorded</Text>;
  return (
    <>
      {labels.map((label) => (
        <HStack as="span" key={label} display="inline-flex" gap="1.5" align="center">
          <Mark status={status} />
          <Text as="strong" fontWeight="bold">
            {label}
          </Text>
        </HStack>
      ))}
    </>
  );
}

/**
 * The live declaration in a few lines, kept in view at the top of the editor on narrow screens
 * (the side panel needs a wide one), with a button that opens the whole declaration in a drawer.
 */
export function LiveDeclarationSummary({ declaration, computing, unsaved, problem, wantedClaims, children }: LiveDeclarationSummaryProps) {
  const titleId = useId();
  const wanted = declaration ? wantedClaims.filter((claim) => declaration.claims[claim]) : [];
  return (
    <Box
      as="section"
      aria-labelledby={titleId}
      bg="bg.panel"
      borderWidth="1px"
      borderColor="border.emphasized"
      borderStartWidth="6px"
      borderStartColor="accent.solid"
      rounded="md"
      px="4"
      py="3"
      shadow="sm"
      minW="0"
    >
      <Stack gap="2">
        <HStack justify="space-between" gap="3" wrap="wrap">
          <Text id={titleId} fontWeight="bold" fontSize="lg">
            Live declaration summary
          </Text>
          <Text color="fg.muted" textStyle="sm" role="status" aria-live="polite">
            {computing ? 'Computing…' : problem ? 'Not up to date' : unsaved ? 'Not saved yet' : 'As saved'}
          </Text>
        </HStack>
        {problem ? <Text textStyle="sm">{problem}</Text> : null}
        {declaration ? (
          <Box as="dl" m="0" display="flex" flexDirection="column" gap="1" opacity={computing || problem ? 0.55 : 1}>
            <Row term="Contains">
              <Allergens labels={declaration.contains.map((group) => group.label)} status="contains" />
            </Row>
            <Row term="May contain">
              <Allergens labels={declaration.mayContain.map((group) => group.label)} status="may-contain" />
            </Row>
            {declaration.unknown.length > 0 ? (
              <Row term="Not known">
                <HStack as="span" display="inline-flex" gap="1.5" align="center">
                  <Mark status="not-known" />
                  <Text as="span">{`${declaration.unknown.length} ${declaration.unknown.length === 1 ? 'ingredient' : 'ingredients'}`}</Text>
                </HStack>
              </Row>
            ) : null}
            <Row term={wanted.length > 0 ? 'Claims you want' : 'Claims'}>
              {wanted.length > 0 ? (
                wanted.map((claim) => {
                  const status = declaration.claims[claim].status;
                  return (
                    <HStack as="span" key={claim} display="inline-flex" gap="1.5" align="center">
                      <ClaimMark status={status} />
                      <Text as="span">{`${CLAIM_LABELS[claim]}: ${CLAIM_STATUS_WORDS[status]}`}</Text>
                    </HStack>
                  );
                })
              ) : (
                <Text as="span">{claimCounts(declaration)}</Text>
              )}
            </Row>
            <Row term="Notices">
              <Text as="span">{noticeCount(declaration)}</Text>
            </Row>
          </Box>
        ) : null}
        <Drawer.Root placement="end" size="md" lazyMount unmountOnExit>
          <Drawer.Trigger asChild>
            <Button variant="outline" size="md" alignSelf="flex-start">
              Open the full declaration
            </Button>
          </Drawer.Trigger>
          <Portal>
            <Drawer.Backdrop />
            <Drawer.Positioner>
              <Drawer.Content bg="bg.canvas" color="fg">
                <Drawer.Header>
                  <Drawer.Title fontSize="xl">The declaration as edited</Drawer.Title>
                </Drawer.Header>
                <Drawer.Body>{children}</Drawer.Body>
                <Drawer.CloseTrigger asChild>
                  <CloseButton size="md" aria-label="Close the full declaration" />
                </Drawer.CloseTrigger>
              </Drawer.Content>
            </Drawer.Positioner>
          </Portal>
        </Drawer.Root>
      </Stack>
    </Box>
  );
}
