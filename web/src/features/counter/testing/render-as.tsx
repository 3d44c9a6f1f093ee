import type { Role } from '@crumbproof/shared';
import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactNode } from 'react';
import { AppProviders } from '@/app/providers';
import { createQueryClient } from '@/lib/query-client';
import { SignedInUserProvider } from '@/lib/signed-in-user';
import { mockApi, PEOPLE, type ApiHandlers } from '@/testing/mock-api';

/** Renders one of the counter's views as a signed-in person of the role, against a mocked API and an empty cache. */
export function renderAs(role: Role, handlers: ApiHandlers, ui: ReactNode) {
  const api = mockApi(handlers);
  const queryClient = createQueryClient();
  queryClient.setDefaultOptions({ queries: { retry: false }, mutations: { retry: false } });
  const user = userEvent.setup();
  render(
    <AppProviders queryClient={queryClient}>
      <SignedInUserProvider me={PEOPLE[role]}>{ui}</SignedInUserProvider>
    </AppProviders>,
  );
  return { ...api, user, queryClient };
}
