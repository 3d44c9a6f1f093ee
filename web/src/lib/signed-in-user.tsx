import type { KitchenRole, Me } from '@crumbproof/shared';
import { createContext, useContext, type ReactNode } from 'react';

const SignedInUserContext = createContext<Me | null>(null);

interface SignedInUserProviderProps {
  me: Me;
  children: ReactNode;
}

/**
 * Holds the person the sign-in guard let through. Pages read it from here rather than from the
 * query cache, so signing out (which clears the cache) never leaves a page without a person.
 */
export function SignedInUserProvider({ me, children }: SignedInUserProviderProps) {
  return <SignedInUserContext.Provider value={me}>{children}</SignedInUserContext.Provider>;
}

export function useSignedInUser(): Me {
  const me = useContext(SignedInUserContext);
  if (!me) throw new Error('useSignedInUser was used outside the signed-in part of the app.');
  return me;
}

/** The kitchen the app answers for, with the person's role there; null before any kitchen is set up. */
export function useWorkingKitchen(): KitchenRole | null {
  const me = useSignedInUser();
  return me.kitchens.find((kitchen) => kitchen.id === me.kitchen) ?? null;
}
