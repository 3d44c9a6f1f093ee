import { Link, Stack, Text } from '@chakra-ui/react';
import type { Me } from '@crumbproof/shared';
import { useEffect, useState } from 'react';
import { Link as RouterLink, useLocation, useNavigate } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { AuthCard } from '../components/auth-card';
import { FirstManagerForm } from '../components/first-manager-form';

/** Sets the first manager of a kitchen's own installation, with the one-time link its first start printed. */
export function FirstManagerRoute() {
  const location = useLocation();
  const navigate = useNavigate();
  // The token is in the link's fragment (#token=…), which never reaches a server or its log.
  // It is read once, then taken out of the address bar and the history.
  const [token] = useState(() => new URLSearchParams(location.hash.slice(1)).get('token'));
  const [manager, setManager] = useState<Me | null>(null);

  useEffect(() => {
    document.title = 'First manager · Crumbproof';
  }, []);

  useEffect(() => {
    if (location.hash) void navigate(location.pathname, { replace: true });
  }, [location.hash, location.pathname, navigate]);

  return (
    <AuthCard
      title="Set the first manager"
      lead="This kitchen has no manager yet. The manager adds everyone else and chooses what they may do."
    >
      {manager ? (
        <Stack gap="4" role="status">
          <Text>
            {manager.name} is the kitchen’s manager. Sign in with {manager.email} and the password you chose.
          </Text>
          <Link asChild fontWeight="bold">
            <RouterLink to="/sign-in">Sign in</RouterLink>
          </Link>
        </Stack>
      ) : token ? (
        <FirstManagerForm token={token} onSet={setManager} />
      ) : (
        <ErrorAlert>
          Open the one-time link that Crumbproof printed when it started, with its whole address. Restart Crumbproof to print a new one.
        </ErrorAlert>
      )}
    </AuthCard>
  );
}
