import type { BookIngredient } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { approveAll } from './support/approvals';
import { startTestApp, type TestApp } from './support/test-app';
import { addPerson, setUpTwoKitchens } from './support/two-kitchens';

/**
 * The approvals' mail on an installation of two kitchens over one recipe book (the two-site book
 * imported by a manager): Test bench sells shortbread and sesame snaps, Corner Shop shortbread
 * only. Each mail goes to the people of the kitchen it is about, by their role there.
 */
describe('mail to the people of each kitchen (real MariaDB)', () => {
  const PASSWORD = 'kitchen-mail-pass-63';
  let t: TestApp;
  const cookie: Record<string, string> = {};
  const PEOPLE = [
    ['owner@example.com', 'manager', null],
    ['manager.a@example.com', 'manager', 'bench'],
    ['chef.a@example.com', 'pastry-chef', 'bench'],
    ['counter.a@example.com', 'front-of-house', 'bench'],
    ['manager.b@example.com', 'manager', 'corner'],
    ['counter.b@example.com', 'front-of-house', 'corner'],
  ] as const;

  beforeAll(async () => {
    t = await startTestApp();
    await setUpTwoKitchens(t, PASSWORD);
    for (const [email, role, code] of PEOPLE) if (code !== null) await addPerson(t, email, role, PASSWORD, code);
    for (const [email] of PEOPLE) cookie[email] = await t.signIn(email, PASSWORD);
    // Each kitchen's manager approves what it sells, as imported.
    expect(await approveAll(t, cookie['manager.a@example.com'])).toEqual(['sesame-snap', 'shortbread']);
    expect(await approveAll(t, cookie['manager.b@example.com'])).toEqual(['shortbread']);
  });
  afterAll(() => t.close());

  const mailsAfter = async (kind: string, after: number, count: number) => {
    for (let i = 0; i < 50; i++) {
      const rows = await t.sequelize.query<{ recipients: string | string[]; subject: string; text: string }>(
        'SELECT recipients, subject, text FROM mail_outbox WHERE kind = ? AND id > ? ORDER BY id',
        { replacements: [kind, after], type: QueryTypes.SELECT },
      );
      if (rows.length >= count)
        return rows.map((r) => ({
          ...r,
          recipients: typeof r.recipients === 'string' ? (JSON.parse(r.recipients) as string[]) : r.recipients,
        }));
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`Fewer than ${count} ${kind} mails were queued.`);
  };
  const lastMailId = async () =>
    Number(
      (await t.sequelize.query<{ id: number | null }>('SELECT MAX(id) AS id FROM mail_outbox', { type: QueryTypes.SELECT }))[0].id ?? 0,
    );

  it('a change to a shared ingredient mails the managers of each kitchen the products waiting there', async () => {
    const chef = cookie['chef.a@example.com'];
    const {
      revision,
      updatedAt: _updatedAt,
      ...butter
    } = (await t.req('GET', '/api/ingredients/butter', chef)).json<BookIngredient & { revision: number; updatedAt: string }>();
    const mark = await lastMailId();
    const saved = await t.req('PUT', '/api/ingredients/butter', chef, { ...butter, contains: ['milk', 'egg'], baseRevision: revision });
    expect(saved.statusCode).toBe(200);
    const mails = await mailsAfter('approval-needed', mark, 2);
    expect(mails.map((m) => [m.recipients, m.subject])).toEqual([
      [['manager.a@example.com', 'owner@example.com'], '2 products wait for your approval at Test bench'],
      [['manager.b@example.com', 'owner@example.com'], 'Shortbread waits for your approval at Corner Shop'],
    ]);
    expect(mails[0].text).toContain('Sesame snap (adds an allergen)');
    expect(mails[1].text).not.toContain('Sesame snap');
  });

  it('an approved change that adds an allergen is mailed to everyone at that kitchen, and to nobody of the other', async () => {
    const mark = await lastMailId();
    expect(await approveAll(t, cookie['manager.b@example.com'])).toEqual(['shortbread']);
    const [mail] = await mailsAfter('allergen-approved', mark, 1);
    expect(mail.recipients).toEqual(['counter.b@example.com', 'manager.b@example.com', 'owner@example.com']);
    expect(mail.subject).toBe('Shortbread now has an allergen it did not have');
  });

  describe('each kitchen’s outbox', () => {
    const outbox = async (email: string) => {
      const res = await t.req('GET', '/api/mail/outbox', cookie[email]);
      expect(res.statusCode).toBe(200);
      return res.json<{ mails: { id: string; kind: string; subject: string; recipients: string[]; state: string }[] }>().mails;
    };

    it('lists the mail about its own kitchen, and none about the other', async () => {
      const bench = await outbox('manager.a@example.com');
      const corner = await outbox('manager.b@example.com');
      expect(bench.map((m) => m.subject)).toContain('2 products wait for your approval at Test bench');
      expect(bench.map((m) => m.subject)).not.toContain('Shortbread waits for your approval at Corner Shop');
      expect(corner.map((m) => m.subject)).toContain('Shortbread waits for your approval at Corner Shop');
      expect(corner.map((m) => m.subject)).toContain('Shortbread now has an allergen it did not have');
      expect(corner.some((m) => m.subject.includes('Test bench'))).toBe(false);
    });

    it('shows a password link at the kitchens of the person it is to, and nowhere else', async () => {
      const mark = await lastMailId();
      const asked = await t.req('POST', '/api/auth/password-reset', undefined, { email: 'counter.a@example.com' });
      expect(asked.statusCode).toBe(202);
      const [reset] = await mailsAfter('password-reset', mark, 1);
      expect(reset.recipients).toEqual(['counter.a@example.com']);
      const resetAt = async (email: string) =>
        (await outbox(email)).filter((m) => m.kind === 'password-reset' && m.recipients.includes('counter.a@example.com'));
      expect(await resetAt('manager.a@example.com')).toHaveLength(1);
      expect(await resetAt('manager.b@example.com')).toHaveLength(0);
      // The owner works at both kitchens: at each, the outbox is that kitchen's.
      const owner = cookie['owner@example.com'];
      const me = (await t.req('GET', '/api/me', owner)).json<{ kitchens: { id: number; code: string | null }[] }>();
      const at = (code: string) => String(me.kitchens.find((k) => k.code === code)!.id);
      const ownersAt = async (code: string) =>
        (await t.req('GET', `/api/mail/outbox?kitchen=${at(code)}`, owner)).json<{
          mails: { subject: string; kind: string }[];
        }>().mails;
      expect((await ownersAt('bench')).some((m) => m.kind === 'password-reset')).toBe(true);
      expect((await ownersAt('corner')).some((m) => m.kind === 'password-reset')).toBe(false);
      expect((await ownersAt('corner')).some((m) => m.subject.includes('Test bench'))).toBe(false);
    });

    it('refuses to send again another kitchen’s mail, and changes nothing', async () => {
      const [mail] = (await outbox('manager.a@example.com')).filter((m) => m.kind === 'approval-needed');
      await t.sequelize.query("UPDATE mail_outbox SET state = 'failed', attempts = 5 WHERE id = ?", { replacements: [mail.id] });
      const refused = await t.req('POST', `/api/mail/outbox/${mail.id}/retry`, cookie['manager.b@example.com'], {});
      expect(refused.statusCode).toBe(404);
      const [row] = await t.sequelize.query<{ state: string; attempts: number }>('SELECT state, attempts FROM mail_outbox WHERE id = ?', {
        replacements: [mail.id],
        type: QueryTypes.SELECT,
      });
      expect(row).toEqual({ state: 'failed', attempts: 5 });
      const sent = await t.req('POST', `/api/mail/outbox/${mail.id}/retry`, cookie['manager.a@example.com'], {});
      expect(sent.statusCode).toBe(200);
      expect(sent.json<{ state: string }>().state).toBe('queued');
    });
  });
});
