import { AsyncLocalStorage } from 'node:async_hooks';
import type { Role } from '@crumbproof/shared';

/** Who is asking and from where, for the request being handled (the audit trail reads it). */
export interface RequestContext {
  actor: { id: number; name: string; role: Role } | null;
  address: string | null;
  /** The kitchen the request is for (see RolesGuard); null on a public route or before any kitchen is set up. */
  kitchenId: number | null;
}

const storage = new AsyncLocalStorage<RequestContext>();

/** Runs `work` with `context` as the current request's, through every await it makes. */
export function runInRequest<T>(context: RequestContext, work: () => T): T {
  return storage.run(context, work);
}

/** The current request's context, or undefined outside a request (the seed, the command line). */
export function currentRequest(): RequestContext | undefined {
  return storage.getStore();
}
