import { Inject, Injectable, StreamableFile } from '@nestjs/common';
import {
  batchProblem,
  expandBatchPattern,
  labelSettingsSchema,
  sscc,
  ssccCapacity,
  type BookRecipe,
  type FieldError,
  type LabelRun,
  type LabelRunLogItem,
  type LabelRunRequest,
  type LabelSettings,
  type Sale,
  type ServedDeclaration,
} from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import type { Page } from '../common/total-count';
import { ApprovalStatus, type ProductStatus } from '../approvals/approval-status';
import { AuditService } from '../audit/audit.service';
import { TransactionRunner } from '../common/transaction';
import { BooksService, type KitchenState } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import type { SiteRow } from '../kitchen/site.repository';
import { LabelCountersRepository } from './label-counters.repository';
import { LabelPrinter, type PrintLabel } from './label-printer';
import type { LabelRunQuery } from './label-run-query';
import { LabelRunsRepository, type LabelRunRow, type RunLine } from './label-runs.repository';
import { LabelSettingsRepository } from './label-settings.repository';
import { PublicPageService } from '../public-page/public-page.service';
import { keptCopy } from '../declarations/declarations.service';
import { FILE_STORE, type FileStore } from '../storage/file-store';
import { keepFile, readStoredFile } from '../storage/stored-file-errors';

/** What an item of a run was rendered from, kept with the run so that the same label can be printed again. */
export interface PrintSource {
  declaration: ServedDeclaration;
  /** The product's sale details (print details) at that revision. */
  sale: Sale;
}

/** An item of a run once its product is found: where it stands and what it is printed from. */
interface PlannedItem {
  product: BookRecipe;
  rowId: number;
  revision: number;
  quantity: number;
  source: PrintSource;
  /** Where the item sits in the request, for messages: items.N. */
  path: string;
  /** The declaration printed, by its input hash, and the approval it is printed under (null for a reprint of an earlier revision). */
  inputHash: string | null;
  approvalId: number | null;
}

const DEFAULT_SETTINGS: LabelSettings = labelSettingsSchema.parse({});

/**
 * Print runs of labels and the print log. A run takes each product's kept declaration (or, with
 * a manager's override, the one an earlier run printed of a revision no longer current), gives
 * out batch codes and SSCC serials, renders the labels through the shared renderer into a PDF and
 * logs the run with that PDF, all in one transaction: a refused run changes nothing.
 */
@Injectable()
export class LabelsService {
  constructor(
    private readonly kitchen: KitchenService,
    private readonly books: BooksService,
    private readonly approvals: ApprovalStatus,
    private readonly settingsRepo: LabelSettingsRepository,
    private readonly runsRepo: LabelRunsRepository,
    private readonly counters: LabelCountersRepository,
    private readonly printer: LabelPrinter,
    private readonly publicPages: PublicPageService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    @Inject(FILE_STORE) private readonly files: FileStore,
  ) {}

  templates() {
    return this.printer.templates();
  }

  async settings(): Promise<LabelSettings> {
    const site = await this.kitchen.current();
    return (await this.settingsRepo.find(site.id)) ?? DEFAULT_SETTINGS;
  }

  async saveSettings(values: LabelSettings): Promise<LabelSettings> {
    const site = await this.kitchen.current();
    return this.tx.run(async (t) => {
      const before = await this.settingsRepo.find(site.id, t);
      const saved = await this.settingsRepo.save(site.id, values, t);
      await this.audit.record(
        {
          action: 'label-settings.saved',
          record: { kind: 'label-settings', id: site.id },
          summary: 'Saved the label settings.',
          before,
          after: saved,
        },
        t,
      );
      return saved;
    });
  }

  async runs(query: LabelRunQuery): Promise<Page<LabelRun>> {
    const state = await this.books.state();
    const page = await this.runsRepo.search<LabelRunLogItem>(state.site.id, query);
    return { items: page.items.map((r) => view(r, state)), total: page.total };
  }

  async pdf(id: string): Promise<StreamableFile> {
    const site = await this.kitchen.current();
    const n = /^[1-9]\d{0,8}$/.test(id) ? Number(id) : NaN;
    const found = Number.isNaN(n) ? null : await this.runsRepo.findPdf(site.id, n);
    if (!found) throw new AppError('not-found', `There is no print run ${id}.`);
    const pdf = await readStoredFile(this.files, found.storageKey, found.sha256, `the PDF of print run ${id}`);
    return new StreamableFile(pdf, {
      type: 'application/pdf',
      length: pdf.length,
      disposition: `attachment; filename="labels-run-${n}.pdf"`,
    });
  }

