import type { ParsedMail } from 'mailparser';
import { QueryTypes } from 'sequelize';
import type { Clock } from '../src/common/clock';
import { MailSender } from '../src/mail/mail-sender.service';
import { MailService } from '../src/mail/mail.service';
import { startFakeSmtp, type FakeSmtp } from './support/fake-smtp';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The kitchen's mail on the real MariaDB and a mail server in this process: the outbox is
 * written in the write's transaction, sent after commit, tried again after a failure and kept as
 * not sent after the last attempt; invitations and password resets by one-time links.
 */

let smtp: FakeSmtp;
let t: TestApp;
let manager: string;
let clock: Clock;
let sender: MailSender;
let mail: MailService;

const KITCHEN = 'Wrenfield Lane Bakehouse';

beforeAll(async () => {
  smtp = await startFakeSmtp();
  t = await startTestApp({ seed: true, mail: smtp, settings: { SIGN_IN_LIMIT: '8' } });
  clock = t.clock;
  sender = t.app.get(MailSender);
  mail = t.app.get(MailService);
  manager = await t.signIn('manager@example.com');
});
afterAll(async () => {
  await t?.close();
  await smtp?.close();
});
afterEach(() => clock.reset());

const post = (url: string, payload: Record<string, unknown>, cookie?: string) => t.req('POST', url, cookie, payload);
const sendDue = () => t.sendDueMail();

async function outboxRow(id: string) {
  const [row] = await t.sequelize.query<{
    state: string;
    attempts: number;
    last_error: string | null;
    text: string;
    html: string;
    secret: string | null;
  }>('SELECT state, attempts, last_error, text, html, secret FROM mail_outbox WHERE id = ?', {
    replacements: [id],
    type: QueryTypes.SELECT,
  });
  return row;
}

const to = (address: string) => (m: ParsedMail) =>
  m.to !== undefined && [m.to].flat().some((a) => a.value.some((v) => v.address === address));
const tokenIn = (m: ParsedMail) => /\/set-password#token=([A-Za-z0-9_-]+)/.exec(m.text ?? '')![1];

