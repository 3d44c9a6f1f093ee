import { KITCHEN_HEADER, type Me } from '@crumbproof/shared';

/**
 * The kitchen the app answers for. Every request names it (the API client's header, the
 * `kitchen` query parameter of streams and links opened in a new tab); the person's choice is
 * kept in this browser, one per person, so it is still theirs after a reload.
 */

const STORAGE_PREFIX = 'crumbproof.kitchen.';

let current: number | null = null;
const listeners = new Set<() => void>();

function storageKey(userId: number): string {
  return `${STORAGE_PREFIX}${userId}`;
}

/** The kitchen every request names from now on; null before one is chosen (or when there are none yet). */
export function currentKitchen(): number | null {
  return current;
}

/** For useSyncExternalStore: the signed-in part of the app starts afresh whenever the kitchen changes. */
export function subscribeToKitchen(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function setCurrent(kitchen: number | null) {
  if (current === kitchen) return;
  current = kitchen;
  for (const listener of listeners) listener();
}

/** The kitchen this person last chose in this browser, if any. */
export function storedKitchen(userId: number): number | null {
  try {
    const value = Number(window.localStorage.getItem(storageKey(userId)));
    return Number.isInteger(value) && value > 0 ? value : null;
  } catch {
    // Storage can be refused (private windows, full quota): the person is simply asked again.
    return null;
  }
}

/** Names the kitchen on every request from now on, and keeps it as this person's choice. */
export function workIn(userId: number, kitchen: number) {
  try {
    window.localStorage.setItem(storageKey(userId), String(kitchen));
  } catch {
    // Not kept: the choice still holds until the page is reloaded.
  }
  setCurrent(kitchen);
}

/**
 * Stops naming a kitchen (signed out, or refused there); the stored choice stays for next time.
 * `quietly` while who is signed in is being read: the signed-in part of the app must not start
 * afresh in the middle of that read (it would cancel it); it sees the change at its next render.
 */
export function forgetKitchen({ quietly = false }: { quietly?: boolean } = {}) {
  if (quietly) current = null;
  else setCurrent(null);
}

/**
 * The kitchen to work in for this answer of /me, without asking: the only one, or the one
 * chosen last in this browser while the person still has a role there. Null when they must choose.
 */
export function kitchenToWorkIn(me: Me): number | null {
  const [only, ...others] = me.kitchens;
  if (!only) return null;
  if (others.length === 0) return only.id;
  const stored = storedKitchen(me.id);
  return me.kitchens.some((k) => k.id === stored) ? stored : null;
}

/** The headers that name the kitchen of a request (none while no kitchen is chosen). */
export function kitchenHeaders(): Record<string, string> {
  return current === null ? {} : { [KITCHEN_HEADER]: String(current) };
}

/**
 * An address the browser opens itself (an events stream, a PDF or download in a new tab), which
 * cannot carry the header: the kitchen goes in its `kitchen` query parameter.
 */
export function withKitchen(url: string): string {
  if (current === null) return url;
  const [path = '', hash] = url.split('#', 2);
  const joined = `${path}${path.includes('?') ? '&' : '?'}kitchen=${current}`;
  return hash === undefined ? joined : `${joined}#${hash}`;
}
