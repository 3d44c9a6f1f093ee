import type { FastifyRequest } from 'fastify';
import type { ApiErrorBody } from '@crumbproof/shared';

/** Told of every refused access before the refusal is sent (the audit trail records it). */
export interface RefusalListener {
  refused(request: FastifyRequest, body: ApiErrorBody): Promise<void>;
}

export const REFUSAL_LISTENER = Symbol('RefusalListener');

/** 403 always; 401 only when the request came with a session cookie (an ended or expired session), not a first visit. */
export function isRefusedAccess(request: FastifyRequest, body: ApiErrorBody): boolean {
  if (body.code === 'forbidden') return true;
  const cookies = (request as FastifyRequest & { cookies?: Record<string, string | undefined> }).cookies;
  return body.code === 'unauthenticated' && Boolean(cookies?.cp_session);
}
