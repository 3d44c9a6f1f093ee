import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fieldsRefused, inesAt, mockApi, PEOPLE, signedInAs, signedOut } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

/** The API before and after a successful sign-in: /api/me answers 401 until then. */
function signInFlow(role: keyof typeof PEOPLE) {
  let signedIn = false;
  return mockApi({
    ...signedInAs(role),
    'GET /api/me': () => (signedIn ? { body: PEOPLE[role] } : signedOut['GET /api/me']) as never,
    'POST /api/auth/sign-in': () => {
      signedIn = true;
      return { body: PEOPLE[role] };
    },
    'GET /api/users': { body: [] },
  });
}

describe('Sign in', () => {
  it('sends a signed-out visitor to the sign-in page', async () => {
    mockApi(signedOut);
    renderApp('/recipes');
    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in to Crumbproof' })).toBeInTheDocument();
    expect(screen.queryByRole('navigation', { name: 'Main' })).not.toBeInTheDocument();
  });

  it('sends someone already signed in on to their first page', async () => {
    mockApi(signedInAs('pastry-chef', { 'GET /api/ingredients': { body: [] }, 'GET /api/specifications/status': { body: [] } }));
    const { router } = renderApp('/sign-in');
    await waitFor(() => expect(router.state.location.pathname).toBe('/ingredients'));
    expect(screen.queryByRole('button', { name: 'Sign in' })).not.toBeInTheDocument();
  });

  it('explains a badly formed email in place and sends nothing', async () => {
    const { calls } = mockApi(signedOut);
    const { user } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('Email'), 'maren-at-larch');
    await user.type(screen.getByLabelText('Password'), 'whatever');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter an email address such as name@example.com.')).toBeInTheDocument();
    const email = screen.getByLabelText('Email');
    expect(email).toHaveAttribute('aria-invalid', 'true');
    await waitFor(() => expect(email).toHaveAccessibleDescription('Enter an email address such as name@example.com.'));
    expect(calls.some((call) => call.path === '/api/auth/sign-in')).toBe(false);
  });

  it('shows the API’s message in an alert when the password is wrong', async () => {
    mockApi({
      ...signedOut,
      'POST /api/auth/sign-in': {
        status: 401,
        body: { statusCode: 401, code: 'bad-credentials', message: 'Email or password is not right.' },
      },
    });
    const { user } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('Email'), 'maren@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'not the password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('Email or password is not right.');
    expect(screen.getByRole('heading', { level: 1, name: 'Sign in to Crumbproof' })).toBeInTheDocument();
  });

  it('shows a validation error from the API beside its field', async () => {
    mockApi({
      ...signedOut,
      'POST /api/auth/sign-in': fieldsRefused({ password: 'Use at most 200 characters.' }),
    });
    const { user } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('Email'), 'maren@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'long');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Use at most 200 characters.')).toBeInTheDocument();
    await waitFor(() => expect(screen.getByLabelText('Password')).toHaveAccessibleDescription('Use at most 200 characters.'));
  });

  it('opens the role’s first page after signing in', async () => {
    const { calls } = signInFlow('front-of-house');
    const { user, router } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('Email'), '  Priya@Crumbproof.test ');
    await user.type(screen.getByLabelText('Password'), 'counter-pass-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Counter' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/counter');
    const signIn = calls.find((call) => call.path === '/api/auth/sign-in');
    // The shared schema trims and lower-cases the email, exactly as the API will.
    expect(signIn?.body).toEqual({ email: 'priya@crumbproof.test', password: 'counter-pass-1' });
    expect(signIn?.credentials).toBe('include');
  });

  it('asks someone of two kitchens which one they work in, then opens their first page there', async () => {
    let signedIn = false;
    const { calls } = mockApi({
      ...signedInAs('manager'),
      'GET /api/me': ({ kitchen }) => (signedIn ? { body: inesAt(kitchen) } : signedOut['GET /api/me']) as never,
      'POST /api/auth/sign-in': () => {
        signedIn = true;
        return { body: inesAt(null) };
      },
    });
    const { user, router } = renderApp('/sign-in');

    await user.type(await screen.findByLabelText('Email'), 'ines@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'two-kitchens-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Which kitchen are you working in?' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: /Saltmarsh Yard Café/ }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Counter' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/counter');
    expect(calls.find((call) => call.path === '/api/auth/sign-in')?.kitchen).toBeNull();
  });

  it('returns to the page the person asked for', async () => {
    signInFlow('manager');
    const { user, router } = renderApp('/users');

    await user.type(await screen.findByLabelText('Email'), 'maren@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'manager-pass-1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Users' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/users');
  });
});

describe('Sign out', () => {
  it('signs out, forgets the person and shows the sign-in page', async () => {
    let signedIn = true;
    const { calls } = mockApi({
      ...signedInAs('pastry-chef'),
      'GET /api/me': () => (signedIn ? { body: PEOPLE['pastry-chef'] } : signedOut['GET /api/me']) as never,
      'POST /api/auth/sign-out': () => {
        signedIn = false;
        return { status: 204 };
      },
    });
    const { user, router, queryClient } = renderApp('/recipes');

    const header = await screen.findByRole('banner');
    expect(await within(header).findByText('Larch Street Bakehouse')).toBeInTheDocument();
    expect(within(header).getByText('Teodor Lind')).toBeInTheDocument();
    expect(within(header).getByText('Pastry chef')).toBeInTheDocument();

    await user.click(within(header).getByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in to Crumbproof' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(calls.some((call) => call.method === 'POST' && call.path === '/api/auth/sign-out')).toBe(true);
    await waitFor(() => expect(queryClient.getQueryData(['kitchen'])).toBeUndefined());
    expect(queryClient.getQueryData(['me'])).toBeUndefined();
    // The signed-in pages were gone before the cache was cleared, so nothing refetched on the way out.
    expect(calls.filter((call) => call.path === '/api/kitchen')).toHaveLength(1);
  });
});
