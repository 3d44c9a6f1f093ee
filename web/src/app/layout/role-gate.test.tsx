import type { Role } from '@crumbproof/shared';
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs, USERS } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

describe('Pages a role may not use', () => {
  it('refuses /users to front of house, naming the role and who can open it', async () => {
    const { calls } = mockApi(signedInAs('front-of-house', { 'GET /api/users': { body: USERS } }));
    renderApp('/users');

    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
    expect(
      screen.getByText('You are signed in as Front of house. Only Manager accounts can open Users. Ask your manager if you need it.'),
    ).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Users' })).not.toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    expect(calls.some((call) => call.path === '/api/users')).toBe(false);
    expect(screen.getByRole('link', { name: 'Go to your first page' })).toHaveAttribute('href', '/counter');
  });

  it.each<{ role: Role; path: string; sentence: RegExp }>([
    { role: 'front-of-house', path: '/ingredients', sentence: /Only Manager and Pastry chef accounts can open Ingredients\./ },
    { role: 'front-of-house', path: '/approvals', sentence: /Only Manager and Pastry chef accounts can open Approvals\./ },
    { role: 'pastry-chef', path: '/audit', sentence: /Only Manager accounts can open Audit\./ },
    { role: 'pastry-chef', path: '/users', sentence: /Only Manager accounts can open Users\./ },
  ])('refuses $path to $role', async ({ role, path, sentence }) => {
    mockApi(signedInAs(role));
    renderApp(path);

    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
    expect(screen.getByText(sentence)).toBeInTheDocument();
  });
});
