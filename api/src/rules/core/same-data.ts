/**
 * Data as JSON keeps it: object keys in one order (sorted), keys whose value is undefined left
 * out, arrays in their own order, values with toJSON (dates) as they serialise.
 */
function canonical(value: unknown): unknown {
  if (Array.isArray(value)) return value.map((v) => (v === undefined ? null : canonical(v)));
  if (value !== null && typeof value === 'object') {
    const withJson = value as { toJSON?: () => unknown };
    if (typeof withJson.toJSON === 'function') return canonical(withJson.toJSON());
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const v = (value as Record<string, unknown>)[key];
      if (v !== undefined) out[key] = canonical(v);
    }
    return out;
  }
  return value;
}

/**
 * JSON text of data that is the same for the same data whatever order its keys were written in:
 * what a kept declaration's inputs are hashed from. `undefined` alone has no JSON and gives ''.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(canonical(value)) ?? '';
}

/**
 * Whether two pieces of data are equal as JSON: the same keys with the same values, in any order
 * of keys; arrays in the same order. A key left out equals a key set to undefined (JSON keeps
 * neither), but not one set to null or to an empty list: `contains: []` (the supplier states no
 * allergens) is not `contains` left out (no statement).
 */
export function sameData(a: unknown, b: unknown): boolean {
  if (a === undefined || b === undefined) return a === b;
  return canonicalJson(a) === canonicalJson(b);
}
