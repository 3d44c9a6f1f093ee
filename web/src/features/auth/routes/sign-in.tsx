import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { Me } from '@crumbproof/shared';
import { useEffect } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { useMe } from '../api/get-me';
import { BrandMark } from '@/components/ui/brand-mark';
import { SignInForm } from '../components/sign-in-form';

interface SignInRouteProps {
  /** Where a person lands when they did not ask for a particular page. */
  homeFor: (me: Me) => string;
}

function wantedPath(state: unknown): string | null {
  if (typeof state !== 'object' || state === null) return null;
  const from = (state as { from?: unknown }).from;
  if (typeof from !== 'string' || !from.startsWith('/') || from.startsWith('//') || from.startsWith('/sign-in')) {
    return null;
  }
  return from === '/' ? null : from;
}

export function SignInRoute({ homeFor }: SignInRouteProps) {
  const navigate = useNavigate();
  const location = useLocation();
  const me = useMe();

  useEffect(() => {
    document.title = 'Sign in · Crumbproof';
  }, []);

  function handleSignedIn(signedIn: Me) {
    void navigate(wantedPath(location.state) ?? homeFor(signedIn), { replace: true });
  }

  // Someone already signed in has nothing to do here.
  if (me.data) return <Navigate to={wantedPath(location.state) ?? homeFor(me.data)} replace />;

  return (
    <Box w="full" maxW="md" mx="auto" bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="lg" p={{ base: '6', md: '8' }}>
      <Stack gap="6">
        <Stack gap="3" align="flex-start">
          <BrandMark size="40px" />
          <Heading as="h1" size="2xl">
            Sign in to Crumbproof
          </Heading>
          <Text color="fg.muted">Use the email and password your kitchen manager gave you.</Text>
        </Stack>
        <SignInForm onSignedIn={handleSignedIn} />
      </Stack>
    </Box>
  );
}
