import type {
  CounterApproval,
  CounterProduct,
  CounterProductsView,
  CounterRules,
  DeclaredIngredient,
  ProductDeclaration,
  Regime,
  ServedDeclaration,
} from '@crumbproof/shared';
import demo from './demo-kitchen.json';

/**
 * The demo kitchen's products as the rules engine declares them (UK), and the UK's allergen groups,
 * so the counter's tests classify real declarations. tests/checks/counter-fixture.test.ts keeps the
 * file equal to the declaration command's output for the demo book, and says how to write it again.
 */
export const DEMO_REGIME = demo.regime as Regime;
export const DEMO_RULES = demo.rules as CounterRules;
export const DEMO_DECLARATIONS = demo.declarations as unknown as ProductDeclaration[];

function leaves(entries: readonly DeclaredIngredient[]): DeclaredIngredient[] {
  return entries.flatMap((e) => (e.children.length > 0 ? [e, ...leaves(e.children)] : [e]));
}

/** A declaration as the API serves it: with the basis it was computed from. */
export function served(declaration: ProductDeclaration, computedAt = '2026-12-02T08:15:00.000Z'): ServedDeclaration {
  const below = leaves(declaration.ingredients).filter((e, i, all) => all.findIndex((x) => x.id === e.id) === i);
  return {
    ...declaration,
    basis: {
      computedAt,
      regime: declaration.regime,
      items: [
        { id: declaration.product, kind: 'recipe', name: declaration.name, revision: 1 },
        ...below.map((e) => ({ id: e.id, kind: e.kind, name: e.name, revision: 1 })),
      ],
      siteVersion: 1,
    },
  };
}

export function demoDeclaration(id: string): ProductDeclaration {
  const found = DEMO_DECLARATIONS.find((d) => d.product === id);
  if (!found) throw new Error(`The demo kitchen has no product '${id}'.`);
  return found;
}

/** As the demo starts: every product approved by the demo manager. */
export const APPROVED: CounterApproval = { state: 'approved', approvedAt: '2026-12-01T07:00:00.000Z', approvedBy: 'Maren Holloway' };

/** The counter's one read for the demo kitchen, with the products given marked on sale today. */
export function demoCounterView(
  onSale: readonly string[] = ['strawberry-layer-cake', 'vegan-brownie', 'lemon-shortbread'],
  computedAt = '2026-12-02T08:15:00.000Z',
): CounterProductsView {
  const products: CounterProduct[] = DEMO_DECLARATIONS.map((d) => ({
    id: d.product,
    name: d.name,
    onSale: onSale.includes(d.product),
    declaration: served(d, computedAt),
    approval: APPROVED,
  }));
  return { computedAt, date: '2026-12-02', regime: DEMO_REGIME, rules: DEMO_RULES, products };
}
