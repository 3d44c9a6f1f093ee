import { Stack } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { useMe } from '@/features/auth/api/get-me';
import { SignedInUserProvider } from '@/lib/signed-in-user';

interface RequireSignInProps {
  children: ReactNode;
}

/** Shows its children only to a signed-in person; everyone else goes to /sign-in and comes back after. */
export function RequireSignIn({ children }: RequireSignInProps) {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <Stack align="center" justify="center" minH="60dvh">
        <Loading size="lg">Checking who is signed in…</Loading>
      </Stack>
    );
  }

  if (me.isError) {
    return (
      <Stack as="main" maxW="xl" mx="auto" p="8">
        <LoadFailed title="Crumbproof could not check who is signed in" error={me.error} onRetry={() => void me.refetch()} />
      </Stack>
    );
  }

  if (me.data === null) {
    return <Navigate to="/sign-in" replace state={{ from: `${location.pathname}${location.search}` }} />;
  }

  return <SignedInUserProvider me={me.data}>{children}</SignedInUserProvider>;
}
