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
          const message = `${input.name} was invited: a link to choose a password is on its way to ${input.email}.`;
          return { status: 201, body: { ...created, outcome: 'created', message } };
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
    // The API's words for a new account, and how long the mailed link works.
    expect(
      within(form).getByText(
        'Ines Moreau was invited: a link to choose a password is on its way to ines@crumbproof.test. The link works for 72 hours; once they have chosen a password they sign in as Pastry chef.',
      ),
    ).toBeInTheDocument();
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

  it('puts the API’s answer for someone already at this kitchen under Email', async () => {
    const message =
      'Teodor Lind (teodor@crumbproof.test) already works at Larch Street Bakehouse, as pastry chef. Change their role in the list instead.';
    mockApi(
      signedInAs('manager', {
        'GET /api/users': { body: USERS },
        'POST /api/users/invitations': {
          status: 409,
          body: {
            statusCode: 409,
            code: 'conflict',
            message,
            fields: [{ path: 'email', message: 'Already works at Larch Street Bakehouse.' }],
          },
        },
      }),
    );
    const { user } = renderApp('/users');

    const form = await screen.findByRole('form', { name: 'Invite a user' });
    await user.type(within(form).getByLabelText('Name'), 'Teodor Again');
    await user.type(within(form).getByLabelText('Email'), 'teodor@crumbproof.test');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(form).findByText(message)).toBeInTheDocument();
    expect(within(form).getByLabelText('Email')).toHaveAttribute('aria-invalid', 'true');
  });

  it('says how many other kitchens someone also works at', async () => {
    const users: User[] = [
      { ...USERS[0]!, elsewhere: 0 },
      { ...USERS[1]!, elsewhere: 2 },
      { ...USERS[2]!, elsewhere: 1 },
    ];
    mockApi(signedInAs('manager', { 'GET /api/users': { body: users } }));
    renderApp('/users');

    await screen.findByRole('table');
    expect(within(rowFor('Teodor Lind')).getByText('Also works at 2 other kitchens')).toBeInTheDocument();
    expect(within(rowFor('Priya Sandhu')).getByText('Also works at 1 other kitchen')).toBeInTheDocument();
    expect(within(rowFor('Maren Okafor')).queryByText(/Also works at/)).not.toBeInTheDocument();
  });

  it('adds someone who works at another kitchen in the role chosen, in the API’s words, and reads the list again', async () => {
    let users: User[] = [...USERS];
    const added: User = {
      id: 4,
      email: 'ines@crumbproof.test',
      name: 'Ines Duarte',
      role: 'pastry-chef',
      active: true,
      invitationPending: false,
      createdAt: '2026-01-10T09:00:00.000Z',
      elsewhere: 1,
    };
    const message =
      'ines@crumbproof.test already has a Crumbproof account, as Ines Duarte: they now work at Larch Street Bakehouse too, as pastry chef, and sign in with their own password (no invitation or new password was sent).';
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': () => ({ body: users }),
        'POST /api/users/invitations': () => {
          users = [...users, added];
          return { status: 201, body: { ...added, outcome: 'added', message } };
        },
      }),
    );
    const { user } = renderApp('/users');

    const form = await screen.findByRole('form', { name: 'Invite a user' });
    expect(within(form).getByText(/Someone who already works at another kitchen keeps their own account/)).toBeInTheDocument();
    await user.type(within(form).getByLabelText('Name'), 'Ines');
    await user.type(within(form).getByLabelText('Email'), 'ines@crumbproof.test');
    await user.selectOptions(within(form).getByLabelText('Role at Larch Street Bakehouse'), 'Pastry chef');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));

    // The API's words alone: no invitation was sent, so nothing is said of a link.
    expect(await within(form).findByText(message)).toBeInTheDocument();
    expect(within(form).queryByText(/72 hours/)).not.toBeInTheDocument();
    // The list is read again and shows them by the name of their account, with their other kitchen.
    const row = await waitFor(() => rowFor('Ines Duarte'));
    expect(within(row).getByText('Also works at 1 other kitchen')).toBeInTheDocument();
    expect(within(row).getByRole('combobox', { name: 'Role for Ines Duarte' })).toHaveValue('pastry-chef');
    expect(within(row).queryByText('Invited, no password yet')).not.toBeInTheDocument();
    expect(calls.filter((call) => call.method === 'GET' && call.path === '/api/users')).toHaveLength(2);
  });

  it('takes someone off this kitchen after saying what happens, and reads the list again', async () => {
    let users: User[] = [{ ...USERS[0]!, elsewhere: 0 }, { ...USERS[1]!, elsewhere: 2 }, USERS[2]!];
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': () => ({ body: users }),
        'DELETE /api/users/2/kitchen': () => {
          users = users.filter((u) => u.id !== 2);
          return {
            body: {
              id: 2,
              kitchen: 1,
              elsewhere: 2,
              message: 'Teodor Lind no longer works at Larch Street Bakehouse. Their account stays, for the 2 other kitchens they work at.',
            },
          };
        },
      }),
    );
    const { user } = renderApp('/users');

    // Not on the manager's own row.
    await screen.findByRole('table');
    expect(within(rowFor('Maren Okafor')).queryByRole('button', { name: /off this kitchen/ })).not.toBeInTheDocument();

    await user.click(within(rowFor('Teodor Lind')).getByRole('button', { name: 'Take Teodor Lind off this kitchen' }));
    const ask = await screen.findByRole('alertdialog', { name: 'Take Teodor Lind off Larch Street Bakehouse?' });
    expect(ask).toHaveTextContent('their role here (Pastry chef) goes, and their sessions end now');
    expect(ask).toHaveTextContent('Their account stays, with its name and password, and so do the 2 other kitchens they work at.');
    // Nothing is sent until the manager confirms.
    await user.click(within(ask).getByRole('button', { name: 'Keep them here' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(calls.some((call) => call.method === 'DELETE')).toBe(false);

    await user.click(within(rowFor('Teodor Lind')).getByRole('button', { name: 'Take Teodor Lind off this kitchen' }));
    const again = await screen.findByRole('alertdialog', { name: 'Take Teodor Lind off Larch Street Bakehouse?' });
    await user.click(within(again).getByRole('button', { name: 'Take off this kitchen' }));

    expect(
      await screen.findByText(
        'Teodor Lind no longer works at Larch Street Bakehouse. Their account stays, for the 2 other kitchens they work at.',
      ),
    ).toBeInTheDocument();
    await waitFor(() => expect(within(screen.getByRole('table')).queryByText('Teodor Lind')).not.toBeInTheDocument());
    const deletes = calls.filter((call) => call.method === 'DELETE');
    expect(deletes.map((call) => [call.path, call.kitchen])).toEqual([['/api/users/2/kitchen', '1']]);
    expect(calls.filter((call) => call.method === 'GET' && call.path === '/api/users')).toHaveLength(2);
  });

  it('says so when the person works at no other kitchen', async () => {
    mockApi(signedInAs('manager', { 'GET /api/users': { body: USERS.map((u) => ({ ...u, elsewhere: 0 })) } }));
    const { user } = renderApp('/users');

    await user.click(await screen.findByRole('button', { name: 'Take Priya Sandhu off this kitchen' }));
    const ask = await screen.findByRole('alertdialog', { name: 'Take Priya Sandhu off Larch Street Bakehouse?' });
    expect(ask).toHaveTextContent('they work at no other kitchen: a manager can add them again by their email');
  });

  it('shows the API’s refusal in words, and reads the list again', async () => {
    // Another manager took Priya off this kitchen since the list was read.
    let users: User[] = [...USERS];
    const refusal = 'There is no user 3 at this kitchen (Larch Street Bakehouse).';
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': () => ({ body: users }),
        'DELETE /api/users/3/kitchen': () => {
          users = users.filter((u) => u.id !== 3);
          return { status: 404, body: { statusCode: 404, code: 'not-found', message: refusal } };
        },
      }),
    );
    const { user } = renderApp('/users');

    await user.click(await screen.findByRole('button', { name: 'Take Priya Sandhu off this kitchen' }));
    const ask = await screen.findByRole('alertdialog', { name: 'Take Priya Sandhu off Larch Street Bakehouse?' });
    await user.click(within(ask).getByRole('button', { name: 'Take off this kitchen' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Nobody was taken off this kitchen');
    expect(alert).toHaveTextContent(refusal);
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    // The list read again shows the kitchen as it is now.
    await waitFor(() => expect(within(screen.getByRole('table')).queryByText('Priya Sandhu')).not.toBeInTheDocument());
    expect(calls.filter((call) => call.method === 'GET' && call.path === '/api/users')).toHaveLength(2);

    // Asking for another change clears the refusal.
    await user.click(screen.getByRole('button', { name: 'Deactivate Teodor Lind' }));
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('warns that deactivating someone of other kitchens is for all of them, and shows the API’s refusal naming them', async () => {
    const refusal =
      'You cannot deactivate Teodor Lind’s account: it is theirs at every kitchen they work in, and you are not a manager at Saltmarsh Yard Café. A manager of every kitchen they work in can; or take them off this kitchen instead.';
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/users': { body: [USERS[0]!, { ...USERS[1]!, elsewhere: 1 }, USERS[2]!] },
        'PATCH /api/users/2': { status: 403, body: { statusCode: 403, code: 'forbidden', message: refusal } },
      }),
    );
    const { user } = renderApp('/users');

    await user.click(await screen.findByRole('button', { name: 'Deactivate Teodor Lind' }));
    const ask = await screen.findByRole('alertdialog', { name: 'Deactivate Teodor Lind?' });
    expect(ask).toHaveTextContent('can no longer sign in, here or at the 1 other kitchen they work at');
    expect(ask).toHaveTextContent('to stop them working here only, take them off this kitchen instead');
    await user.click(within(ask).getByRole('button', { name: 'Deactivate Teodor Lind' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('That change was not saved');
    expect(alert).toHaveTextContent(refusal);
    expect(screen.getByRole('button', { name: 'Deactivate Teodor Lind' })).toBeInTheDocument();
    expect(calls.filter((call) => call.method === 'PATCH').map((call) => call.body)).toEqual([{ active: false }]);
  });

  it('says a role change is for this kitchen only when the person works at others', async () => {
    mockApi(signedInAs('manager', { 'GET /api/users': { body: [USERS[0]!, { ...USERS[1]!, elsewhere: 2 }, USERS[2]!] } }));
    const { user } = renderApp('/users');

    await user.selectOptions(await screen.findByRole('combobox', { name: 'Role for Teodor Lind' }), 'Manager');
    const ask = await screen.findByRole('alertdialog', { name: 'Make Teodor Lind Manager?' });
    expect(ask).toHaveTextContent('Their role at the 2 other kitchens they work at stays as it is.');
  });
});
