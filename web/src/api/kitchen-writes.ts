import { hashKey, matchQuery, type QueryClient, type QueryKey } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import { KITCHEN_DATA_ROOTS } from './query-keys';

/** An answer the write itself returned (the item as saved): it goes into the cache as it is. */
export interface SavedAnswer {
  queryKey: QueryKey;
  data: unknown;
}

export interface KitchenWrite {
  /** The write's error, when it failed. */
  error?: unknown;
  /** What a successful write returned for the items it saved. */
  saved?: readonly SavedAnswer[];
  /**
   * Queries a form on screen is built from (the item being edited, the ingredient whose
   * specification was uploaded). They are read again in the background rather than dropped, so
   * the form and what was typed into it stay on screen.
   */
  editing?: readonly QueryKey[];
}

/** The API refused the write (4xx): by the API's rule nothing was saved. */
function refused(error: unknown): boolean {
  return isApiError(error) && error.status >= 400 && error.status < 500;
}

/**
 * The one refresh after a write to the kitchen's data: an ingredient created, updated or
 * imported, a recipe saved, a swap applied, a specification uploaded, the kitchen's settings
 * changed. Any of them can change any declaration above the item (and the product lists, the
 * claims, where each item is used, the specification state), so every cached answer under
 * `KITCHEN_DATA_ROOTS` is dropped and the ones on screen are read again.
 *
 * Dropped, not marked stale: a stale answer is still shown while it is read again, and a
 * declaration from before the write must not be shown even for that moment. Dropping also
 * cancels a read still in flight, so an answer the API computed before the write cannot land
 * in the cache after it.
 *
 * Every such write calls it when it settles: after a success; after a failure whose outcome is
 * not known (the connection dropped, the server failed), since the write may have been saved;
 * not after a refusal, which saved nothing.
 */
export function refreshAfterKitchenWrite(queryClient: QueryClient, { error, saved = [], editing = [] }: KitchenWrite = {}): void {
  const failed = error !== undefined && error !== null;
  if (failed && refused(error)) return;
  const keep = new Set<string>();
  for (const answer of failed ? [] : saved) {
    // A read of the same item started before the write must not overwrite what the write returned.
    void queryClient.cancelQueries({ queryKey: answer.queryKey, exact: true });
    queryClient.setQueryData(answer.queryKey, answer.data);
    keep.add(hashKey(answer.queryKey));
  }
  for (const queryKey of editing) {
    if (keep.has(hashKey(queryKey))) continue;
    void queryClient.invalidateQueries({ queryKey, exact: true });
    keep.add(hashKey(queryKey));
  }
  void queryClient.resetQueries({
    predicate: (query) => !keep.has(query.queryHash) && KITCHEN_DATA_ROOTS.some((root) => matchQuery({ queryKey: root }, query)),
  });
}
