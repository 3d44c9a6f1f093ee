import { z } from 'zod';

// The Content-Security-Policy allows no eval (script-src 'self'). zod probes for it with
// Function('') when it builds an object schema, which the browser reports as a violation;
// jitless parsing needs no probe. Imported first by main.tsx, before any schema is built.
z.config({ jitless: true });