  async print(request: LabelRunRequest, user: AuthUser): Promise<LabelRun> {
    if (request.override && user.role !== 'manager')
      throw new AppError('forbidden', 'Only a manager can print from a revision that is no longer current.', [
        { path: 'override', message: 'Only a manager can give an override.' },
      ]);
    const template = this.printer.template(request.template);
    if (!template)
      throw refused('validation', [
        {
          path: 'template',
          message: `There is no label template '${request.template}'. Use one of ${this.printer
            .templates()
            .map((x) => x.id)
            .join(', ')}.`,
        },
      ]);
    const isCase = template.template.purpose === 'case';
    const caseOnly: FieldError[] = [];
    if (!isCase && request.unitsPerCase !== undefined)
      caseOnly.push({ path: 'unitsPerCase', message: 'Units per case are given for case labels only.' });
    if (!isCase && request.shipment !== undefined)
      caseOnly.push({ path: 'shipment', message: 'Shipment labels are printed with the case template only.' });
    if (!template.printsBatch && request.batch !== undefined)
      caseOnly.push({ path: 'batch', message: `The template '${request.template}' prints no batch code: leave the batch out.` });
    if (request.batch !== undefined && request.items.length > 1)
      caseOnly.push({
        path: 'batch',
        message:
          'A batch code given by hand names one product’s production: print each product in a run of its own, or leave the batch out so the kitchen’s pattern gives each product its code.',
      });
    if (caseOnly.length > 0) throw refused('validation', caseOnly);

    const state = await this.books.state();
    const planned = await this.plan(request, state);

    // A published product's ticket carries a QR code to its public page (when the kitchen has the page on).
    const publicUrls = await this.publicPages.ticketUrls(
      state.site,
      planned.map((p) => ({ id: p.product.id, sale: p.source.sale })),
    );
    const printedAt = new Date();
    const { id } = await this.tx.run(async (t) => {
      const settings = await this.settingsRepo.lockForRun(state.site.id, DEFAULT_SETTINGS, t);
      await this.assertUnchanged(planned, state, t);
      const labels: PrintLabel[] = [];
      const items: LabelRunLogItem[] = [];
      const lines: RunLine[] = [];
      for (const p of planned) {
        const batch = !template.printsBatch ? '' : await this.batchFor(p, request, settings, state.site, t);
        const serials = isCase && request.shipment ? await this.serialsFor(p, settings, state.site, t) : undefined;
        const sale: Sale =
          isCase && request.unitsPerCase !== undefined ? { ...p.source.sale, unitsPerCase: request.unitsPerCase } : p.source.sale;
        const date = this.printer.dateOf(request.productionDate, sale);
        labels.push({
          declaration: p.source.declaration,
          sale,
          batch,
          quantity: p.quantity,
          revision: p.revision,
          ...(serials ? { sscc: serials } : {}),
          ...(publicUrls.has(p.product.id) ? { publicUrl: publicUrls.get(p.product.id) } : {}),
          path: p.path,
        });
        items.push({
          product: p.product.id,
          name: p.product.name,
          revision: p.revision,
          basisComputedAt: p.source.declaration.basis.computedAt,
          quantity: p.quantity,
          batch,
          dateMark: date ? (sale.dateMark ?? null) : null,
          date,
          ...(serials ? { sscc: [serials[0], serials[serials.length - 1]] as [string, string] } : {}),
        });
        lines.push({
          recipeId: p.rowId,
          productCode: p.product.id,
          revision: p.revision,
          batch,
          date,
          quantity: p.quantity,
          inputHash: p.inputHash,
          approvalId: p.approvalId,
        });
      }
      const rendered = await this.printer.render({
        template: template.template,
        labels,
        productionDate: request.productionDate,
        site: state.site,
        printedAt,
      });
      if (!rendered.ok) throw refused('label-refused', rendered.problems, 'The labels cannot be printed.');
      // Kept before the run's row commits; on a rollback the object is named by no row, and harmless.
      const sha256 = await keepFile(this.files, rendered.pdf);
      const runId = await this.runsRepo.add(
        {
          siteId: state.site.id,
          printedAt,
          printedBy: user.id,
          printedByName: user.name,
          template: request.template,
          productionDate: request.productionDate,
          request,
          items,
          lines,
          sources: planned.map((p) => p.source),
          overrideReason: request.override?.reason ?? null,
          storageKey: sha256,
          sizeBytes: rendered.pdf.length,
          sha256,
        },
        t,
      );
      const batches = [...new Set(items.map((i) => i.batch).filter(Boolean))];
      await this.audit.record(
        {
          action: 'labels.printed',
          record: { kind: 'label-run', id: runId },
          summary:
            `Printed run ${runId} with the ${request.template} template for ${request.productionDate}: ` +
            `${items.map((i) => `${i.quantity} × ${i.name} (revision ${i.revision})`).join(', ')}` +
            `${batches.length > 0 ? `; batch ${batches.join(', ')}` : ''}${request.override ? `; override: ${request.override.reason}` : ''}.`,
          after: { template: request.template, productionDate: request.productionDate, items },
        },
        t,
      );
      return { id: runId };
    });
    const row = await this.runsRepo.find<LabelRunLogItem>(state.site.id, id);
    return view(row!, state);
  }

