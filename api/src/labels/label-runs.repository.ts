import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { parseJson } from '../common/json-column';
import { LabelRunItemModel } from './label-run-item.model';
import { LabelRunModel } from './label-run.model';

/** One product of a run, as searched: what the recall of a batch looks for. */
export interface RunLine {
  recipeId: number;
  productCode: string;
  revision: number;
  batch: string;
  /** YYYY-MM-DD, or null when the product has no date mark. */
  date: string | null;
  quantity: number;
  /** The declaration printed (its input hash) and the approval it was printed under; null for a reprint of an earlier revision. */
  inputHash: string | null;
  approvalId: number | null;
}

export interface NewLabelRun<Item, Source> {
  siteId: number;
  /** When it was printed: the time the labels show (the chart) is the time logged. */
  printedAt: Date;
  printedBy: number;
  printedByName: string;
  template: string;
  productionDate: string;
  request: unknown;
  /** Each item as printed, kept as the log shows it. */
  items: Item[];
  /** The same items, one searchable row each, in the same order. */
  lines: RunLine[];
  /** What each item was rendered from, in the same order. */
  sources: Source[];
  overrideReason: string | null;
  /** The PDF's key in the FileStore, put there before this row's transaction commits. */
  storageKey: string;
  sizeBytes: number;
  sha256: string;
}

/** A printed item with its run and what it was rendered from. */
export interface PrintedLine<Item, Source> {
  run: LabelRunRow<Item>;
  line: RunLine;
  position: number;
  source: Source | null;
}

/** A run as logged, without the PDF's bytes. */
export interface LabelRunRow<Item> {
  id: number;
  printedAt: Date;
  printedBy: number;
  printedByName: string;
  template: string;
  productionDate: string;
  items: Item[];
  overrideReason: string | null;
  sizeBytes: number;
  sha256: string;
}

export interface RunSearch {
  /** A product's id, exactly. */
  product?: string;
  /** A batch code, exactly. */
  batch?: string;
  /** Production days from and to (YYYY-MM-DD, both included). */
  from?: string;
  to?: string;
  limit: number;
  offset: number;
}

const METADATA = [
  'id',
  'printedBy',
  'printedByName',
  'template',
  'productionDate',
  'items',
  'overrideReason',
  'sizeBytes',
  'sha256',
  'createdAt',
];

/** The only place that reads and writes the print log (label_runs and label_run_items). */
@Injectable()
export class LabelRunsRepository {
  constructor(
    @InjectModel(LabelRunModel) private readonly runs: typeof LabelRunModel,
    @InjectModel(LabelRunItemModel) private readonly lines: typeof LabelRunItemModel,
  ) {}

  /** Logs a run with its PDF and one searchable row per item; returns the run's id. */
  async add<Item, Source>(run: NewLabelRun<Item, Source>, t: Transaction): Promise<number> {
    const { lines, printedAt, ...values } = run;
    const created = await this.runs.create({ ...values, createdAt: printedAt }, { transaction: t });
    await this.lines.bulkCreate(
      lines.map((l, position) => ({ ...l, runId: created.id, siteId: run.siteId, position, productionDate: run.productionDate })),
      { transaction: t },
    );
    return created.id;
  }

  async find<Item>(siteId: number, id: number, t?: Transaction): Promise<LabelRunRow<Item> | null> {
    const row = await this.runs.findOne({ where: { id, siteId }, attributes: METADATA, transaction: t });
    return row ? toRow<Item>(row) : null;
  }

  /** Runs with an item of the product or batch, printed for production days in the range; newest first, with how many match in all. */
  async search<Item>(siteId: number, q: RunSearch): Promise<{ items: LabelRunRow<Item>[]; total: number }> {
    const where: WhereOptions = { siteId };
    const dates = {
      ...(q.from ? { [Op.gte]: q.from } : {}),
      ...(q.to ? { [Op.lte]: q.to } : {}),
    };
    if (q.from || q.to) Object.assign(where, { productionDate: dates });
    if (q.product !== undefined || q.batch !== undefined) {
      const found = await this.lines.findAll({
        attributes: ['runId', 'productCode', 'batch'],
        where: {
          siteId,
          ...(q.product !== undefined ? { productCode: q.product } : {}),
          ...(q.batch !== undefined ? { batch: q.batch } : {}),
          ...(q.from || q.to ? { productionDate: dates } : {}),
        },
      });
      // The columns compare byte for byte; compared again here so no other spelling ever matches.
      const ids = found
        .filter((l) => (q.product === undefined || l.productCode === q.product) && (q.batch === undefined || l.batch === q.batch))
        .map((l) => l.runId);
      Object.assign(where, { id: [...new Set(ids)] });
    }
    const { rows, count } = await this.runs.findAndCountAll({
      where,
      attributes: METADATA,
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: q.limit,
      offset: q.offset,
    });
    return { items: rows.map((r) => toRow<Item>(r)), total: count };
  }

