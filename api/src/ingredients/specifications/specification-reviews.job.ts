import { Injectable, Logger } from '@nestjs/common';
import { Cron } from '@nestjs/schedule';
import { AuditService } from '../../audit/audit.service';
import { Clock } from '../../common/clock';
import { TransactionRunner } from '../../common/transaction';
import { KitchenService } from '../../kitchen/kitchen.service';
import { SiteRepository } from '../../kitchen/site.repository';
import { MailService } from '../../mail/mail.service';
import { reviewsDueMail } from '../../mail/templates/reviews-due';
import { SpecificationReviewRunsRepository, type ReviewRun } from './specification-review-runs.repository';
import { SpecificationsService } from './specifications.service';

/** Who is told each day of the specifications to review: these roles at any kitchen. */
const TOLD = ['pastry-chef', 'manager'] as const;

/**
 * Once a day, looks for supplier specifications overdue for review and due within 30 days
 * (counted on the kitchen's calendar), records what it found, and mails the list to the pastry
 * chefs and managers of every kitchen (the library is shared); a day already looked at is left as
 * it is, so the mail goes once a day.
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
   * The review of the day at `now`: the day's record, made now (`created`) or found from an
   * earlier run that day. Null when there is no kitchen yet.
   */
  async run(now = this.clock.now()): Promise<{ run: ReviewRun; created: boolean } | null> {
    const site = await this.kitchen.find();
    if (!site) return null;
    const found = await this.specifications.reviewsDue(now);
    return this.tx.run(async (t) => {
      await this.sites.lock(t);
      const earlier = await this.runs.findLocked(site.id, found.today, t);
      if (earlier) return { run: earlier, created: false };
      // The ingredient library is every kitchen's: the pastry chefs and managers of each are told.
      const kitchens = (await this.sites.all(t)).map((s) => s.id);
      const to = found.overdue.length + found.dueSoon.length > 0 ? await this.mail.addressesOf(TOLD, kitchens, t) : [];
      const mailId =
        to.length > 0 ? await this.mail.enqueue({ kind: 'reviews-due', to, ...reviewsDueMail({ kitchen: site.name, ...found }) }, t) : null;
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
