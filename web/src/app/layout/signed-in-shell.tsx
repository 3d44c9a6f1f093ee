import { useEffect, useRef } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { useCurrentKitchen } from '@/lib/use-work-in';
import { AppHeader } from './app-header';
import { ShellFrame } from './app-shell';
import { MAIN_ID } from './skip-link';
import { RequireKitchen } from './require-kitchen';
import { RequireSignIn } from './require-sign-in';

/**
 * Everything behind the sign-in: loaded after it (a lazy route), so the sign-in page stays light.
 * It starts afresh for each kitchen (keyed by it): nothing read or typed for one kitchen is
 * shown in another.
 */
export function SignedInShell() {
  const kitchen = useCurrentKitchen();
  return (
    <RequireSignIn key={kitchen ?? 'none'}>
      <RequireKitchen>
        <AppShell />
      </RequireKitchen>
    </RequireSignIn>
  );
}

/** The frame of every workbench page: header with navigation, one main landmark, the caution. */
export function AppShell() {
  useFocusMainOnNavigation();
  return (
    <ShellFrame header={<AppHeader />}>
      <Outlet />
    </ShellFrame>
  );
}

/**
 * After moving to another page, put focus at the start of the new content so keyboard and
 * screen-reader users are not left on the link they followed. The first page load is left alone.
 */
function useFocusMainOnNavigation() {
  const { pathname } = useLocation();
  const previous = useRef(pathname);
  useEffect(() => {
    if (previous.current === pathname) return;
    previous.current = pathname;
    document.getElementById(MAIN_ID)?.focus({ preventScroll: false });
  }, [pathname]);
}