describe('the outbox', () => {
  it('never sends a mail queued in a write that was rolled back', async () => {
    const before = smtp.mails.length;
    await expect(
      t.sequelize.transaction(async (tx) => {
        await mail.enqueue(
          {
            kind: 'rolled-back',
            kitchenId: null,
            to: ['nobody-here@example.com'],
            subject: 'Never sent',
            text: 'Never sent.',
            html: '<p>Never sent.</p>',
          },
          tx,
        );
        throw new Error('the write was refused');
      }),
    ).rejects.toThrow('the write was refused');
    await sendDue();
    const [{ n }] = await t.sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM mail_outbox WHERE kind = 'rolled-back'", {
      type: QueryTypes.SELECT,
    });
    expect(Number(n)).toBe(0);
    expect(smtp.mails.length).toBe(before);
  });

  it('sends a committed mail from the kitchen’s name, with plain text and HTML', async () => {
    const id = await t.sequelize.transaction((tx) =>
      mail.enqueue(
        { kind: 'note', kitchenId: null, to: ['chef@example.com'], subject: 'A note', text: 'Plain words.', html: '<p>HTML words.</p>' },
        tx,
      ),
    );
    const got = await smtp.waitFor((m) => m.subject === 'A note');
    expect(got.from?.value).toEqual([{ name: `${KITCHEN} via Crumbproof`, address: 'kitchen-mail@bakehouse.example' }]);
    expect(got.text?.trim()).toBe('Plain words.');
    expect(got.html).toContain('<p>HTML words.</p>');
    await sender.whenIdle();
    expect((await outboxRow(id)).state).toBe('sent');
  });

  it('refuses a malformed mail and queues nothing', async () => {
    await expect(mail.enqueue({ kind: 'note', kitchenId: null, to: [], subject: 'x', text: 'x', html: 'x' })).rejects.toThrow(/recipient/);
    await expect(
      mail.enqueue({ kind: 'note', kitchenId: null, to: ['not an address'], subject: 'x', text: 'x', html: 'x' }),
    ).rejects.toThrow();
  });

  it('finds the addresses of the active people with a role at the kitchens named', async () => {
    const one = <T extends object>(sql: string, replacements: unknown[] = []) =>
      t.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT }).then((rows) => rows[0]);
    const { id: bakehouse } = await one<{ id: number }>('SELECT id FROM sites ORDER BY id LIMIT 1');
    expect(await mail.addressesOf(['manager', 'pastry-chef'], bakehouse)).toEqual(['chef@example.com', 'manager@example.com']);
    expect(await mail.addressesOf([], bakehouse)).toEqual([]);
    // A second kitchen where the pastry chef is the manager and nobody else works.
    await t.sequelize.query(
      `INSERT INTO sites (code, name, address, regime, measures, handles, created_at, updated_at)
       SELECT 'mail-corner', 'Corner Shop', '', regime, measures, handles, NOW(), NOW() FROM sites WHERE id = ?`,
      { replacements: [bakehouse] },
    );
    const { id: corner } = await one<{ id: number }>("SELECT id FROM sites WHERE code = 'mail-corner'");
    const { id: chef } = await one<{ id: number }>("SELECT id FROM users WHERE email = 'chef@example.com'");
    await t.sequelize.query("INSERT INTO kitchen_roles (user_id, site_id, role) VALUES (?, ?, 'manager')", {
      replacements: [chef, corner],
    });
    try {
      expect(await mail.addressesOf(['manager'], corner)).toEqual(['chef@example.com']);
      expect(await mail.addressesOf(['manager'], bakehouse)).toEqual(['manager@example.com']);
      expect(await mail.addressesOf(['front-of-house'], corner)).toEqual([]);
      expect(await mail.addressesOf(['manager'], [bakehouse, corner])).toEqual(['chef@example.com', 'manager@example.com']);
      await t.sequelize.query('UPDATE users SET active = FALSE WHERE id = ?', { replacements: [chef] });
      expect(await mail.addressesOf(['manager'], corner)).toEqual([]);
    } finally {
      await t.sequelize.query('UPDATE users SET active = TRUE WHERE id = ?', { replacements: [chef] });
      await t.sequelize.query('DELETE FROM sites WHERE id = ?', { replacements: [corner] });
    }
  });

  it('tries again after 1, 5, 15 and 60 minutes while the server is down, keeps it as not sent after the 5th, and sends it when the manager sends it again', async () => {
    await smtp.down();
    try {
      const id = await mail.enqueue({
        kind: 'note',
        kitchenId: null,
        to: ['chef@example.com'],
        subject: 'Through an outage',
        text: 'Late.',
        html: '<p>Late.</p>',
      });
      await sender.whenIdle();
      let row = await outboxRow(id);
      expect(row).toMatchObject({ state: 'queued', attempts: 1 });
      expect(row.last_error).toMatch(/ECONNREFUSED|ECONNECTION|connect/i);
      for (const [minutes, attempts] of [
        [1, 2],
        [5, 3],
        [15, 4],
      ] as const) {
        clock.advance(minutes * 60_000 - 1000);
        await sendDue();
        expect((await outboxRow(id)).attempts).toBe(attempts - 1); // not due yet
        clock.advance(1000);
        await sendDue();
        expect(await outboxRow(id)).toMatchObject({ state: 'queued', attempts });
      }
      clock.advance(60 * 60_000);
      await sendDue();
      row = await outboxRow(id);
      expect(row).toMatchObject({ state: 'failed', attempts: 5 });
      expect(row.last_error).toBeTruthy();

      const page = (await t.app.inject({ method: 'GET', url: '/api/mail/outbox', headers: { cookie: manager } })).json();
      const shown = page.mails.find((m: { id: string }) => m.id === id);
      expect(shown).toMatchObject({ state: 'failed', attempts: 5, recipients: ['chef@example.com'], subject: 'Through an outage' });
      expect(shown.lastError).toBeTruthy();
      expect(shown).not.toHaveProperty('text');
      expect(page).toMatchObject({ sending: true, maxAttempts: 5 });

      clock.advance(24 * 60 * 60_000);
      await sendDue();
      expect((await outboxRow(id)).state).toBe('failed'); // nothing tries a failed mail on its own

      await smtp.up();
      const again = await post(`/api/mail/outbox/${id}/retry`, {}, manager);
      expect(again.statusCode).toBe(200);
      await smtp.waitFor((m) => m.subject === 'Through an outage');
      await sender.whenIdle();
      expect(await outboxRow(id)).toMatchObject({ state: 'sent', attempts: 1, last_error: null });
      const twice = await post(`/api/mail/outbox/${id}/retry`, {}, manager);
      expect(twice.statusCode).toBe(409);
      expect(twice.json().message).toBe('This mail was sent already.');
    } finally {
      await smtp.up();
    }
  });

  it('keeps a mail the server refuses with its answer', async () => {
    smtp.refuse = true;
    try {
      const id = await mail.enqueue({
        kind: 'note',
        kitchenId: null,
        to: ['chef@example.com'],
        subject: 'Refused',
        text: 'No.',
        html: '<p>No.</p>',
      });
      await sender.whenIdle();
      expect(await outboxRow(id)).toMatchObject({ state: 'queued', attempts: 1 });
      expect((await outboxRow(id)).last_error).toMatch(/451/);
    } finally {
      smtp.refuse = false;
    }
  });
});

