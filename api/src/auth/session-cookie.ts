import type { FastifyReply, FastifyRequest } from 'fastify';

export const SESSION_COOKIE = 'cp_session';

export function readSessionCookie(req: FastifyRequest): string | null {
  return (req as FastifyRequest & { cookies?: Record<string, string | undefined> }).cookies?.[SESSION_COOKIE] ?? null;
}

/** httpOnly, SameSite=Strict, and Secure wherever the cookie may cross a network (config.sessionCookieSecure). */
export function setSessionCookie(reply: FastifyReply, token: string, maxAgeSeconds: number, secure: boolean) {
  void reply.setCookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'strict',
    secure,
    path: '/',
    maxAge: maxAgeSeconds,
  });
}

export function clearSessionCookie(reply: FastifyReply, secure: boolean) {
  void reply.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'strict', secure, path: '/' });
}
