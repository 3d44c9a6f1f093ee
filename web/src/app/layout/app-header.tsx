import { Box, Button, Flex, HStack, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS } from '@crumbproof/shared';
import { useNavigate } from 'react-router-dom';
import { BrandMark } from '@/components/ui/brand-mark';
import { useSignOut } from '@/features/auth/api/sign-out';
import { useSignedInUser } from '@/lib/signed-in-user';
import { KitchenSwitcher } from './kitchen-switcher';
import { MainNav } from './main-nav';

export function AppHeader() {
  const me = useSignedInUser();
  const navigate = useNavigate();
  const signOut = useSignOut({ onSignedOut: () => navigate('/sign-in', { replace: true, flushSync: true }) });

  function handleSignOut() {
    signOut.mutate();
  }

  return (
    <Box as="header" bg="bg.panel" borderBottomWidth="1px" borderColor="border.muted">
      <Flex maxW="6xl" mx="auto" px={{ base: '4', md: '8' }} pt="3" pb="1" gap="4" wrap="wrap" align="center" justify="space-between">
        <HStack gap="3">
          <BrandMark />
          <Stack gap="0">
            <Text fontWeight="bold" fontSize="lg" lineHeight="short">
              Crumbproof
            </Text>
            <KitchenSwitcher />
          </Stack>
        </HStack>
        <HStack gap="4" wrap="wrap">
          <Stack gap="0" textAlign="end">
            <Text fontWeight="bold">{me.name}</Text>
            <Text color="fg.muted" fontSize="sm">
              {ROLE_LABELS[me.role]}
            </Text>
          </Stack>
          <Button variant="outline" size="lg" onClick={handleSignOut} loading={signOut.isPending} loadingText="Signing out…">
            Sign out
          </Button>
        </HStack>
      </Flex>
      <MainNav role={me.role} />
    </Box>
  );
}
