import type { Declaration, DeclaredIngredient, IdPath, PrecautionStatement } from '../declaration';

/** Where a may-contain comes from, as the counter says it. */
export type PrecautionReason = PrecautionStatement['origin'];

/** Every path from the product to the entry with this id, as the declared ingredient tree holds it. */
export function pathsTo(declaration: Declaration, id: string): IdPath[] {
  const out: IdPath[] = [];
  const walk = (entries: DeclaredIngredient[], above: IdPath) => {
    for (const entry of entries) {
      const path = [...above, entry.id];
      if (entry.id === id) out.push(path);
      walk(entry.children, path);
    }
  };
  walk(declaration.ingredients, [declaration.product]);
  return out;
}

/** The entries along a path (the product itself left out); shorter when the tree does not hold it all. */
export function entriesAlong(declaration: Declaration, path: IdPath): DeclaredIngredient[] {
  const out: DeclaredIngredient[] = [];
  let level = declaration.ingredients;
  for (const id of path.slice(1)) {
    const entry = level.find((e) => e.id === id);
    if (!entry) break;
    out.push(entry);
    level = entry.children;
  }
  return out;
}

/** True when the path passes through a contact line (a floured tin, an oiled tray). */
export function throughContact(declaration: Declaration, path: IdPath): boolean {
  return entriesAlong(declaration, path).some((e) => e.role === 'contact');
}

/** The recorded name of an item of the product, by id; the id itself when the tree does not hold it. */
export function nameOf(declaration: Declaration, id: string): string {
  if (id === declaration.product) return declaration.name;
  const find = (entries: DeclaredIngredient[]): string | undefined => {
    for (const e of entries) {
      if (e.id === id) return e.name;
      const below = find(e.children);
      if (below) return below;
    }
    return undefined;
  };
  return find(declaration.ingredients) ?? id;
}
