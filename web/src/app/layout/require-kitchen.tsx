import { Stack } from '@chakra-ui/react';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import { queryKeys } from '@/api/query-keys';
import { Loading } from '@/components/ui/loading';
import { ChooseKitchen } from '@/features/auth/components/choose-kitchen';
import { kitchenToWorkIn } from '@/lib/kitchen-choice';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useCurrentKitchen, useWorkIn } from '@/lib/use-work-in';
import { ShellFrame } from './app-shell';

interface RequireKitchenProps {
  children: ReactNode;
}

/**
 * Shows its children once who is signed in has been read for the kitchen every request names.
 * Someone of one kitchen works there without being asked; someone of several, in the one they
 * chose last in this browser, or they are asked first. Before any kitchen is set up (a new
 * installation) nothing is named and the app works as it always did.
 */
export function RequireKitchen({ children }: RequireKitchenProps) {
  const me = useSignedInUser();
  const chosen = useCurrentKitchen();
  const workIn = useWorkIn();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const ready = me.kitchens.length === 0 || (chosen !== null && me.kitchen === chosen && me.kitchens.some((k) => k.id === chosen));
  const next = ready ? null : kitchenToWorkIn(me);

  useEffect(() => {
    if (next === null) return;
    // Already named but read for another: read who is signed in again, for this one.
    if (next === chosen) void queryClient.invalidateQueries({ queryKey: queryKeys.me() });
    else workIn(me, next);
  }, [me, next, chosen, workIn, queryClient]);

  if (ready) return children;
  if (next === null) {
    return (
      <ShellFrame>
        <ChooseKitchen
          me={me}
          onChoose={(kitchen) => workIn(me, kitchen.id)}
          onSignedOut={() => navigate('/sign-in', { replace: true, flushSync: true })}
        />
      </ShellFrame>
    );
  }
  const name = me.kitchens.find((k) => k.id === next)?.name;
  return (
    <Stack align="center" justify="center" minH="60dvh">
      <Loading size="lg">{name ? `Opening ${name}…` : 'Opening your kitchen…'}</Loading>
    </Stack>
  );
}
