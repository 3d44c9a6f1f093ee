import { Injectable } from '@nestjs/common';
import type { FieldError, Sale, ServedDeclaration } from '@crumbproof/shared';
import { labelDate, renderLabelDocument, type LabelPrintDetails, type LabelTemplate } from '@crumbproof/shared/labels';
import type { SiteRow } from '../kitchen/site.repository';
import { RulesService } from '../rules/rules.service';
import { loadLabelTemplates, type LoadedTemplate } from './label-templates';
import { labelFonts, renderPdf } from './pdf-node';

/** One product of a run as the printer takes it: what it is printed from, its batch and SSCCs, and its place in the request. */
export interface PrintLabel {
  declaration: ServedDeclaration;
  sale: Sale;
  batch: string;
  quantity: number;
  revision: number;
  sscc?: string[];
  /** The product's public page, for the QR code of a ticket: given only when it is published and the page is on. */
  publicUrl?: string;
  /** items.N of the request, for messages. */
  path: string;
}

export interface PrintJob {
  template: LabelTemplate;
  labels: PrintLabel[];
  productionDate: string;
  site: SiteRow;
  printedAt: Date;
}

export type Printed = { ok: true; pdf: Buffer } | { ok: false; problems: FieldError[] };

/**
 * The label templates and the shared renderer on the server: the templates are read and checked
 * (schema and legibility at the embedded font's x-height) when the API starts, so a bad template
 * stops the start naming its file and field; a run becomes a PDF with the fonts embedded.
 */
@Injectable()
export class LabelPrinter {
  private readonly loaded: Map<string, LoadedTemplate> = loadLabelTemplates(undefined, labelFonts());

  constructor(private readonly rules: RulesService) {}

  /** Every template as the web lays it out in its preview, with whether its labels carry a batch code. */
  templates(): Array<LabelTemplate & { printsBatch: boolean }> {
    return [...this.loaded.values()].map((t) => ({ ...t.template, printsBatch: t.printsBatch }));
  }

  template(id: string): LoadedTemplate | undefined {
    return this.loaded.get(id);
  }

  /** The best before or use by date of a product made on the day, or null when its print details give none. */
  dateOf(productionDate: string, sale: Sale): string | null {
    return sale.shelfLifeDays !== undefined && sale.dateMark !== undefined ? labelDate(productionDate, sale.shelfLifeDays) : null;
  }

  async render(job: PrintJob): Promise<Printed> {
    const regime = job.site.regime;
    const result = renderLabelDocument({
      template: job.template,
      labels: job.labels.map((l) => ({
        declaration: l.declaration,
        details: printDetails(l.sale),
        batch: l.batch,
        productionDate: job.productionDate,
        quantity: l.quantity,
        revision: l.revision,
        ...(l.sscc ? { sscc: l.sscc } : {}),
        ...(l.publicUrl ? { publicUrl: l.publicUrl } : {}),
      })),
      business: { name: job.site.name, address: job.site.address },
      regime,
      fonts: labelFonts(),
      printedAt: job.printedAt.toISOString(),
      allergenGroups: this.rules.refs.regimes[regime].groups.map((g) => ({ code: g.code, label: g.label })),
    });
    if (!result.ok) {
      const pathOf = new Map(job.labels.map((l) => [l.declaration.product, l.path]));
      return {
        ok: false,
        problems: result.problems.map((p) => {
          const at = p.product !== undefined ? pathOf.get(p.product) : undefined;
          return { path: at ? `${at}.product` : 'template', message: p.message };
        }),
      };
    }
    return { ok: true, pdf: await renderPdf(result.doc) };
  }
}

function printDetails(sale: Sale): LabelPrintDetails {
  const { claims, shelfLifeDays, dateMark, gtin, caseGtin, unitsPerCase, netWeightG, storage } = sale;
  return { claims, shelfLifeDays, dateMark, gtin, caseGtin, unitsPerCase, netWeightG, storage };
}
