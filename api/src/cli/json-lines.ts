/**
 * `JSON.stringify({ [key]: items }, null, 2)` and a newline, in pieces: one item at a time, so a
 * whole book's declarations are never one string (a string that large can exceed what the
 * JavaScript engine allows, and holds the output twice). The pieces joined are exactly that text.
 * `items` may be made as it is read: only the item being written is held.
 */
export function* indentedJsonPieces(key: string, items: Iterable<unknown>): Generator<string> {
  // Each item is written once the next is known, so the last goes without a comma; an iterable
  // made as it is read (declarations worked out one at a time) is never held whole.
  let held: { item: unknown } | null = null;
  for (const item of items) {
    yield held ? itemText(held.item, true) : `{\n  ${JSON.stringify(key)}: [\n`;
    held = { item };
  }
  if (!held) {
    yield `${JSON.stringify({ [key]: [] }, null, 2)}\n`;
    return;
  }
  yield itemText(held.item, false);
  yield '  ]\n}\n';
}

function itemText(item: unknown, more: boolean): string {
  // A JSON text has no raw newline inside a string, so indenting every line indents the item only.
  const text = JSON.stringify(item, null, 2).replace(/\n/g, '\n    ');
  return `    ${text}${more ? ',' : ''}\n`;
}
