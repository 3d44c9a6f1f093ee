import { Injectable, Logger } from '@nestjs/common';
import { Cron } from '@nestjs/schedule';
import { AuditService } from '../../audit/audit.service';
import { Clock } from '../../common/clock';
import { TransactionRunner } from '../../common/transaction';
import { KitchenService } from '../../kitchen/kitchen.service';
import { SiteRepository, type SiteRow } from '../../kitchen/site.repository';
import { MailService } from '../../mail/mail.service';
import { reviewsDueMail } from '../../mail/templates/reviews-due';
import { SpecificationReviewRunsRepository, type ReviewRun } from './specification-review-runs.repository';
import { SpecificationsService } from './specifications.service';

/** Who is told each day of the specifications to review: the kitchen's own pastry chefs and managers. */
const TOLD = ['pastry-chef', 'manager'] as const;

/**
 * Once a day, for every kitchen, looks for supplier specifications overdue for review and due
 * within 30 days (counted on the kitchen's calendar; the specifications are the shared book's),
 * records what it found for that kitchen, and mails the list to that kitchen's pastry chefs and
 * managers; a kitchen's day already looked at is left as it is, so each kitchen's mail goes once a day.
 */
@Injectable()
export class SpecificationReviewsJob {
  private readonly logger = new Logger('SpecificationReviews');

  constructor(
    private readonly specifications: SpecificationsService,
    private readonly runs: SpecificationReviewRunsRepository,
    private readonly kitchen: KitchenService,
    private readonly sites: SiteRepository,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly tx: TransactionRunner,
    private readonly clock: Clock,
  ) {}

  /** Every morning at six (the server's time), and never twice for one day. */
  @Cron('0 6 * * *', { name: 'specification-reviews' })
  async daily(): Promise<void> {
    try {
      await this.run();
    } catch (err) {
      this.logger.error(`The daily review of specifications failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  }

  /**
   * The review of the day at `now` at every kitchen, the book's owner first: each kitchen's record
   * of the day, made now (`created`) or found from an earlier run that day. None when there is no
   * kitchen yet.
   */
  async run(now = this.clock.now()): Promise<{ site: SiteRow; run: ReviewRun; created: boolean }[]> {
    const kitchens = await this.kitchen.all();
    if (kitchens.length === 0) return [];
    const found = await this.specifications.reviewsDue(now);
    const done = [];
    for (const site of kitchens) done.push({ site, ...(await this.runAt(site, found)) });
    return done;
  }

  private runAt(site: SiteRow, found: Awaited<ReturnType<SpecificationsService['reviewsDue']>>) {
    return this.tx.run(async (t) => {
      await this.sites.lock(t);
      const earlier = await this.runs.findLocked(site.id, found.today, t);
      if (earlier) return { run: earlier, created: false };
      const to = found.overdue.length + found.dueSoon.length > 0 ? await this.mail.addressesOf(TOLD, site.id, t) : [];
      const mailId =
        to.length > 0
          ? await this.mail.enqueue({ kind: 'reviews-due', kitchenId: site.id, to, ...reviewsDueMail({ kitchen: site.name, ...found }) }, t)
          : null;
      const run = await this.runs.add(site.id, { day: found.today, overdue: found.overdue, dueSoon: found.dueSoon, mailId }, t);
      await this.audit.record(
        {
          action: 'specifications.reviewed',
          actor: null,
          record: { kind: 'kitchen', id: site.id },
          summary:
            `Looked at the supplier specifications on ${found.today}: ${found.overdue.length} overdue for review, ` +
            `${found.dueSoon.length} due within ${found.withinDays} days; ` +
            (mailId
              ? `mailed to ${to.length} pastry chef${to.length === 1 ? '' : 's'} and manager${to.length === 1 ? '' : 's'}.`
              : 'no mail sent.'),
          after: {
            day: found.today,
            overdue: found.overdue.map((r) => ({ ingredient: r.ingredient, reviewBy: r.reviewBy })),
            dueSoon: found.dueSoon.map((r) => ({ ingredient: r.ingredient, reviewBy: r.reviewBy })),
            mail: mailId,
          },
        },
        t,
      );
      return { run, created: true };
    });
  }
}
