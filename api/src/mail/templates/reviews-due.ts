import type { SpecificationReview } from '@crumbproof/shared';
import { renderMail, type RenderedMail } from './layout';

const day = (iso: string) =>
  new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** "Butter (version 2): review by 3 December 2026, in 2 days." */
function line(r: SpecificationReview): string {
  const when =
    r.daysLeft < 0
      ? `${-r.daysLeft} day${r.daysLeft === -1 ? '' : 's'} overdue`
      : r.daysLeft === 0
        ? 'today'
        : `in ${r.daysLeft} day${r.daysLeft === 1 ? '' : 's'}`;
  return `${r.name} (version ${r.version}): review by ${day(r.reviewBy)}, ${when}.`;
}

/** The daily mail to the pastry chefs and managers: supplier specifications overdue for review and due soon. */
export function reviewsDueMail(m: {
  kitchen: string;
  today: string;
  withinDays: number;
  overdue: SpecificationReview[];
  dueSoon: SpecificationReview[];
}): RenderedMail {
  const counted = [
    m.overdue.length > 0 ? `${m.overdue.length} overdue` : '',
    m.dueSoon.length > 0 ? `${m.dueSoon.length} due within ${m.withinDays} days` : '',
  ].filter(Boolean);
  return renderMail({
    kitchen: m.kitchen,
    subject: `Supplier specifications to review: ${counted.join(', ')}`,
    greeting: 'Hello,',
    paragraphs: [
      `These supplier specifications of ${m.kitchen} are due for review, as of ${day(m.today)}. Ask each supplier for its current specification, check what it says against the ingredient in Crumbproof, and upload it with its new review-by date.`,
      ...(m.overdue.length > 0
        ? ['Overdue (their declarations carry a warning until a new specification is uploaded):', ...m.overdue.map(line)]
        : []),
      ...(m.dueSoon.length > 0 ? [`Due within ${m.withinDays} days:`, ...m.dueSoon.map(line)] : []),
      'The Today page in Crumbproof shows the same list.',
    ],
    aboutAllergens: true,
  });
}