  /** What the newest run that printed the product at this revision rendered it from, or null when none did. */
  async findSource<Source>(siteId: number, productCode: string, revision: number, t?: Transaction): Promise<Source | null> {
    const lines = await this.lines.findAll({
      where: { siteId, productCode, revision },
      order: [['runId', 'DESC']],
      limit: 1,
      transaction: t,
    });
    const line = lines.find((l) => l.productCode === productCode);
    if (!line) return null;
    const run = await this.runs.findByPk(line.runId, { attributes: ['id', 'sources'], transaction: t });
    return run ? (parseJson(run.sources as Source[] | string)[line.position] ?? null) : null;
  }

  /**
   * Every print of a batch code (exactly), oldest first: each line with its run and what the
   * label was rendered from (the recall from a batch code, api/src/audit/recall.service.ts).
   */
  async printsOfBatch<Item, Source>(siteId: number, batch: string): Promise<PrintedLine<Item, Source>[]> {
    const lines = (await this.lines.findAll({ where: { siteId, batch }, order: [['id', 'ASC']] })).filter((l) => l.batch === batch);
    return this.withRuns<Item, Source>(siteId, lines);
  }

  /**
   * The newest printed items of the products (at most `limit`), each with its run and what it
   * was rendered from: the out-of-date labels are found among them.
   */
  async printsOfProducts<Item, Source>(
    siteId: number,
    productCodes: readonly string[],
    limit = 2000,
  ): Promise<PrintedLine<Item, Source>[]> {
    if (productCodes.length === 0) return [];
    const wanted = new Set(productCodes);
    const lines = (await this.lines.findAll({ where: { siteId, productCode: [...wanted] }, order: [['id', 'DESC']], limit })).filter((l) =>
      wanted.has(l.productCode),
    );
    return this.withRuns<Item, Source>(siteId, lines);
  }

  /** Each line with its run and what it was rendered from, in the lines' order. */
  private async withRuns<Item, Source>(siteId: number, lines: LabelRunItemModel[]): Promise<PrintedLine<Item, Source>[]> {
    if (lines.length === 0) return [];
    const runs = await this.runs.findAll({
      where: { siteId, id: [...new Set(lines.map((l) => l.runId))] },
      attributes: [...METADATA, 'sources'],
    });
    const byId = new Map(runs.map((r) => [r.id, r]));
    return lines.flatMap((l) => {
      const run = byId.get(l.runId);
      if (!run) return [];
      return [
        {
          run: toRow<Item>(run),
          line: {
            recipeId: l.recipeId,
            productCode: l.productCode,
            revision: l.revision,
            batch: l.batch,
            date: l.date,
            quantity: l.quantity,
            inputHash: l.inputHash,
            approvalId: l.approvalId,
          },
          position: l.position,
          source: parseJson(run.sources as Source[] | string)[l.position] ?? null,
        },
      ];
    });
  }

  async findPdf(siteId: number, id: number): Promise<{ storageKey: string; sha256: string } | null> {
    const row = await this.runs.findOne({ where: { id, siteId }, attributes: ['id', 'storageKey', 'sha256'] });
    return row ? { storageKey: row.storageKey, sha256: row.sha256 } : null;
  }
}

function toRow<Item>(m: LabelRunModel): LabelRunRow<Item> {
  return {
    id: m.id,
    printedAt: m.createdAt,
    printedBy: m.printedBy,
    printedByName: m.printedByName,
    template: m.template,
    productionDate: String(m.productionDate),
    items: parseJson(m.items as Item[] | string),
    overrideReason: m.overrideReason,
    sizeBytes: m.sizeBytes,
    sha256: m.sha256,
  };
}
