import helmet from '@fastify/helmet';
import type { FastifyInstance } from 'fastify';

/**
 * Security headers on every response, the web app's pages and the API's answers alike
 * (@fastify/helmet): a Content-Security-Policy, X-Content-Type-Options: nosniff,
 * Referrer-Policy: no-referrer, and no framing by anyone (frame-ancestors 'none' and
 * X-Frame-Options: DENY, against clickjacking). HSTS only where the cookie is Secure, that is
 * where Crumbproof is served over HTTPS.
 */
export async function registerSecurityHeaders(fastify: FastifyInstance, options: { https: boolean }) {
  await fastify.register(helmet, {
    global: true,
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
  });
}
