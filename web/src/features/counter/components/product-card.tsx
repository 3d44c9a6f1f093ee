import { Box, Button, CloseButton, Collapsible, Dialog, Heading, Portal, Stack, Text } from '@chakra-ui/react';
import {
  CLAIMS,
  COUNTER_CAUTION,
  readAloud,
  SOURCE_LABELS,
  type CounterQuestionView,
  type CounterRules,
  type CustomerVerdict,
  type ServedDeclaration,
} from '@crumbproof/shared';
import { motion, useReducedMotion } from 'framer-motion';
import { useMemo, useState } from 'react';
import { ClaimBasisMark, claimBasisWords, statementOnlyList } from '@/components/ui/claim-basis';
import { buildItemLookup } from '@/components/ui/item-lookup';
import { LayerPath, LayerPathLinks, morePathsText } from '@/components/ui/layer-path';
import { formatDateTime } from '@/lib/format';
import { useCounterQuestions } from '../api/questions';
import { listed, type LookupRow } from '../utils/lookup';
import { ApprovalFlag } from './approval-flag';
import { AskKitchenForm } from './ask-kitchen-form';
import { VerdictLine } from './verdict-line';

interface ProductCardProps {
  row: LookupRow | null;
  rules: CounterRules;
  avoid: readonly string[];
  avoidLabels: readonly string[];
  onClose: () => void;
}

const canSpeak = () => typeof window !== 'undefined' && 'speechSynthesis' in window && typeof SpeechSynthesisUtterance !== 'undefined';

/** Reads the sentences out through the browser's own voice, where it has one. */
function ReadOutButton({ sentences }: { sentences: readonly string[] }) {
  if (!canSpeak()) return null;
  return (
    <Button
      variant="outline"
      minH="12"
      fontSize="lg"
      alignSelf="flex-start"
      onClick={() => {
        window.speechSynthesis.cancel();
        window.speechSynthesis.speak(new SpeechSynthesisUtterance(sentences.join(' ')));
      }}
    >
      Read it out
    </Button>
  );
}

function QuestionItem({ question, labelOf }: { question: CounterQuestionView; labelOf: (code: string) => string }) {
  return (
    <Box as="li" borderWidth="1px" borderColor="border.muted" rounded="md" p="3" bg="bg.canvas">
      <Text fontSize="md" color="fg.muted">
        Asked by {question.askedBy}, {formatDateTime(question.askedAt)}, for a customer avoiding {listed(question.avoid.map(labelOf))}
      </Text>
      {question.note ? <Text fontSize="lg">“{question.note}”</Text> : null}
      {question.answer ? (
        <Text fontSize="lg" mt="1">
          <Text as="strong">
            The kitchen ({question.answer.by}, {formatDateTime(question.answer.at)}):
          </Text>{' '}
          {question.answer.text}
        </Text>
      ) : (
        <Text fontSize="lg" fontStyle="italic" mt="1">
          Waiting for the kitchen’s answer.
        </Text>
      )}
    </Box>
  );
}

function EarlierQuestions({ product, rules }: { product: string; rules: CounterRules }) {
  const questions = useCounterQuestions();
  const about = (questions.data ?? []).filter((q) => q.product === product);
  const labelOf = (code: string) => rules.groups.find((g) => g.code === code)?.label ?? code;
  if (questions.isError) return <Text color="fg.error">The questions about this product could not be read: {questions.error.message}</Text>;
  if (about.length === 0) return null;
  return (
    <Stack gap="2">
      <Heading as="h3" fontSize="xl">
        Asked of the kitchen
      </Heading>
      <Stack as="ul" gap="2" listStyleType="none" m="0" p="0">
        {about.map((q) => (
          <QuestionItem key={q.id} question={q} labelOf={labelOf} />
        ))}
      </Stack>
    </Stack>
  );
}

const noLinks = () => false;

/**
 * What the claims that hold stand on: how many ingredients they were checked against, and which
 * rest on a supplier statement alone, so the counter can say so before a customer relies on them.
 */
function ClaimsStandOn({ declaration }: { declaration: ServedDeclaration }) {
  const basis = declaration.claimBasis;
  if (!basis || !CLAIMS.some((claim) => declaration.claims[claim]?.status === 'ok')) return null;
  const backed = basis.statementOnly.length === 0;
  return (
    <Stack gap="1" data-testid="counter-claim-basis">
      <Heading as="h3" fontSize="xl">
        What the claims stand on
      </Heading>
      <Box display="flex" gap="2" alignItems="flex-start" fontSize="lg">
        <Box as="span" pt="0.2em">
          <ClaimBasisMark backed={backed} />
        </Box>
        <Text as="span">{claimBasisWords(basis)}</Text>
      </Box>
      {backed ? null : <Text fontSize="lg">{`Resting on a supplier statement alone: ${statementOnlyList(basis)}.`}</Text>}
    </Stack>
  );
}

/**
 * Where each avoided allergen it contains comes from, as layer paths (product on top, the
 * ingredient at the bottom). Plain bars: the counter stays on the one question.
 */
