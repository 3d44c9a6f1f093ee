import { parseConfig } from '../../config/config';
import { invitationMail, passwordResetMail } from './account-links';
import { ALLERGEN_MAIL_CAUTION, escapeHtml, renderMail } from './layout';

const base = { JWT_SECRET: 'x'.repeat(32) };

describe('mail templates', () => {
  it('escapes every text into the HTML and keeps it as written in the plain text', () => {
    const mail = renderMail({
      kitchen: 'Crumb & <Co>',
      subject: 'A "test"',
      greeting: 'Hello <b>Ada</b>,',
      paragraphs: ["It's 5 > 4 & 3 < 4."],
      action: { label: 'Open', url: 'https://bakery.example/set-password#token=a"b' },
    });
    expect(mail.text).toContain('Hello <b>Ada</b>,');
    expect(mail.text).toContain("It's 5 > 4 & 3 < 4.");
    expect(mail.text).toContain('Open:\nhttps://bakery.example/set-password#token=a"b');
    expect(mail.html).toContain('Hello &lt;b&gt;Ada&lt;/b&gt;,');
    expect(mail.html).toContain('It&#39;s 5 &gt; 4 &amp; 3 &lt; 4.');
    expect(mail.html).toContain('href="https://bakery.example/set-password#token=a&quot;b"');
    expect(mail.html).toContain('Sent by Crumbproof for Crumb &amp; &lt;Co&gt;.');
    expect(mail.html).not.toMatch(/<b>Ada/);
  });

  it.each([
    ['&', '&amp;'],
    ['<script>', '&lt;script&gt;'],
    ['"\'', '&quot;&#39;'],
  ])('escapes %s', (raw, escaped) => expect(escapeHtml(raw)).toBe(escaped));

  it('carries the caution in every mail about allergens, in both parts, and in no other', () => {
    const parts = { kitchen: 'K', subject: 'S', greeting: 'Hello,', paragraphs: ['A declaration changed.'] };
    const about = renderMail({ ...parts, aboutAllergens: true });
    expect(about.text).toContain(ALLERGEN_MAIL_CAUTION);
    expect(about.html).toContain(escapeHtml(ALLERGEN_MAIL_CAUTION));
    expect(renderMail(parts).text).not.toContain(ALLERGEN_MAIL_CAUTION);
    expect(`${about.text}${about.html}`).not.toMatch(/\bsafe\b/i);
  });

  it('says how long each link works, and whom to ask', () => {
    const invite = invitationMail({
      kitchen: 'Wrenfield Lane Bakehouse',
      name: 'Ada',
      role: 'pastry-chef',
      invitedBy: 'Maren',
      url: 'http://127.0.0.1:3000/set-password#token=t',
      validMinutes: 72 * 60,
    });
    expect(invite.subject).toBe('You are invited to Wrenfield Lane Bakehouse on Crumbproof');
    expect(invite.text).toContain('Maren added you to Wrenfield Lane Bakehouse on Crumbproof as pastry chef.');
    expect(invite.text).toContain('The link works once, for 72 hours. If it has run out, ask Maren to send the invitation again.');
    const reset = passwordResetMail({ kitchen: 'K', name: 'Ada', url: 'http://x/set-password#token=t', validMinutes: 60 });
    expect(reset.text).toContain('for 1 hour.');
    expect(reset.text).toContain('signs you out everywhere');
  });
});

describe('mail settings', () => {
  it('needs MAIL_FROM with SMTP_HOST, and SMTP_USER with SMTP_PASSWORD', () => {
    expect(() => parseConfig({ ...base, SMTP_HOST: 'smtp.bakery.example' })).toThrow(/MAIL_FROM: Set MAIL_FROM/);
    expect(() => parseConfig({ ...base, SMTP_HOST: 'smtp.bakery.example', MAIL_FROM: 'kitchen' })).toThrow(
      /MAIL_FROM must be an email address/,
    );
    expect(() => parseConfig({ ...base, SMTP_PASSWORD: 'p' })).toThrow(/SMTP_USER: Set SMTP_USER/);
    expect(parseConfig({ ...base, SMTP_HOST: 'smtp.bakery.example', MAIL_FROM: 'kitchen@bakery.example' })).toMatchObject({
      SMTP_PORT: 587,
      SMTP_SECURE: 'false',
      MAIL_POLL_SECONDS: 30,
    });
    // Empty values, as .env.example leaves them, are unset: no mail server, nothing sent.
    expect(parseConfig({ ...base, SMTP_HOST: '', MAIL_FROM: '', SMTP_USER: '' }).SMTP_HOST).toBeUndefined();
  });
});
