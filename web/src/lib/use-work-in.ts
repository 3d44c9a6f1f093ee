import type { Me } from '@crumbproof/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useSyncExternalStore } from 'react';
import { currentKitchen, subscribeToKitchen, workIn } from './kitchen-choice';

/** The kitchen every request names, as React state: the signed-in part of the app is keyed by it. */
export function useCurrentKitchen(): number | null {
  return useSyncExternalStore(subscribeToKitchen, currentKitchen);
}

/**
 * Moves the app to another kitchen. Everything read for the one before is dropped first, so no
 * page shows its declarations, counter or approvals, not even for a frame: the signed-in part
 * of the app starts afresh and reads who is signed in (their role there) with the new kitchen.
 * `me` is who is signed in as last read: when it already answers for that kitchen (the only one
 * of a one-kitchen person), nothing needs reading again.
 */
export function useWorkIn() {
  const queryClient = useQueryClient();
  return useCallback(
    (me: Me, kitchen: number) => {
      if (me.kitchen !== kitchen) {
        void queryClient.cancelQueries();
        queryClient.clear();
      }
      workIn(me.id, kitchen);
    },
    [queryClient],
  );
}
