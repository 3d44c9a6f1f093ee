import { cpus } from 'node:os';
import type { CounterProduct, ProductDeclaration } from '@crumbproof/shared';
import { describe, expect, it } from 'vitest';
import { APPROVED, DEMO_DECLARATIONS, DEMO_RULES, served } from '../testing/counter-view';
import { lookUp, type CounterAsk } from './lookup';

/** The most products one kitchen puts on the counter on one day (COUNTER_DAY_MAX_PRODUCTS). */
const PRODUCTS = 500;
const RUNS = 15;
/** Generous: a lookup is worked out on every pick; a tenth of a second is where a tap starts to feel slow. */
const BOUND_MS = 100;

/**
 * 500 products made by varying the demo kitchen's real declarations: each takes one product's
 * declaration under a new id and name, and some borrow what another records (an ingredient with no
 * allergen statement, a supplier's may-contain, an allergen it contains), so the findings differ.
 */
function kitchenOf500(): CounterProduct[] {
  const at = (i: number) => DEMO_DECLARATIONS[i % DEMO_DECLARATIONS.length] as ProductDeclaration;
  return Array.from({ length: PRODUCTS }, (_, i) => {
    const base = at(i);
    const other = at(i + 2);
    const declaration: ProductDeclaration = {
      ...base,
      product: `${base.product}-${i}`,
      name: `${base.name} no. ${i}`,
      contains:
        i % 4 === 0
          ? [...base.contains, ...other.contains.filter((c) => !base.contains.some((b) => b.allergen === c.allergen))]
          : base.contains,
      unknown: i % 7 === 0 ? [...base.unknown, ...other.unknown] : base.unknown,
      precautions: i % 3 === 0 ? [...base.precautions, ...other.precautions] : base.precautions,
      mayContain: i % 3 === 0 ? [...base.mayContain, ...other.mayContain] : base.mayContain,
    };
    return { id: declaration.product, name: declaration.name, onSale: i % 5 !== 0, declaration: served(declaration), approval: APPROVED };
  });
}

const ASKS: Array<{ title: string; ask: CounterAsk }> = [
  { title: 'egg and sesame', ask: { avoid: ['eggs', 'sesame'], want: [] } },
  { title: 'walnut, vegan', ask: { avoid: ['walnut'], want: ['vegan'] } },
  { title: 'milk', ask: { avoid: ['milk'], want: [] } },
  { title: 'soy, peanuts, mustard, vegetarian', ask: { avoid: ['soybeans', 'peanuts', 'mustard'], want: ['vegetarian'] } },
  { title: 'nothing picked', ask: { avoid: [], want: [] } },
];

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

describe(`the counter lookup over ${PRODUCTS} products (benchmark)`, () => {
  const products = kitchenOf500();

  it.each(ASKS)(`classifies and orders every product for "$title" in under ${BOUND_MS} ms (median of ${RUNS})`, ({ title, ask }) => {
    // Warm up the JIT once; its time is not counted.
    const first = lookUp(products, DEMO_RULES, ask);
    expect(first.onSale.length + first.rest.length).toBe(PRODUCTS);
    expect(first.problems).toEqual([]);
    if (ask.avoid.length > 0) expect(new Set(first.onSale.map((r) => r.verdict?.verdict)).size).toBeGreaterThan(1);

    const times: number[] = [];
    for (let run = 0; run < RUNS; run += 1) {
      const start = performance.now();
      lookUp(products, DEMO_RULES, ask);
      times.push(performance.now() - start);
    }
    const mid = median(times);
    const cores = cpus();
    console.log(
      `counter lookup, ${PRODUCTS} products, ${title}: median ${mid.toFixed(1)} ms, slowest ${Math.max(...times).toFixed(1)} ms ` +
        `(${RUNS} runs; ${cores.length} cores, ${cores[0]?.model ?? 'unknown CPU'})`,
    );
    expect(mid).toBeLessThan(BOUND_MS);
  });
});
