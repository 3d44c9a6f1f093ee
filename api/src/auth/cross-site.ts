import { Logger } from '@nestjs/common';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { ApiErrorBody } from '@crumbproof/shared';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface CrossSiteOptions {
  /** "METHOD /api/path/:param" of the routes that take multipart/form-data (file uploads); every other route takes JSON. */
  uploadRoutes: ReadonlySet<string>;
  /** An origin besides the request's own Host from which pages may write (PUBLIC_URL behind a reverse proxy). */
  publicOrigin?: string;
}

/**
 * Refuses forged requests before anything is read. The session cookie is SameSite=Strict, but a
 * page on another port of the same host is the same site and still sends it; so every
 * state-changing request must come from Crumbproof's own origin and carry the one body type its
 * route takes.
 * - Sec-Fetch-Site, when sent, must be same-origin (Fetch Metadata Request Headers, W3C).
 * - Origin, when sent, must be this server's own (the Host the request names, or PUBLIC_URL).
 *   Browsers send it on every POST, PUT, PATCH and DELETE (Fetch Standard, "append a request
 *   Origin header").
 * - A request with neither header is not from a browser page (curl, scripts, the API's tests):
 *   it is let through on purpose. Such a client cannot borrow a signed-in person's cookie; it
 *   needs the cookie itself.
 * - A body must be application/json, or multipart/form-data on upload routes only. A form or a
 *   no-cors fetch cannot send application/json without the browser asking first (CORS
 *   preflight, which this API never grants).
 */
export function refuseCrossSiteRequests(fastify: FastifyInstance, options: CrossSiteOptions) {
  const logger = new Logger('Security');
  fastify.addHook('onRequest', async (req: FastifyRequest, reply: FastifyReply) => {
    if (!STATE_CHANGING.has(req.method)) return;
    const site = crossSiteProblem(req, options.publicOrigin);
    if (site) {
      logger.warn(`Refused ${req.method} ${req.url} from another site (${site.seen})`);
      return refuse(reply, 403, 'forbidden', site.message);
    }
    const type = contentTypeProblem(req, options.uploadRoutes.has(`${req.method} ${req.routeOptions.url ?? ''}`));
    if (type) return refuse(reply, 415, 'validation', type);
  });
}

function refuse(reply: FastifyReply, statusCode: number, code: ApiErrorBody['code'], message: string) {
  return reply
    .code(statusCode)
    .type('application/json; charset=utf-8')
    .send({ statusCode, code, message } satisfies ApiErrorBody);
}

function header(req: FastifyRequest, name: string): string | undefined {
  const value = req.headers[name];
  return Array.isArray(value) ? value.join(',') : value;
}

function crossSiteProblem(req: FastifyRequest, publicOrigin?: string): { message: string; seen: string } | null {
  const message = 'This request came from a page outside Crumbproof, so nothing was changed. Make the change in Crumbproof itself.';
  const fetchSite = header(req, 'sec-fetch-site');
  if (fetchSite !== undefined && fetchSite !== 'same-origin') return { message, seen: `Sec-Fetch-Site: ${fetchSite}` };
  const origin = header(req, 'origin');
  if (origin === undefined) return null;
  if (publicOrigin !== undefined && origin === publicOrigin) return null;
  let host: string | null;
  try {
    host = new URL(origin).host;
  } catch {
    host = null; // "null" (a sandboxed frame, a file) or garbage
  }
  const own = (header(req, 'host') ?? '').toLowerCase();
  if (host === null || host !== own) return { message, seen: `Origin: ${origin}` };
  return null;
}

function contentTypeProblem(req: FastifyRequest, upload: boolean): string | null {
  const length = header(req, 'content-length');
  const hasBody = (length !== undefined && length !== '0') || header(req, 'transfer-encoding') !== undefined;
  const type = (header(req, 'content-type') ?? '').split(';')[0].trim().toLowerCase();
  if (!hasBody && type === '') return null;
  if (upload) {
    return type === 'multipart/form-data'
      ? null
      : `This address takes a file upload: send it as multipart/form-data, not ${type || 'a body without a type'}. Nothing was changed.`;
  }
  return type === 'application/json'
    ? null
    : `This address takes JSON: send the body as application/json, not ${type || 'without a type'}. Nothing was changed.`;
}