function WhereFrom({ verdict, declaration }: { verdict: CustomerVerdict; declaration: ServedDeclaration }) {
  const lookup = useMemo(() => buildItemLookup({ declarations: [declaration] }), [declaration]);
  if (verdict.contains.length === 0) return null;
  return (
    <Stack gap="2">
      <Heading as="h3" fontSize="xl">
        Where it comes from
      </Heading>
      <LayerPathLinks canOpen={noLinks}>
        <Stack gap="3">
          {verdict.contains.map((c) => (
            <Stack key={`${c.avoid}-${c.allergen}`} gap="1">
              <Text fontSize="lg">
                <Text as="strong">{c.sources.map((s) => SOURCE_LABELS[s]).join(', ')}</Text>
              </Text>
              <Box display="flex" flexWrap="wrap" gap="3">
                {c.via.map((path) => (
                  <Box key={path.join('/')} minW="10rem" maxW="18rem">
                    <LayerPath path={path} lookup={lookup} />
                  </Box>
                ))}
              </Box>
              {c.viaMore ? (
                <Text color="fg.muted" textStyle="sm">
                  {morePathsText(c.viaMore, declaration.name)}
                </Text>
              ) : null}
            </Stack>
          ))}
        </Stack>
      </LayerPathLinks>
    </Stack>
  );
}

/**
 * One product at the counter: the answer in one sentence, the declaration in sentences to read
 * out, the caution, asking the kitchen, and the ingredient list kept folded under "More detail".
 */
export function ProductCard({ row, rules, avoid, avoidLabels, onClose }: ProductCardProps) {
  const [asking, setAsking] = useState(false);
  // Asked for less motion: the card is simply there (framer-motion would still fade it).
  const reduceMotion = useReducedMotion();
  const declaration = row?.product.declaration;
  const said = useMemo(() => (declaration ? readAloud(declaration, rules) : null), [declaration, rules]);
  const close = () => {
    setAsking(false);
    onClose();
  };

  return (
    <Dialog.Root
      open={row !== null}
      onOpenChange={(e) => (e.open ? undefined : close())}
      size={{ base: 'full', md: 'lg' }}
      scrollBehavior="inside"
    >
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content asChild bg="bg.panel" color="fg">
            <motion.div
              initial={reduceMotion ? false : { opacity: 0, y: 16 }}
              animate={{ opacity: 1, y: 0 }}
              transition={{ duration: reduceMotion ? 0 : 0.18 }}
            >
              {row && said && declaration ? (
                <>
                  <Dialog.Header>
                    <Dialog.Title fontSize="2xl">{asking ? `Ask the kitchen about ${row.product.name}` : row.product.name}</Dialog.Title>
                  </Dialog.Header>
                  <Dialog.Body>
                    {asking ? (
                      <AskKitchenForm product={row.product} avoid={avoid} avoidLabels={avoidLabels} onDone={() => setAsking(false)} />
                    ) : (
                      <Stack gap="5">
                        <Stack gap="1" aria-label="The answer" role="group">
                          {row.verdict ? <VerdictLine verdict={row.verdict.verdict} size="lg" /> : null}
                          <Text fontSize="xl">{row.verdict ? `${row.reason}.` : said.contains}</Text>
                          {row.verdict && avoidLabels.length > 0 ? (
                            <Text fontSize="md" color="fg.muted">
                              For a customer avoiding {listed([...avoidLabels])}.
                            </Text>
                          ) : null}
                          <ApprovalFlag approval={row.product.approval} size="lg" />
                        </Stack>

                        {row.verdict ? <WhereFrom verdict={row.verdict} declaration={declaration} /> : null}

                        <Text
                          role="note"
                          aria-label="Caution"
                          fontSize="lg"
                          fontWeight="bold"
                          borderStartWidth="6px"
                          borderColor="accent.solid"
                          bg="accent.subtle"
                          px="4"
                          py="3"
                          rounded="sm"
                        >
                          {COUNTER_CAUTION}
                        </Text>

                        <Stack gap="2">
                          <Heading as="h3" fontSize="xl">
                            To read out
                          </Heading>
                          <Stack as="ul" gap="2" ps="6" m="0" fontSize="lg" listStyleType="disc">
                            {[said.contains, ...said.mayContain, ...said.notKnown, ...said.claims, ...said.notes].map((sentence) => (
                              <li key={sentence}>{sentence}</li>
                            ))}
                          </Stack>
                          <ReadOutButton sentences={said.sentences} />
                        </Stack>

                        <ClaimsStandOn declaration={declaration} />

                        <Button minH="12" fontSize="xl" alignSelf="flex-start" onClick={() => setAsking(true)}>
                          Ask the kitchen
                        </Button>

                        <EarlierQuestions product={row.product.id} rules={rules} />

                        <Collapsible.Root>
                          <Collapsible.Trigger asChild>
                            <Button variant="outline" minH="12" fontSize="lg">
                              More detail
                            </Button>
                          </Collapsible.Trigger>
                          <Collapsible.Content>
                            <Stack gap="2" pt="3">
                              <Heading as="h3" fontSize="lg">
                                Ingredients as printed
                              </Heading>
                              <Text fontSize="lg">
                                {declaration.ingredientsSegments.map((segment, index) =>
                                  segment.emphasis ? <strong key={index}>{segment.text}</strong> : <span key={index}>{segment.text}</span>,
                                )}
                              </Text>
                              {declaration.mayContainText ? <Text fontSize="lg">{declaration.mayContainText}</Text> : null}
                              <Text fontSize="md" color="fg.muted">
                                Worked out {formatDateTime(declaration.basis.computedAt)} under the kitchen’s regime ({declaration.regime}).
                              </Text>
                            </Stack>
                          </Collapsible.Content>
                        </Collapsible.Root>
                      </Stack>
                    )}
                  </Dialog.Body>
                  <Dialog.CloseTrigger asChild>
                    <CloseButton size="lg" minW="12" minH="12" aria-label="Close the card" />
                  </Dialog.CloseTrigger>
                </>
              ) : null}
            </motion.div>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
