import { createSecretKey, type KeyObject } from 'node:crypto';

const keys = new Map<string, KeyObject>();

/**
 * The session tokens' HMAC key as a KeyObject, made once per secret. Given a string,
 * jsonwebtoken first tries to read it as a PEM public key at every verification (an exception
 * thrown and caught per request, a sixth of a declaration read's time) before it falls back to a
 * secret key; given a KeyObject of type secret it uses it as it is.
 */
export function sessionKey(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}
