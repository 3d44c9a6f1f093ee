import { Button, Spinner, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
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
      <Stack role="status" align="center" justify="center" minH="60dvh" gap="3">
        <Spinner color="accent.solid" size="lg" />
        <Text>Checking who is signed in…</Text>
      </Stack>
    );
  }

  if (me.isError) {
    return (
      <Stack as="main" maxW="xl" mx="auto" p="8" gap="4">
        <ErrorAlert title="Crumbproof could not check who is signed in">{me.error.message}</ErrorAlert>
        <Button alignSelf="flex-start" size="lg" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </Stack>
    );
  }

  if (me.data === null) {
    return <Navigate to="/sign-in" replace state={{ from: `${location.pathname}${location.search}` }} />;
  }

  return <SignedInUserProvider me={me.data}>{children}</SignedInUserProvider>;
}
