import type { IncomingMessage, ServerResponse } from 'node:http';
import type { FastifyInstance } from 'fastify';
import helmet, { type HelmetOptions } from 'helmet';

/**
 * Security headers on every response, the web app's pages and the API's answers alike
 * (@fastify/helmet): a Content-Security-Policy, X-Content-Type-Options: nosniff,
 * Referrer-Policy: no-referrer, and no framing by anyone (frame-ancestors 'none' and
 * X-Frame-Options: DENY, against clickjacking). HSTS only where the cookie is Secure, that is
 * where Crumbproof is served over HTTPS. The headers are the same for every response, so Helmet
 * works them out once, at start, and each response is given them as they are (@fastify/helmet
 * would build Helmet's middleware again, parsing the policy, at every request).
 */
export function registerSecurityHeaders(fastify: FastifyInstance, options: { https: boolean }): void {
  const headers = Object.entries(helmetHeaders(policy(options)));
  fastify.addHook('onRequest', (_request, reply, done) => {
    for (const [name, value] of headers) reply.raw.setHeader(name, value);
    done();
  });
}

/** The headers Helmet's middleware sets on a response, by name, as it sets them. */
function helmetHeaders(config: HelmetOptions): Record<string, string> {
  const set: Record<string, string> = {};
  const response = {
    setHeader: (name: string, value: string | number | readonly string[]) => {
      set[name] = String(value);
    },
    removeHeader: (name: string) => {
      delete set[name];
    },
  };
  helmet(config)({} as IncomingMessage, response as unknown as ServerResponse, (err?: unknown) => {
    if (err) throw err instanceof Error ? err : new Error('Helmet refused the security headers’ settings.');
  });
  return set;
}

function policy(options: { https: boolean }): HelmetOptions {
  return {
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Chakra UI styles through Emotion, which writes <style> elements into the page as it
        // renders; without a per-page nonce (which the served index.html does not carry) the
        // browser allows those only with 'unsafe-inline'. Scripts stay 'self' only, so this lets
        // in no code.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        // The Labels page previews a run as a PDF drawn in the browser and shown from a blob: URL.
        frameSrc: ["'self'", 'blob:'],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
    frameguard: { action: 'deny' },
    referrerPolicy: { policy: 'no-referrer' },
    strictTransportSecurity: options.https ? { maxAge: 180 * 24 * 60 * 60, includeSubDomains: false } : false,
  };
}
