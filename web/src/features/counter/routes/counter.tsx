import { Box, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { KITCHEN_WRITERS } from '@crumbproof/shared';
import { MotionConfig } from 'framer-motion';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router-dom';
import { useKitchenName } from '@/api/kitchen';
import { DeclaredFor } from '@/components/ui/declared-for';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useCounterProducts } from '../api/get-counter-products';
import { useOpenQuestionCount } from '../api/questions';
import { FreshnessBanner } from '../components/freshness-banner';
import { LookUpView } from '../components/look-up-view';
import { OnSalePanel } from '../components/on-sale-panel';
import { QuestionsPanel } from '../components/questions-panel';
import { useCounterFreshness } from '../hooks/use-counter-freshness';
import { EMPTY_ASK, type CounterAsk } from '../utils/lookup';

/** The counter's three views, each at its own address. */
export const COUNTER_VIEWS = [
  { segment: '', path: '/counter', label: 'Look up' },
  { segment: 'questions', path: '/counter/questions', label: 'Questions' },
  { segment: 'on-sale', path: '/counter/on-sale', label: 'On sale' },
] as const;

/** Where the allergen chart is printed from: the Labels page with the chart template picked. */
export const CHART_PATH = '/labels?template=chart';

function ViewTabs({ current, openQuestions }: { current: string; openQuestions: number | undefined }) {
  return (
    <Box as="nav" aria-label="Counter views">
      <HStack as="ul" gap="0" listStyleType="none" m="0" p="1" bg="bg.subtle" rounded="lg" display="inline-flex" flexWrap="wrap">
        {COUNTER_VIEWS.map((view) => {
          const active = view.segment === current;
          const label = view.segment === 'questions' && openQuestions ? `${view.label} (${openQuestions} open)` : view.label;
          return (
            <li key={view.segment}>
              <Link
                asChild
                display="inline-flex"
                alignItems="center"
                minH="12"
                px="5"
                rounded="md"
                fontSize="xl"
                fontWeight={active ? 'bold' : 'normal'}
                bg={active ? 'accent.solid' : 'transparent'}
                color={active ? 'accent.contrast' : 'fg'}
                textDecoration="none"
                _hover={{ bg: active ? 'accent.hover' : 'bg.muted', textDecoration: 'none' }}
              >
                <RouterLink to={view.path} aria-current={active ? 'page' : undefined}>
                  {label}
                </RouterLink>
              </Link>
            </li>
          );
        })}
      </HStack>
    </Box>
  );
}

/** /counter, /counter/questions, /counter/on-sale — answering customers at the counter from the recorded recipes. */
export function CounterRoute() {
  const { view: segment = '' } = useParams();
  const me = useSignedInUser();
  const kitchenName = useKitchenName();
  const products = useCounterProducts();
  const freshness = useCounterFreshness();
  const openQuestions = useOpenQuestionCount();
  // Kept here so the customer's picks survive a look at the other views.
  const [ask, setAsk] = useState<CounterAsk>(EMPTY_ASK);
  const current = COUNTER_VIEWS.find((v) => v.segment === segment);

  const chart = KITCHEN_WRITERS.includes(me.role) ? (
    <Link asChild color="accent.fg" fontWeight="bold" fontSize="lg" minH="11" display="inline-flex" alignItems="center">
      <RouterLink to={CHART_PATH}>Print the allergen chart</RouterLink>
    </Link>
  ) : null;

  return (
    <MotionConfig reducedMotion="user">
      <Page
        title="Counter"
        lead={
          <>
            {/* Front of house working two counters sees at a glance which one this is. */}
            <DeclaredFor as="span" display="block" kitchen={kitchenName} regime={products.data?.regime} fontSize="xl" mb="1" />
            Answer a customer’s allergy question from the recorded recipes: pick what they avoid, then open the product.
          </>
        }
        actions={chart}
      >
        <Stack gap="4">
          <ViewTabs current={segment} openQuestions={openQuestions} />
          <FreshnessBanner state={freshness} computedAt={products.data?.computedAt} />
        </Stack>
        {!current ? (
          <Text fontSize="xl">The counter has no view called “{segment}”. Pick one of the views above.</Text>
        ) : products.isError && !products.data ? (
          <LoadFailed title="The counter’s products could not be read" error={products.error} onRetry={() => void products.refetch()} />
        ) : !products.data ? (
          <Loading>Reading every product’s declaration…</Loading>
        ) : current.segment === 'questions' ? (
          <QuestionsPanel rules={products.data.rules} />
        ) : current.segment === 'on-sale' ? (
          <OnSalePanel view={products.data} />
        ) : (
          <LookUpView view={products.data} ask={ask} onAskChange={setAsk} />
        )}
      </Page>
    </MotionConfig>
  );
}
