import type { ReviewsDue, ServedDeclaration } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { Clock } from '../src/common/clock';
import type { SpecificationReviewsJob as JobType } from '../src/ingredients/specifications/specification-reviews.job';
import { DAY, isoDay, uploadSpecification } from './support/specifications';
import { startTestApp, type TestApp } from './support/test-app';

/** Supplier specifications due for review: the default review-by date, the daily job, its route and the warning on declarations. */
describe('specification reviews (real MariaDB, the clock moved by the test)', () => {
  let t: TestApp;
  let chef: string;
  let manager: string;
  let counter: string;
  let clock: Clock;
  let job: JobType;

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    [chef, manager, counter] = await Promise.all(
      ['chef@example.com', 'manager@example.com', 'counter@example.com'].map((e) => t.signIn(e)),
    );
    clock = t.app.get(Clock);
    const { SpecificationReviewsJob } = await import('../src/ingredients/specifications/specification-reviews.job');
    job = t.app.get(SpecificationReviewsJob);
  });
  afterAll(() => t.close());
  afterEach(() => clock.reset());

  const get = (url: string, cookie = chef) => t.app.inject({ method: 'GET', url, headers: { cookie } });
  const upload = (code: string, fields: Record<string, string>) => uploadSpecification(t, chef, code, fields);
  const count = async (table: string, where = '') =>
    Number((await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table} ${where}`, { type: QueryTypes.SELECT }))[0].n);

  it('gives a specification uploaded without a review-by date one year from the day of upload', async () => {
    const now = new Date();
    const spec = await upload('sea-salt', {});
    const expected = `${now.getFullYear() + 1}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
    // 29 February has no day the next year: the last day of February.
    expect(spec.reviewBy).toBe(expected.endsWith('-02-29') ? expected.replace(/29$/, '28') : expected);
    const [event] = await t.sequelize.query<{ summary: string }>(
      "SELECT summary FROM audit_events WHERE action = 'specification.uploaded' ORDER BY id DESC LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    expect(event.summary).toMatch(/one year from today, as none was given/);
  });

  it('lists the overdue and the due within 30 days as the kitchen’s calendar moves, for the manager and the pastry chef only', async () => {
    await upload('butter', { reviewBy: isoDay(0) });
    await upload('walnuts', { reviewBy: isoDay(20) });
    await upload('caster-sugar', { reviewBy: isoDay(100) });

    const now = (await get('/api/specifications/reviews-due')).json<ReviewsDue>();
    expect(now.today).toBe(isoDay(0));
    expect(now.withinDays).toBe(30);
    expect(now.overdue).toEqual([]);
    expect(now.dueSoon.map((r) => [r.ingredient, r.reviewBy, r.daysLeft])).toEqual([
      ['butter', isoDay(0), 0],
      ['walnuts', isoDay(20), 20],
    ]);

    clock.advance(5 * DAY);
    const later = (await get('/api/specifications/reviews-due', manager)).json<ReviewsDue>();
    expect(later.today).toBe(isoDay(5));
    expect(later.overdue.map((r) => [r.ingredient, r.daysLeft])).toEqual([['butter', -5]]);
    expect(later.dueSoon.map((r) => [r.ingredient, r.daysLeft])).toEqual([['walnuts', 15]]);

    clock.advance(70 * DAY);
    const much = (await get('/api/specifications/reviews-due')).json<ReviewsDue>();
    expect(much.overdue.map((r) => r.ingredient)).toEqual(['butter', 'walnuts']);
    expect(much.dueSoon.map((r) => [r.ingredient, r.daysLeft])).toEqual([['caster-sugar', 25]]);

    expect((await get('/api/specifications/reviews-due', counter)).statusCode).toBe(403);
  });

  it('the daily job records what it found and mails the pastry chefs and managers once a day', async () => {
    clock.advance(5 * DAY);
    const mails = await count('mail_outbox', "WHERE kind = 'reviews-due'");
    const events = await count('audit_events', "WHERE action = 'specifications.reviewed'");

    const [first, ...others] = await job.run();
    expect(others).toEqual([]);
    expect(first?.created).toBe(true);
    expect(first?.run.day).toBe(isoDay(5));
    expect(first?.run.overdue.map((r) => r.ingredient)).toEqual(['butter']);
    expect(first?.run.dueSoon.map((r) => r.ingredient)).toEqual(['walnuts']);
    const [mail] = await t.sequelize.query<{ id: string; recipients: string | string[]; subject: string; text: string }>(
      "SELECT id, recipients, subject, text FROM mail_outbox WHERE kind = 'reviews-due' ORDER BY id DESC LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    expect(String(mail.id)).toBe(first?.run.mailId);
    const to = typeof mail.recipients === 'string' ? (JSON.parse(mail.recipients) as string[]) : mail.recipients;
    expect([...to].sort()).toEqual(['chef@example.com', 'manager@example.com']);
    expect(mail.subject).toBe('Supplier specifications to review: 1 overdue, 1 due within 30 days');
    expect(mail.text).toMatch(/Unsalted butter \(version 1\): review by .*, 5 days overdue\./);
    expect(mail.text).toMatch(/\(version 1\): review by .*, in 15 days\./);

    // The same day again (a second instance, a restart): nothing new, no second mail.
    clock.advance(60_000);
    const [again] = await job.run();
    expect(again?.created).toBe(false);
    expect(await count('mail_outbox', "WHERE kind = 'reviews-due'")).toBe(mails + 1);
    expect(await count('audit_events', "WHERE action = 'specifications.reviewed'")).toBe(events + 1);

    // The next day is looked at, and mailed, afresh.
    clock.advance(DAY);
    expect((await job.run())[0]?.created).toBe(true);
    expect(await count('mail_outbox', "WHERE kind = 'reviews-due'")).toBe(mails + 2);
  });

  it('warns on every declaration above an ingredient whose specification is overdue, worked out as it is served, never blocking', async () => {
    const product = 'lemon-shortbread';
    const before = (await get(`/api/recipes/${product}/declaration`, counter)).json<ServedDeclaration>();
    expect(before.basis.items.some((i) => i.id === 'butter')).toBe(true);
    // Butter's specification is due today, not overdue: no warning yet.
    expect(before.reviewWarnings).toBeUndefined();
    const kept = await count('declarations');

    clock.advance(3 * DAY);
    const res = await get(`/api/recipes/${product}/declaration`, counter);
    expect(res.statusCode).toBe(200);
    const after = res.json<ServedDeclaration>();
    expect(after.reviewWarnings).toEqual([
      {
        ingredient: 'butter',
        name: expect.any(String),
        reviewBy: isoDay(0),
        message: expect.stringMatching(
          new RegExp(`was due for review on ${isoDay(0)}; .*Check it against the supplier's current specification\\.$`),
        ),
      },
    ]);
    // The same kept declaration: the warning is not part of it.
    const { reviewWarnings: _w, claimBasis: _today, ...declaration } = after;
    const { claimBasis: _then, ...was } = before;
    expect(declaration).toEqual(was);
    expect(await count('declarations')).toBe(kept);

    // A product without butter below it carries none.
    const brownie = (await get('/api/recipes/vegan-brownie/declaration', counter)).json<ServedDeclaration>();
    expect(brownie.basis.items.some((i) => i.id === 'butter')).toBe(false);
    expect(brownie.reviewWarnings).toBeUndefined();

    // A new specification takes the warning away.
    await upload('butter', { reviewBy: isoDay(365) });
    expect((await get(`/api/recipes/${product}/declaration`, counter)).json<ServedDeclaration>().reviewWarnings).toBeUndefined();
  });
});