  /**
   * Finds each product and what it is printed from: its current declaration, or, for a revision
   * named that is no longer current, what the newest run of that revision printed (a manager's
   * override with a reason only). Every problem is named at once; nothing is written.
   */
  private async plan(request: LabelRunRequest, state: KitchenState): Promise<PlannedItem[]> {
    const fields: FieldError[] = [];
    const planned: PlannedItem[] = [];
    /** Items printed from their current revision: only from an approved declaration. */
    const current: Omit<PlannedItem, 'source' | 'inputHash' | 'approvalId'>[] = [];
    let stale = false;
    let conflict = false;
    for (const [i, item] of request.items.entries()) {
      const path = `items.${i}`;
      const head = state.heads.get(item.product);
      const product = head?.kind === 'recipe' ? state.book.recipes.find((r) => r.id === item.product) : undefined;
      if (!head || !product) {
        fields.push({ path: `${path}.product`, message: `There is no product '${item.product}'.` });
        continue;
      }
      if (!product.sale) {
        fields.push({
          path: `${path}.product`,
          message: `${product.name} is not for sale: give it sale details before printing its labels.`,
        });
        continue;
      }
      const wanted = item.revision ?? head.revision;
      if (wanted > head.revision) {
        fields.push({
          path: `${path}.revision`,
          message: `${product.name} has no revision ${wanted}: its current revision is ${head.revision}.`,
        });
        continue;
      }
      if (wanted !== head.revision) {
        stale = true;
        if (!request.override) {
          conflict = true;
          fields.push({
            path: `${path}.revision`,
            message: `Revision ${wanted} of ${product.name} is no longer current (revision ${head.revision} is). A manager can print it again with an override and a reason.`,
          });
          continue;
        }
        const source = await this.runsRepo.findSource<PrintSource>(state.site.id, product.id, wanted);
        if (!source) {
          fields.push({
            path: `${path}.revision`,
            message: `No label of revision ${wanted} of ${product.name} was ever printed, so there is none to print again; print revision ${head.revision}.`,
          });
          continue;
        }
        planned.push({
          product,
          rowId: head.rowId,
          revision: wanted,
          quantity: item.quantity,
          source,
          path,
          inputHash: null,
          approvalId: null,
        });
        continue;
      }
      current.push({ product, rowId: head.rowId, revision: head.revision, quantity: item.quantity, path });
    }
    if (fields.length > 0) throw refused(conflict ? 'conflict' : 'validation', fields);
    const statuses = await this.approvals.of(
      state,
      current.map((c) => c.product.id),
    );
    assertApproved(current, statuses);
    current.forEach((c, k) =>
      planned.push({
        ...c,
        source: { declaration: keptCopy(statuses[k].current.served), sale: c.product.sale! },
        inputHash: statuses[k].current.inputHash,
        approvalId: statuses[k].approval!.id,
      }),
    );
    // In the request's order (each path is items.N).
    const place = (p: PlannedItem) => Number(p.path.slice('items.'.length));
    planned.sort((a, b) => place(a) - place(b));
    if (request.override && !stale)
      throw refused('validation', [
        {
          path: 'override',
          message:
            'An override is for printing a revision that is no longer current; every product here is printed from its current revision.',
        },
      ]);
    return planned;
  }

  /**
   * Refuses the run when a product printed from its current revision was saved again since the
   * run was planned, or its declaration changed (an ingredient or sub-recipe below it), so that
   * no label is printed from a declaration that has just stopped being current or approved. Read
   * after the run's lock, so it sees every write committed before it.
   */
  private async assertUnchanged(planned: PlannedItem[], before: KitchenState, t: Transaction): Promise<void> {
    const now = await this.books.state(t);
    const fields: FieldError[] = [];
    for (const p of planned) {
      const was = before.heads.get(p.product.id)?.revision;
      const is = now.heads.get(p.product.id)?.revision;
      if (p.revision === was && is !== was)
        fields.push({
          path: `${p.path}.product`,
          message: `${p.product.name} was saved again (revision ${is ?? 'none'}) while this run was being prepared; look at it again and print.`,
        });
    }
    if (fields.length > 0) throw refused('conflict', fields);
    const fromCurrent = planned.filter((p) => p.inputHash !== null);
    const statuses = await this.approvals.of(
      now,
      fromCurrent.map((p) => p.product.id),
      t,
    );
    assertApproved(fromCurrent, statuses);
    fromCurrent.forEach((p, k) => {
      if (statuses[k].current.inputHash !== p.inputHash)
        fields.push({
          path: `${p.path}.product`,
          message: `${p.product.name}'s declaration changed while this run was being prepared (something it is made of was saved); look at it again and print.`,
        });
    });
    if (fields.length > 0) throw refused('conflict', fields);
  }