describe('invitations', () => {
  it('mails a link that sets the password once, with the kitchen’s name and escaped HTML', async () => {
    const res = await post(
      '/api/users/invitations',
      { email: 'new.baker@example.com', name: 'Ada <Baker> & Co', role: 'pastry-chef' },
      manager,
    );
    expect(res.statusCode).toBe(201);
    expect(res.json()).toMatchObject({ email: 'new.baker@example.com', invitationPending: true, active: true });
    const got = await smtp.waitFor(to('new.baker@example.com'));
    expect(got.subject).toBe(`You are invited to ${KITCHEN} on Crumbproof`);
    expect(got.from?.text).toBe(`"${KITCHEN} via Crumbproof" <kitchen-mail@bakehouse.example>`);
    expect(got.text).toContain('Hello Ada <Baker> & Co,');
    expect(got.html).toContain('Hello Ada &lt;Baker&gt; &amp; Co,');
    expect(got.html).not.toContain('<Baker>');
    expect(got.text).toContain('for 72 hours');
    const token = tokenIn(got);
    expect(got.html).toContain(`/set-password#token=${token}`);

    // Only the token's SHA-256 is kept, and the sent mail's kept copy no longer carries it.
    await sender.whenIdle();
    const [stored] = await t.sequelize.query<{ token_sha256: string }>(
      "SELECT token_sha256 FROM account_links l JOIN users u ON u.id = l.user_id WHERE u.email = 'new.baker@example.com'",
      { type: QueryTypes.SELECT },
    );
    expect(stored.token_sha256).toMatch(/^[0-9a-f]{64}$/);
    const [kept] = await t.sequelize.query<{ text: string; html: string; secret: string | null }>(
      "SELECT text, html, secret FROM mail_outbox WHERE kind = 'invitation' ORDER BY id DESC LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    expect(`${kept.text}${kept.html}`).not.toContain(token);
    expect(kept.secret).toBeNull();

    expect((await post('/api/auth/sign-in', { email: 'new.baker@example.com', password: 'Proving-dough-at-6am' })).statusCode).toBe(401);
    expect((await post('/api/auth/account-link', { token })).json()).toMatchObject({
      state: 'usable',
      purpose: 'invitation',
      email: 'new.baker@example.com',
    });
    const common = await post('/api/auth/set-password', { token, password: 'password1234' });
    expect(common.statusCode).toBe(400);
    const set = await post('/api/auth/set-password', { token, password: 'Proving-dough-at-6am' });
    expect(set.statusCode).toBe(200);
    expect(set.json()).toEqual({ email: 'new.baker@example.com' });
    expect((await post('/api/auth/sign-in', { email: 'new.baker@example.com', password: 'Proving-dough-at-6am' })).statusCode).toBe(200);

    const again = await post('/api/auth/set-password', { token, password: 'Another-dough-at-7am' });
    expect(again.statusCode).toBe(403);
    expect(again.json().message).toMatch(/used already/);
    expect((await post('/api/auth/account-link', { token })).json()).toEqual({ state: 'used', purpose: 'invitation' });
  });

  it('expires after 72 hours; sent again, the new link works and the old one says it was replaced', async () => {
    expect(
      (await post('/api/users/invitations', { email: 'late.starter@example.com', name: 'Late Starter', role: 'front-of-house' }, manager))
        .statusCode,
    ).toBe(201);
    const first = tokenIn(await smtp.waitFor(to('late.starter@example.com')));
    clock.advance(72 * 60 * 60_000 + 1000);
    expect((await post('/api/auth/account-link', { token: first })).json()).toEqual({ state: 'expired', purpose: 'invitation' });
    const expired = await post('/api/auth/set-password', { token: first, password: 'Counter-shift-9am!' });
    expect(expired.statusCode).toBe(403);
    expect(expired.json().message).toMatch(/expired/);

    const [{ id }] = await t.sequelize.query<{ id: number }>("SELECT id FROM users WHERE email = 'late.starter@example.com'", {
      type: QueryTypes.SELECT,
    });
    const count = smtp.mails.length;
    expect((await post(`/api/users/${id}/invitation`, {}, manager)).statusCode).toBe(200);
    const second = tokenIn(await smtp.waitFor((m) => to('late.starter@example.com')(m) && smtp.mails.indexOf(m) >= count));
    expect(second).not.toBe(first);
    expect((await post('/api/auth/account-link', { token: first })).json()).toEqual({ state: 'replaced', purpose: 'invitation' });
    expect((await post('/api/auth/set-password', { token: second, password: 'Counter-shift-9am!' })).statusCode).toBe(200);
    const done = await post(`/api/users/${id}/invitation`, {}, manager);
    expect(done.statusCode).toBe(409);
    expect(done.json().message).toMatch(/chosen a password already/);
  });

  it('stops an invitation working once a manager has set the password', async () => {
    const res = await post(
      '/api/users/invitations',
      { email: 'set.by.manager@example.com', name: 'Set By Manager', role: 'front-of-house' },
      manager,
    );
    const token = tokenIn(await smtp.waitFor(to('set.by.manager@example.com')));
    const { id } = res.json<{ id: number }>();
    expect(
      (
        await t.app.inject({
          method: 'PATCH',
          url: `/api/users/${id}`,
          headers: { cookie: manager },
          payload: { password: 'Manager-chose-this-1' },
        })
      ).statusCode,
    ).toBe(200);
    expect((await post('/api/auth/account-link', { token })).json()).toEqual({ state: 'used', purpose: 'invitation' });
    expect((await post('/api/auth/set-password', { token, password: 'Invitee-chose-this-2' })).statusCode).toBe(403);
  });

  it('refuses an invitation to an address that has an account', async () => {
    const res = await post('/api/users/invitations', { email: 'chef@example.com', name: 'Twice', role: 'pastry-chef' }, manager);
    expect(res.statusCode).toBe(409);
  });
});

describe('Forgot your password?', () => {
  it('answers alike for a known and an unknown address, and mails only the known one', async () => {
    const count = smtp.mails.length;
    const timed = async (email: string) => {
      const started = Date.now();
      const res = await post('/api/auth/password-reset', { email });
      return { res, ms: Date.now() - started };
    };
    const { res: known, ms: knownMs } = await timed('chef@example.com');
    const { res: unknown, ms: unknownMs } = await timed('no-one-by-this-name@example.com');
    // Both take at least the same padded time, so the time does not tell a known address either.
    expect(knownMs).toBeGreaterThanOrEqual(390);
    expect(unknownMs).toBeGreaterThanOrEqual(390);
    expect(known.statusCode).toBe(202);
    expect(unknown.statusCode).toBe(202);
    expect(unknown.body).toBe(known.body);
    const got = await smtp.waitFor((m) => to('chef@example.com')(m) && smtp.mails.indexOf(m) >= count);
    expect(got.subject).toBe(`Choose a new password for ${KITCHEN} on Crumbproof`);
    await sendDue();
    expect(smtp.mails.slice(count).filter(to('no-one-by-this-name@example.com'))).toEqual([]);
  });

  it('sets a new password once within the hour and ends the user’s sessions; later the link says it expired', async () => {
    const session = await t.signIn('counter@example.com');
    const count = smtp.mails.length;
    expect((await post('/api/auth/password-reset', { email: 'counter@example.com' })).statusCode).toBe(202);
    const token = tokenIn(await smtp.waitFor((m) => to('counter@example.com')(m) && smtp.mails.indexOf(m) >= count));
    expect((await post('/api/auth/set-password', { token, password: 'Lemon-curd-tuesday-4' })).statusCode).toBe(200);
    expect((await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: session } })).statusCode).toBe(401);
    expect((await post('/api/auth/sign-in', { email: 'counter@example.com', password: 'Lemon-curd-tuesday-4' })).statusCode).toBe(200);

    const later = smtp.mails.length;
    expect((await post('/api/auth/password-reset', { email: 'counter@example.com' })).statusCode).toBe(202);
    const next = tokenIn(await smtp.waitFor((m) => to('counter@example.com')(m) && smtp.mails.indexOf(m) >= later));
    clock.advance(60 * 60_000 + 1000);
    expect((await post('/api/auth/account-link', { token: next })).json()).toEqual({ state: 'expired', purpose: 'password-reset' });
    expect((await post('/api/auth/set-password', { token: next, password: 'Lemon-curd-wednesday-5' })).statusCode).toBe(403);
  });

  it('says nothing of a link it does not know', async () => {
    expect((await post('/api/auth/account-link', { token: 'A'.repeat(43) })).json()).toEqual({ state: 'unknown' });
    const res = await post('/api/auth/set-password', { token: 'A'.repeat(43), password: 'Lemon-curd-thursday-6' });
    expect(res.statusCode).toBe(403);
    expect(res.json().message).toMatch(/not known/);
  });

  it('is limited per address like sign-in', async () => {
    const answers: number[] = [];
    for (let i = 0; i < 10; i++) answers.push((await post('/api/auth/password-reset', { email: `nobody-${i}@example.com` })).statusCode);
    expect(answers).toContain(429);
    expect(answers.indexOf(429)).toBeGreaterThan(0);
  });
});
