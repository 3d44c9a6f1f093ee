import { createHash } from 'node:crypto';
import type { FastifyReply, FastifyRequest } from 'fastify';

/** An answer serialised once and sent as it is to every request that asks for the same thing. */
export interface PreparedJson {
  body: Buffer;
  /** A strong entity tag (RFC 9110, section 8.8.3): the SHA-256 of the body. */
  etag: string;
}

/** Serialises `value` once, with its entity tag. */
export function prepareJson(value: unknown): PreparedJson {
  const body = Buffer.from(JSON.stringify(value), 'utf8');
  return { body, etag: `"${createHash('sha256').update(body).digest('base64url')}"` };
}

/** Whether an If-None-Match header names this tag (or is `*`); weak tags compare by their opaque part (RFC 9110, section 13.1.2). */
function matches(header: string | string[] | undefined, etag: string): boolean {
  if (header === undefined) return false;
  return [header]
    .flat()
    .flatMap((h) => h.split(','))
    .some((tag) => {
      const t = tag.trim();
      return t === '*' || t === etag || t === `W/${etag}`;
    });
}

/** Sends a prepared answer, or 304 Not Modified with no body when the request already holds it (If-None-Match). */
export function sendPrepared(request: FastifyRequest, reply: FastifyReply, prepared: PreparedJson): FastifyReply {
  reply.header('etag', prepared.etag);
  if (matches(request.headers['if-none-match'], prepared.etag)) return reply.code(304).send();
  return reply.type('application/json; charset=utf-8').send(prepared.body);
}