  /**
   * The item's batch code: the one given (which may name this product and day again, as a
   * reprint does, but never another's), or the kitchen's pattern with the product's next
   * sequence of the day, skipping any code another product or day already has.
   */
  private async batchFor(
    p: PlannedItem,
    request: LabelRunRequest,
    settings: LabelSettings,
    site: SiteRow,
    t: Transaction,
  ): Promise<string> {
    const day = request.productionDate;
    if (request.batch !== undefined) {
      const given = await this.counters.findBatch(site.id, request.batch, t);
      if (given && (given.productCode !== p.product.id || given.day !== day))
        throw refused('conflict', [
          {
            path: 'batch',
            message: `Batch ${request.batch} is already the batch of '${given.productCode}' made on ${given.day}; a batch code names one product and one day.`,
          },
        ]);
      if (!given) await this.counters.addBatch(site.id, { code: request.batch, productCode: p.product.id, day, sequence: 0 }, t);
      return request.batch;
    }
    let sequence = (await this.counters.lastSequence(site.id, p.product.id, day, t)) + 1;
    for (;;) {
      const code = expandBatchPattern(settings.batchPattern, { date: day, product: p.product.id, sequence });
      const problem = batchProblem(code);
      if (problem)
        throw refused('label-refused', [
          { path: `${p.path}.product`, message: `The kitchen's batch pattern gives ${p.product.name} the code '${code}': ${problem}` },
        ]);
      if (!(await this.counters.findBatch(site.id, code, t))) {
        await this.counters.addBatch(site.id, { code, productCode: p.product.id, day, sequence }, t);
        return code;
      }
      sequence++;
    }
  }

  /** One SSCC per case of the item, from the kitchen's counter: never one given before. */
  private async serialsFor(p: PlannedItem, settings: LabelSettings, site: SiteRow, t: Transaction): Promise<string[]> {
    const prefix = settings.gs1CompanyPrefix;
    if (prefix === null)
      throw refused('label-refused', [
        {
          path: 'shipment',
          message: 'Shipment labels carry an SSCC, which needs the kitchen’s GS1 company prefix: a manager sets it in the label settings.',
        },
      ]);
    const first = await this.counters.takeSerials(site.id, prefix, settings.ssccExtension, p.quantity, t);
    const capacity = ssccCapacity(prefix);
    if (first + p.quantity > capacity)
      throw refused('label-refused', [
        {
          path: `${p.path}.quantity`,
          message: `The SSCC serials of company prefix ${prefix} with extension digit ${settings.ssccExtension} run out at ${capacity - 1}; ${capacity - first} are left. Use another extension digit.`,
        },
      ]);
    return Array.from({ length: p.quantity }, (_, k) => sscc(settings.ssccExtension, prefix, first + k));
  }
}

/**
 * Labels print only from an approved declaration: refuses the run, naming every product whose
 * current declaration a manager has not approved (never approved, or changed since), before
 * anything is written or a batch code given out.
 */
function assertApproved(items: readonly { product: BookRecipe; path: string }[], statuses: readonly ProductStatus[]): void {
  const fields: FieldError[] = [];
  items.forEach((item, k) => {
    const s = statuses[k];
    if (s.state === 'approved') return;
    fields.push({
      path: `${item.path}.product`,
      message:
        s.state === 'never-approved'
          ? `${item.product.name}'s declaration has never been approved: a manager approves it in Approvals first.`
          : `${item.product.name}'s declaration has changed since it was approved: a manager approves it in Approvals first.`,
    });
  });
  if (fields.length > 0) throw refused('approval-needed', fields);
}

function refused(
  code: 'validation' | 'conflict' | 'label-refused' | 'approval-needed',
  fields: FieldError[],
  lead = 'The labels cannot be printed.',
): AppError {
  return new AppError(code, `${lead} ${fields.map((f) => f.message).join(' ')}`, fields);
}

/** A logged run as the API sends it, with whether every item's revision is still its product's current one. */
function view(r: LabelRunRow<LabelRunLogItem>, state: KitchenState): LabelRun {
  return {
    id: r.id,
    printedAt: r.printedAt.toISOString(),
    printedBy: { id: r.printedBy, name: r.printedByName },
    template: r.template,
    productionDate: r.productionDate,
    items: r.items,
    override: r.overrideReason === null ? null : { reason: r.overrideReason },
    pdfBytes: r.sizeBytes,
    sha256: r.sha256,
    current: r.items.every((i) => state.heads.get(i.product)?.revision === i.revision),
  };
}
