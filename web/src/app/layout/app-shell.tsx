import { Box } from '@chakra-ui/react';
import { useEffect, useRef, type ReactNode } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { AppHeader } from './app-header';
import { CautionFooter } from './caution-footer';
import { MAIN_ID, SkipLink } from './skip-link';

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

interface ShellFrameProps {
  header?: ReactNode;
  children: ReactNode;
}

/** Shared by the signed-in shell and the sign-in page. */
export function ShellFrame({ header, children }: ShellFrameProps) {
  return (
    <Box minH="100dvh" display="flex" flexDirection="column" bg="bg.canvas" color="fg">
      <SkipLink />
      {header}
      <Box
        as="main"
        id={MAIN_ID}
        tabIndex={-1}
        flex="1"
        w="full"
        maxW="6xl"
        mx="auto"
        px={{ base: '4', md: '8' }}
        py={{ base: '6', md: '8' }}
        _focus={{ outline: 'none' }}
      >
        {children}
      </Box>
      <CautionFooter />
    </Box>
  );
}

/** The frame for pages seen before signing in. */
export function PublicShell() {
  return (
    <ShellFrame>
      <Outlet />
    </ShellFrame>
  );
}
