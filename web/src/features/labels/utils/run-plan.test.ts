import type { LabelRunRequest, RecipeView } from '@crumbproof/shared';
import { describe, expect, it } from 'vitest';
import { LABEL_SETTINGS } from '@/testing/mock-api';
import { previewPlan } from './run-plan';

const product = (id: string, published?: boolean): RecipeView => ({
  id,
  name: id,
  lines: [{ use: 'flour', qty: 100, unit: 'g' }],
  sale: { portionG: 50, ...(published === undefined ? {} : { published }) },
  revision: 1,
  updatedAt: '2026-12-01T10:00:00.000Z',
});
const PRODUCTS = [product('lemon-tart', true), product('seeded-bun', false), product('walnut-loaf')];
const REQUEST: LabelRunRequest = {
  template: 'ticket',
  productionDate: '2026-12-02',
  items: PRODUCTS.map((p) => ({ product: p.id, quantity: 1 })),
};

describe('previewPlan: the QR code to the public product page', () => {
  it('gives a published product its page address while the page is on, as the print does', () => {
    const plan = previewPlan(REQUEST, PRODUCTS, LABEL_SETTINGS, 'https://menu.example.com');
    expect(plan.labels.map((l) => l.publicUrl)).toEqual(['https://menu.example.com/p/lemon-tart', undefined, undefined]);
  });

  it('gives none while the page is off', () => {
    const plan = previewPlan(REQUEST, PRODUCTS, LABEL_SETTINGS, null);
    expect(plan.labels.map((l) => l.publicUrl)).toEqual([undefined, undefined, undefined]);
    expect(plan.labels.every((l) => !('publicUrl' in l))).toBe(true);
  });
});
