import type { ReactNode } from 'react';
import { useSignedInUser } from '@/lib/signed-in-user';
import { canOpen, type PageKey } from '../navigation';
import { RefusedRoute } from '../routes/refused';

interface RoleGateProps {
  page: PageKey;
  children: ReactNode;
}

/** Renders the page only for roles the navigation map allows; the others see why not. */
export function RoleGate({ page, children }: RoleGateProps) {
  const me = useSignedInUser();
  if (!canOpen(me.role, page)) return <RefusedRoute page={page} role={me.role} />;
  return children;
}
