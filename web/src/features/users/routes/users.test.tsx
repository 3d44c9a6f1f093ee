import type { User } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs, USERS } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

function rowFor(name: string): HTMLElement {
  const cell = within(screen.getByRole('table')).getByText(name);
  const row = cell.closest('tr');
  if (!row) throw new Error(`No row for ${name}`);
  return row;
}

describe('Users page', () => {
  it('lists the kitchen’s users with role, status and date', async () => {
    mockApi(signedInAs('manager', { 'GET /api/users': { body: USERS } }));
    renderApp('/users');

    expect(await screen.findByRole('heading', { level: 1, name: 'Users' })).toBeInTheDocument();
    const table = await screen.findByRole('table', { name: 'People who can sign in to this kitchen' });
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((header) => header.textContent);
    expect(headers).toEqual(['Name', 'Email', 'Role here', 'Active', 'Created', 'Access']);
    // One header row and one row per user.
    expect(within(table).getAllByRole('row')).toHaveLength(USERS.length + 1);

    const chef = rowFor('Teodor Lind');
    // The email and the date are in their columns, and folded in under the name for narrower screens.
    expect(within(chef).getAllByText('teodor@crumbproof.test')).toHaveLength(2);
    expect(within(chef).getByText('Created 4 Mar 2026')).toBeInTheDocument();
    expect(within(chef).getByRole('combobox', { name: 'Role for Teodor Lind' })).toHaveValue('pastry-chef');
    expect(within(chef).getByText('Active')).toBeInTheDocument();
    expect(within(chef).getByText('4 Mar 2026')).toBeInTheDocument();
    expect(within(chef).getByRole('button', { name: 'Deactivate Teodor Lind' })).toBeInTheDocument();

    const counter = rowFor('Priya Sandhu');
    expect(within(counter).getByText('Deactivated')).toBeInTheDocument();
    expect(within(counter).getByRole('button', { name: 'Reactivate Priya Sandhu' })).toBeInTheDocument();

    // A manager cannot lock themself out from this table.
    const own = rowFor('Maren Okafor');
    expect(within(own).getByRole('combobox', { name: 'Role for Maren Okafor' })).toBeDisabled();
    expect(within(own).queryByRole('button')).not.toBeInTheDocument();
  });

  it('changes a role and deactivates a user, then reloads the list', async () => {
    let users: User[] = USERS.map((user) => ({ ...user }));
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': () => ({ body: users }),
        'PATCH /api/users/2': ({ body }) => {
          users = users.map((user) => (user.id === 2 ? { ...user, ...(body as Partial<User>) } : user));
          return { body: users.find((user) => user.id === 2) };
        },
      }),
    );
    const { user } = renderApp('/users');

    const select = await screen.findByRole('combobox', { name: 'Role for Teodor Lind' });
    await user.selectOptions(select, 'Front of house');
    // Nothing is sent until the manager confirms, and the question says what the role may do.
    const ask = await screen.findByRole('alertdialog', { name: 'Make Teodor Lind Front of house?' });
    expect(ask).toHaveTextContent('will be able to read declarations and answer customers at the counter, without editing anything');
    expect(calls.some((call) => call.method === 'PATCH')).toBe(false);
    await user.click(within(ask).getByRole('button', { name: 'Make Front of house' }));
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Role for Teodor Lind' })).toHaveValue('front-of-house'));
    expect(await screen.findByText(/Teodor Lind is now Front of house: they can read declarations/)).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Deactivate Teodor Lind' }));
    // The earlier result is cleared as soon as another change is asked for.
    expect(screen.queryByText(/Teodor Lind is now Front of house/)).not.toBeInTheDocument();
    const deactivate = await screen.findByRole('alertdialog', { name: 'Deactivate Teodor Lind?' });
    await user.click(within(deactivate).getByRole('button', { name: 'Deactivate Teodor Lind' }));
    expect(await screen.findByRole('button', { name: 'Reactivate Teodor Lind' })).toBeInTheDocument();
    expect(await screen.findByText('Teodor Lind is deactivated and can no longer sign in.')).toBeInTheDocument();

    const patches = calls.filter((call) => call.method === 'PATCH');
    expect(patches.map((call) => call.body)).toEqual([{ role: 'front-of-house' }, { active: false }]);
    // Each change invalidated the users query, so the list was fetched again.
    expect(calls.filter((call) => call.method === 'GET' && call.path === '/api/users')).toHaveLength(3);
  });

  it('keeps the role when the manager answers no to the question', async () => {
    const { calls } = mockApi(signedInAs('manager', { 'GET /api/users': { body: USERS } }));
    const { user } = renderApp('/users');
    await user.selectOptions(await screen.findByRole('combobox', { name: 'Role for Teodor Lind' }), 'Manager');
    const ask = await screen.findByRole('alertdialog', { name: 'Make Teodor Lind Manager?' });
    await user.click(within(ask).getByRole('button', { name: /^Keep / }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(screen.getByRole('combobox', { name: 'Role for Teodor Lind' })).not.toHaveValue('manager');
    expect(calls.some((call) => call.method === 'PATCH')).toBe(false);
  });

  it('invites a user by name, email and role, and shows them as invited', async () => {
    let users: User[] = [...USERS];
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': () => ({ body: users }),
        'POST /api/users/invitations': ({ body }) => {
          const input = body as { email: string; name: string; role: User['role'] };
          const created: User = { id: 4, ...input, active: true, invitationPending: true, createdAt: '2026-12-01T10:00:00.000Z' };
          users = [...users, created];
          return { status: 201, body: created };
        },
        'POST /api/users/4/invitation': () => ({ body: users.find((u) => u.id === 4) }),
      }),
    );
    const { user } = renderApp('/users');

    const form = await screen.findByRole('form', { name: 'Invite a user' });
    expect(within(form).queryByLabelText('Password')).not.toBeInTheDocument();
    await user.type(within(form).getByLabelText('Name'), 'Ines Moreau');
    await user.type(within(form).getByLabelText('Email'), 'ines@crumbproof.test');
    await user.selectOptions(within(form).getByLabelText('Role at Larch Street Bakehouse'), 'Pastry chef');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(screen.getByRole('table')).findByText('Ines Moreau')).toBeInTheDocument();
    expect(screen.getByText(/Invitation sent to ines@crumbproof.test/)).toBeInTheDocument();
    expect(calls.find((call) => call.method === 'POST')?.body).toEqual({
      name: 'Ines Moreau',
      email: 'ines@crumbproof.test',
      role: 'pastry-chef',
    });
    expect(within(form).getByLabelText('Name')).toHaveValue('');

    const row = rowFor('Ines Moreau');
    expect(within(row).getByText('Invited, no password yet')).toBeInTheDocument();
    expect(within(rowFor('Teodor Lind')).queryByRole('button', { name: /Send the invitation again/ })).not.toBeInTheDocument();
    await user.click(within(row).getByRole('button', { name: 'Send the invitation again to Ines Moreau' }));
    expect(await screen.findByText(/A new invitation is on its way to ines@crumbproof.test/)).toBeInTheDocument();
    expect(calls.some((call) => call.method === 'POST' && call.path === '/api/users/4/invitation')).toBe(true);
  });

  it('checks the fields before sending', async () => {
    const { calls } = mockApi(signedInAs('manager', { 'GET /api/users': { body: USERS } }));
    const { user } = renderApp('/users');

    const form = await screen.findByRole('form', { name: 'Invite a user' });
    await user.type(within(form).getByLabelText('Email'), 'not-an-address');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(form).findByText('Enter the person’s name.')).toBeInTheDocument();
    expect(within(form).getByText('Enter an email address such as name@example.com.')).toBeInTheDocument();
    expect(calls.some((call) => call.method === 'POST')).toBe(false);
  });

  it('puts the API’s duplicate-email answer under Email', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/users': { body: USERS },
        'POST /api/users/invitations': {
          status: 409,
          body: { statusCode: 409, code: 'conflict', message: 'A user with that email already exists.' },
        },
      }),
    );
    const { user } = renderApp('/users');

    const form = await screen.findByRole('form', { name: 'Invite a user' });
    await user.type(within(form).getByLabelText('Name'), 'Teodor Again');
    await user.type(within(form).getByLabelText('Email'), 'teodor@crumbproof.test');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(form).findByText('A user with that email already exists.')).toBeInTheDocument();
    expect(within(form).getByLabelText('Email')).toHaveAttribute('aria-invalid', 'true');
  });
});
