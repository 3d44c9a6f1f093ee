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

/** A key JSON.stringify writes before every other key of an object whatever their order: an array index. */
const INDEX_KEY = /^(?:0|[1-9][0-9]*)$/;

/**
 * canonicalJson of a value, character for character, with the text of every object or array in it
 * read from `known` when there and kept there once worked out: for many values that share parts
 * (each product's closure of one book holds the book's own items), each part is written once.
 * What `known` holds must not change after (frozen data, or data dropped with `known`).
 */
export function canonicalJsonKept(value: unknown, known: WeakMap<object, string>): string {
  return keptText(value, known) ?? '';
}

function keptText(value: unknown, known: WeakMap<object, string>): string | undefined {
  if (value === null || typeof value !== 'object') {
    // No text for undefined, a function or a symbol (left out of an object, null in a list).
    const text: string | undefined = JSON.stringify(value);
    return text;
  }
  const done = known.get(value);
  if (done !== undefined) return done;
  let text: string;
  if (Array.isArray(value)) {
    const parts: string[] = [];
    // By index, so a hole is null as JSON writes it.
    for (let n = 0; n < value.length; n++) parts.push(keptText((value as unknown[])[n], known) ?? 'null');
    text = `[${parts.join(',')}]`;
  } else {
    // A value with toJSON (a date) may change and is written as it is now; the order of index keys is JSON's own.
    if (typeof (value as { toJSON?: unknown }).toJSON === 'function') return canonicalJson(value) || undefined;
    const keys = Object.keys(value).sort();
    if (keys.some((k) => INDEX_KEY.test(k))) text = canonicalJson(value);
    else {
      const parts: string[] = [];
      for (const key of keys) {
        const v = (value as Record<string, unknown>)[key];
        const part = v === undefined ? undefined : keptText(v, known);
        if (part !== undefined) parts.push(`${JSON.stringify(key)}:${part}`);
      }
      text = `{${parts.join(',')}}`;
    }
  }
  known.set(value, text);
  return text;
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
