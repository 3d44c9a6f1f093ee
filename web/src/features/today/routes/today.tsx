import { Box, Link, Stack, Text } from '@chakra-ui/react';
import type { SpecificationReview } from '@crumbproof/shared';
import { Link as RouterLink } from 'react-router-dom';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { Panel } from '@/components/ui/panel';
import { formatDate } from '@/lib/format';
import { useReviewsDue } from '../api/get-reviews-due';

const days = (n: number) => `${n} day${n === 1 ? '' : 's'}`;

/** "review by 3 Dec 2026, 4 days overdue" / "review by 3 Dec 2026, in 4 days" / "…, today". */
function when(review: SpecificationReview): string {
  const by = `review by ${formatDate(review.reviewBy)}`;
  if (review.daysLeft < 0) return `${by}, ${days(-review.daysLeft)} overdue`;
  return review.daysLeft === 0 ? `${by}, today` : `${by}, in ${days(review.daysLeft)}`;
}

function ReviewList({ reviews, label, empty }: { reviews: SpecificationReview[]; label: string; empty: string }) {
  if (reviews.length === 0) return <Text>{empty}</Text>;
  return (
    <Box as="ul" ps="5" m="0" aria-label={label}>
      {reviews.map((review) => (
        <li key={review.ingredient}>
          <Link asChild color="accent.fg" fontWeight="bold">
            <RouterLink to={`/ingredients/${encodeURIComponent(review.ingredient)}`}>{review.name}</RouterLink>
          </Link>{' '}
          (specification version {review.version}): {when(review)}.
        </li>
      ))}
    </Box>
  );
}

/** /today — the manager's and the pastry chef's list of what needs doing today: supplier specifications to review. */
export function TodayRoute() {
  const reviews = useReviewsDue();
  if (reviews.isPending) return <Loading>Loading what is due…</Loading>;
  if (reviews.isError) {
    return (
      <Page title="Today">
        <LoadFailed title="What is due could not be loaded" error={reviews.error} onRetry={() => void reviews.refetch()} />
      </Page>
    );
  }
  const { today, withinDays, overdue, dueSoon } = reviews.data;
  return (
    <Page title="Today" lead={`What needs doing in the kitchen as of ${formatDate(today)}.`}>
      <Stack gap="4" maxW="4xl">
        <Panel title="Specifications overdue for review">
          <Text color="fg.muted">
            Their review-by date has passed. Nothing is blocked: every declaration that uses one of these ingredients carries a warning
            until a new specification is uploaded.
          </Text>
          <ReviewList reviews={overdue} label="Specifications overdue for review" empty="None: no specification is overdue for review." />
        </Panel>
        <Panel title={`Due within ${withinDays} days`}>
          <ReviewList
            reviews={dueSoon}
            label={`Specifications due within ${withinDays} days`}
            empty={`None: no specification is due for review in the next ${withinDays} days.`}
          />
        </Panel>
        <Text color="fg.muted">
          Ask the supplier for its current specification, check it against the ingredient, and upload it on the ingredient’s page with its
          next review-by date.
        </Text>
      </Stack>
    </Page>
  );
}
