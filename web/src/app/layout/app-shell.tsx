import { Box } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Outlet } from 'react-router-dom';
import { NavigationProgress } from '../routes/page-loading';
import { CautionFooter } from './caution-footer';
import { MAIN_ID, SkipLink } from './skip-link';

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
      <NavigationProgress />
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
