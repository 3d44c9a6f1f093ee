import { expandBatchPattern, publicPageUrl, sscc, type LabelRunRequest, type LabelSettings, type RecipeView } from '@crumbproof/shared';
import type { LabelInput, LabelPrintDetails, LabelTemplate } from '@crumbproof/shared/labels';

/** A template as the API offers it; `printsBatch` says whether its labels carry a batch code. */
export type TemplateOption = LabelTemplate & { printsBatch?: boolean };

/** Whether the template's labels carry a batch code (the API says so; a chart never does). */
export function printsBatch(template: TemplateOption): boolean {
  return template.printsBatch ?? template.purpose !== 'chart';
}

/** What the form holds: the run the manager is putting together. */
export interface RunDraft {
  template: string;
  productionDate: string;
  batch: string;
  /** Product id → labels (or cases) to print; a blank or zero box prints none. */
  quantities: Record<string, number | undefined>;
  /** Product id → the revision to print again (a reprint from the log); left out, the current one. */
  revisions: Record<string, number>;
  unitsPerCase: number | undefined;
  shipment: boolean;
  overrideReason: string;
}

/** The products the draft prints, in the order of the product list. */
export function chosenItems(draft: RunDraft, products: readonly RecipeView[]): { product: RecipeView; quantity: number }[] {
  return products.flatMap((product) => {
    const quantity = draft.quantities[product.id];
    return quantity !== undefined && !Number.isNaN(quantity) && quantity !== 0 ? [{ product, quantity }] : [];
  });
}

/** The request the API is sent, exactly: the schema (labelRunRequestSchema) checks it before it goes. */
export function toRunRequest(draft: RunDraft, products: readonly RecipeView[], template: TemplateOption | undefined): LabelRunRequest {
  const isCase = template?.purpose === 'case';
  const batch = draft.batch.trim();
  const reason = draft.overrideReason.trim();
  return {
    template: draft.template,
    productionDate: draft.productionDate,
    items: chosenItems(draft, products).map(({ product, quantity }) => ({
      product: product.id,
      quantity,
      ...(draft.revisions[product.id] !== undefined ? { revision: draft.revisions[product.id] } : {}),
    })),
    ...(batch !== '' && template && printsBatch(template) ? { batch } : {}),
    ...(isCase && draft.unitsPerCase !== undefined && !Number.isNaN(draft.unitsPerCase) ? { unitsPerCase: draft.unitsPerCase } : {}),
    ...(isCase && draft.shipment ? { shipment: true } : {}),
    ...(reason !== '' ? { override: { reason } } : {}),
  };
}

/** A product's print details as its labels use them, with the run's units per case where given. */
export function printDetails(product: RecipeView, request: LabelRunRequest): LabelPrintDetails {
  const { claims, shelfLifeDays, dateMark, gtin, caseGtin, unitsPerCase, netWeightG, storage } = product.sale ?? {};
  return {
    claims,
    shelfLifeDays,
    dateMark,
    gtin,
    caseGtin,
    unitsPerCase: request.unitsPerCase ?? unitsPerCase,
    netWeightG,
    storage,
  };
}

export interface PreviewPlan {
  labels: Omit<LabelInput, 'declaration'>[];
  /** What differs from the print: the numbers the API gives out only when the run is printed. */
  notes: string[];
  /** Why the preview cannot be drawn at all. */
  blocked: string | null;
}

/**
 * The labels of the preview. Batch codes given by hand print as typed; from the kitchen's pattern,
 * the preview shows the first of the day, and the print takes the next free number. Shipment
 * labels show SSCCs from serial 0; the print takes the next serials of the kitchen's counter.
 * `publicBase` is the public product page's address while the page is on: a published product's
 * label then carries its page's address, as the print does (with `publicKitchen`, the kitchen's
 * part of it where the installation has several).
 */
export function previewPlan(
  request: LabelRunRequest,
  products: readonly RecipeView[],
  settings: LabelSettings,
  publicBase: string | null = null,
  publicKitchen: string | null = null,
): PreviewPlan {
  const byId = new Map(products.map((p) => [p.id, p]));
  const notes: string[] = [];
  if (request.shipment && settings.gs1CompanyPrefix === null)
    return {
      labels: [],
      notes,
      blocked: 'Shipment labels need the kitchen’s GS1 company prefix: a manager sets it on the Kitchen page.',
    };
  const older = request.items.filter((item) => item.revision !== undefined && item.revision !== byId.get(item.product)?.revision);
  if (older.length > 0)
    return {
      labels: [],
      notes,
      blocked: 'A reprint of a revision that is no longer current is not previewed here: it prints exactly what that run printed.',
    };
  if (request.batch === undefined)
    notes.push('Batch codes show the first run of the day; the print gives each product the next free code.');
  if (request.shipment) notes.push('SSCCs show serials from 0; the print takes the next serials of the kitchen’s counter.');
  const labels = request.items.flatMap((item) => {
    const product = byId.get(item.product);
    if (!product) return [];
    return [
      {
        details: printDetails(product, request),
        batch:
          request.batch ?? expandBatchPattern(settings.batchPattern, { date: request.productionDate, product: product.id, sequence: 1 }),
        productionDate: request.productionDate,
        quantity: item.quantity,
        revision: item.revision ?? product.revision,
        ...(publicBase !== null && product.sale?.published === true
          ? { publicUrl: publicPageUrl(publicBase, product.id, publicKitchen) }
          : {}),
        ...(request.shipment && settings.gs1CompanyPrefix !== null
          ? {
              sscc: Array.from({ length: item.quantity }, (_, n) => sscc(settings.ssccExtension, settings.gs1CompanyPrefix!, n)),
            }
          : {}),
      },
    ];
  });
  return { labels, notes, blocked: null };
}
