import { useEffect, useRef } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { AppHeader } from './app-header';
import { ShellFrame } from './app-shell';
import { MAIN_ID } from './skip-link';
import { RequireSignIn } from './require-sign-in';

/** Everything behind the sign-in: loaded after it (a lazy route), so the sign-in page stays light. */
export function SignedInShell() {
  return (
    <RequireSignIn>
      <AppShell />
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
