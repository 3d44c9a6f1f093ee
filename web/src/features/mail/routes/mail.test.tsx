import type { OutboxMail, OutboxPage } from '@crumbproof/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const failed: OutboxMail = {
  id: '7',
  kind: 'invitation',
  recipients: ['ines@crumbproof.test'],
  subject: 'You are invited to Wrenfield Lane Bakehouse on Crumbproof',
  state: 'failed',
  attempts: 5,
  lastError: 'ECONNECTION connect ECONNREFUSED 127.0.0.1:2525',
  nextAttemptAt: null,
  sentAt: null,
  createdAt: '2026-12-01T09:00:00.000Z',
};
const sent: OutboxMail = {
  ...failed,
  id: '6',
  kind: 'password-reset',
  recipients: ['teodor@crumbproof.test'],
  subject: 'Choose a new password',
  state: 'sent',
  attempts: 1,
  lastError: null,
  sentAt: '2026-12-01T08:01:00.000Z',
};

describe('Mail page', () => {
  it('lists the outbox with state, attempts and error, and sends a failed mail again', async () => {
    let page: OutboxPage = { mails: [failed, sent], total: 2, sending: true, maxAttempts: 5 };
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/mail/outbox': () => ({ body: page }),
        'POST /api/mail/outbox/7/retry': () => {
          const queued: OutboxMail = { ...failed, state: 'queued', attempts: 0, nextAttemptAt: '2026-12-01T10:00:00.000Z' };
          page = { ...page, mails: [queued, sent] };
          return { body: queued };
        },
      }),
    );
    const { user } = renderApp('/mail');

    const table = await screen.findByRole('table', { name: 'Mail sent by Crumbproof, newest first' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(3);
    const failedRow = within(table)
      .getByText(/to ines@crumbproof.test/)
      .closest('tr')!;
    expect(within(failedRow).getByText('Not sent')).toBeInTheDocument();
    expect(within(failedRow).getByText('5 of 5')).toBeInTheDocument();
    expect(within(failedRow).getByText(/ECONNREFUSED/)).toBeInTheDocument();
    const sentRow = within(table)
      .getByText(/to teodor@crumbproof.test/)
      .closest('tr')!;
    expect(within(sentRow).getByText('Sent')).toBeInTheDocument();
    expect(within(sentRow).queryByRole('button')).not.toBeInTheDocument();

    await user.click(within(failedRow).getByRole('button', { name: /^Send again/ }));
    expect(await screen.findByText(/is queued to be sent again now/)).toBeInTheDocument();
    expect(await within(table).findByText('Waiting to be sent')).toBeInTheDocument();
    expect(calls.some((c) => c.method === 'POST' && c.path === '/api/mail/outbox/7/retry')).toBe(true);
  });

  it('says when no mail server is set', async () => {
    mockApi(signedInAs('manager', { 'GET /api/mail/outbox': { body: { mails: [], total: 0, sending: false, maxAttempts: 5 } } }));
    renderApp('/mail');
    expect(await screen.findByText('No mail server is set')).toBeInTheDocument();
    expect(screen.getByText(/No mail yet/)).toBeInTheDocument();
  });

  it('is the manager’s page only', async () => {
    mockApi(signedInAs('pastry-chef'));
    renderApp('/mail');
    expect(await screen.findByRole('heading', { name: 'Not available to your role' })).toBeInTheDocument();
  });
});
