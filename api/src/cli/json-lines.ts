/**
 * `JSON.stringify({ [key]: items }, null, 2)` and a newline, in pieces: one item at a time, so a
 * whole book's declarations are never one string (a string that large can exceed what the
 * JavaScript engine allows, and holds the output twice). The pieces joined are exactly that text.
 */
export function* indentedJsonPieces(key: string, items: readonly unknown[]): Generator<string> {
  if (items.length === 0) {
    yield `${JSON.stringify({ [key]: [] }, null, 2)}\n`;
    return;
  }
  yield `{\n  ${JSON.stringify(key)}: [\n`;
  for (let n = 0; n < items.length; n++) {
    // A JSON text has no raw newline inside a string, so indenting every line indents the item only.
    const text = JSON.stringify(items[n], null, 2).replace(/\n/g, '\n    ');
    yield `    ${text}${n < items.length - 1 ? ',' : ''}\n`;
  }
  yield '  ]\n}\n';
}
