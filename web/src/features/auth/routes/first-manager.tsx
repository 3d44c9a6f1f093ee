import { Box, Heading, Link, Stack, Text } from '@chakra-ui/react';
import type { Me } from '@crumbproof/shared';
import { useEffect, useState } from 'react';
import { Link as RouterLink, useLocation, useNavigate } from 'react-router-dom';
import { BrandMark } from '@/components/ui/brand-mark';
import { ErrorAlert } from '@/components/ui/error-alert';
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
    <Box w="full" maxW="md" mx="auto" bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="lg" p={{ base: '6', md: '8' }}>
      <Stack gap="6">
        <Stack gap="3" align="flex-start">
          <BrandMark size="40px" />
          <Heading as="h1" size="2xl">
            Set the first manager
          </Heading>
          <Text color="fg.muted">This kitchen has no manager yet. The manager adds everyone else and chooses what they may do.</Text>
        </Stack>
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
      </Stack>
    </Box>
  );
}
