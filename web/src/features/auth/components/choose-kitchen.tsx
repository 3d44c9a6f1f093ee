import { Button, List, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type KitchenRole, type Me } from '@crumbproof/shared';
import { useEffect } from 'react';
import { useSignOut } from '../api/sign-out';
import { AuthCard } from './auth-card';

interface ChooseKitchenProps {
  me: Me;
  onChoose: (kitchen: KitchenRole) => void;
  /** Leave the signed-in pages once signed out (go to /sign-in). */
  onSignedOut: () => void | Promise<void>;
}

/**
 * "Which kitchen are you working in?": asked after sign-in of someone who works in several
 * kitchens and has not chosen one in this browser, before any kitchen's data is read.
 */
export function ChooseKitchen({ me, onChoose, onSignedOut }: ChooseKitchenProps) {
  const signOut = useSignOut({ onSignedOut });

  useEffect(() => {
    document.title = 'Choose a kitchen · Crumbproof';
  }, []);

  return (
    <AuthCard
      title="Which kitchen are you working in?"
      lead={`You work in ${me.kitchens.length} kitchens. Crumbproof answers for one at a time: its declarations, counter, labels and approvals. You can change kitchen at the top of every page.`}
    >
      <List.Root as="ul" listStyle="none" gap="3" aria-label="Your kitchens">
        {me.kitchens.map((kitchen) => (
          <List.Item key={kitchen.id}>
            <Button
              variant="outline"
              size="xl"
              w="full"
              h="auto"
              minH="16"
              py="3"
              justifyContent="flex-start"
              textAlign="start"
              whiteSpace="normal"
              borderColor="border"
              _hover={{ bg: 'accent.subtle' }}
              onClick={() => onChoose(kitchen)}
            >
              <Stack gap="0" align="flex-start">
                <Text as="span" fontWeight="bold" fontSize="lg">
                  {kitchen.name}
                </Text>{' '}
                <Text as="span" fontWeight="normal" color="fg.muted" fontSize="md">
                  {`Your role here: ${ROLE_LABELS[kitchen.role]}`}
                </Text>
              </Stack>
            </Button>
          </List.Item>
        ))}
      </List.Root>
      <Button variant="ghost" size="lg" alignSelf="flex-start" onClick={() => signOut.mutate()} loading={signOut.isPending}>
        Sign out
      </Button>
    </AuthCard>
  );
}
