import type { Me } from '@crumbproof/shared';
import { useEffect } from 'react';
import { Link, Text } from '@chakra-ui/react';
import { Link as RouterLink, Navigate, useLocation, useNavigate } from 'react-router-dom';
import { useMe } from '../api/get-me';
import { AuthCard } from '../components/auth-card';
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
    <AuthCard title="Sign in to Crumbproof" lead="Use the email and password your kitchen manager gave you.">
      <SignInForm onSignedIn={handleSignedIn} />
      <Text mt="5">
        <Link asChild>
          <RouterLink to="/forgot-password">Forgot your password?</RouterLink>
        </Link>
      </Text>
    </AuthCard>
  );
}
