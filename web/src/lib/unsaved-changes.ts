import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useBlocker, type BlockerFunction } from 'react-router-dom';

/** What the app asks before it drops someone's unsaved edits. */
export const LEAVE_QUESTION = 'You have changes that are not saved. Leave this page and lose them?';

/** The forms on screen with unsaved edits: what a move to another kitchen asks about first. */
const unsaved = new Set<symbol>();

/**
 * Whether the person may move on: true when no form holds unsaved edits, or when they say to
 * leave them. Moving to another kitchen reloads every page, so it asks here first.
 */
export function confirmLeavingUnsaved(): boolean {
  if (unsaved.size === 0) return true;
  if (!window.confirm(LEAVE_QUESTION)) return false;
  unsaved.clear();
  return true;
}

/**
 * Guards a form's unsaved edits while `dirty`: leaving for another page of the app, closing the
 * tab, reloading or moving to another kitchen asks first. `release()` lets the next move through
 * without asking (the form was just saved, and the move is to what was saved).
 */
export function useUnsavedChanges(dirty: boolean): { release(): void } {
  const [key] = useState(() => Symbol('unsaved form'));
  const released = useRef(false);

  useEffect(() => {
    if (!dirty) return;
    released.current = false;
    unsaved.add(key);
    const ask = (event: BeforeUnloadEvent) => {
      if (released.current) return;
      event.preventDefault();
      // Older Chromium asks only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', ask);
    return () => {
      unsaved.delete(key);
      window.removeEventListener('beforeunload', ask);
    };
  }, [dirty, key]);

  const shouldBlock = useCallback<BlockerFunction>(
    ({ currentLocation, nextLocation }) =>
      dirty && !released.current && unsaved.has(key) && currentLocation.pathname !== nextLocation.pathname,
    [dirty, key],
  );
  const blocker = useBlocker(shouldBlock);

  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    if (window.confirm(LEAVE_QUESTION)) {
      released.current = true;
      unsaved.delete(key);
      blocker.proceed();
    } else blocker.reset();
  }, [blocker, key]);

  return useMemo(
    () => ({
      release() {
        released.current = true;
        unsaved.delete(key);
      },
    }),
    [key],
  );
}

/**
 * Whether a react-hook-form `dirtyFields` holds an edit: a field the person changed. (`isDirty`
 * also turns true when a saved item comes back without a key the form registers, which is no edit.)
 */
export function hasEdits(dirtyFields: unknown): boolean {
  if (dirtyFields === true) return true;
  if (Array.isArray(dirtyFields)) return dirtyFields.some(hasEdits);
  if (dirtyFields !== null && typeof dirtyFields === 'object') return Object.values(dirtyFields).some(hasEdits);
  return false;
}
