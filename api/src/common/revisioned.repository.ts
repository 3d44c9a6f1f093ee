import { Op, type ModelStatic, type Transaction, type WhereOptions } from 'sequelize';
import type { Model } from 'sequelize-typescript';
import { AppError } from './app-error';
import { parseJson } from './json-column';
import { jsonBytes, statementChunks } from './statement-chunks';

export interface RevisionedRow {
  id: number;
  siteId: number;
  code: string;
  name: string;
  currentRevision: number;
  archived: boolean;
  updatedAt: Date;
}

export interface RevisionRow<B> {
  revision: number;
  body: B;
  note: string;
  authorId: number | null;
  createdAt: Date;
}

/** An item's head row: what names it, without its body. */
export interface Head {
  id: number;
  code: string;
  name: string;
}

export interface Current<B> {
  id: number;
  code: string;
  name: string;
  revision: number;
  body: B;
  updatedAt: Date;
}

/** Items written per statement by writeMany, at most (and within STATEMENT_BODY_BYTES). */
const WRITE_CHUNK = 500;

/**
 * Whether MariaDB takes two codes for the same row: the code columns are utf8mb4_bin (migration
 * 0005), which compares byte for byte but, as a PAD SPACE collation, ignores trailing spaces.
 */
function sameCodeInDatabase(a: string, b: string): boolean {
  return a.replace(/ +$/, '') === b.replace(/ +$/, '');
}

/** Refuses a write to `code` when the database took it for another item's code. */
function refuseOtherRow(code: string, matched: readonly RevisionedRow[]): void {
  const other = matched.find((r) => r.code !== code);
  if (other) {
    throw new AppError(
      'conflict',
      `The id '${code}' would reach the existing '${other.code}'. Nothing was saved; use '${other.code}' or another id.`,
      [{ path: 'id', message: `This would reach '${other.code}'.` }],
    );
  }
}

// sequelize-typescript's Model declares id, createdAt and updatedAt as `any`; rows are read through
// these views so that each column has the type the table gives it.
const headRow = (m: Model & RevisionedRow): RevisionedRow => m;
const revisionRow = <B>(m: Model & RevisionRow<B>): RevisionRow<B> => m;

/**
 * Storage of a thing that keeps every revision (ingredients, recipes): a head row naming it and
 * pointing at its current revision, and one row per revision holding the full body.
 */
export class RevisionedRepository<B extends { name: string }> {
  constructor(
    private readonly heads: ModelStatic<Model & RevisionedRow>,
    private readonly revisions: ModelStatic<Model & RevisionRow<B>>,
    private readonly foreignKey: string,
  ) {}

  /** Every current, not archived item of a site with its current body (two queries, no N+1). */
  async listCurrent(siteId: number, t?: Transaction): Promise<Current<B>[]> {
    const heads = (await this.heads.findAll({ where: { siteId, archived: false }, order: [['name', 'ASC']], transaction: t })).map(headRow);
    if (heads.length === 0) return [];
    const revs = await this.revisions.findAll({
      where: { [this.foreignKey]: heads.map((h) => h.id) },
      transaction: t,
    });
    const byKey = new Map(revs.map((r) => [`${(r as unknown as Record<string, number>)[this.foreignKey]}:${r.revision}`, r]));
    return heads.map((h) => {
      const rev = byKey.get(`${h.id}:${h.currentRevision}`);
      if (!rev) throw new Error(`${h.code} has no revision ${h.currentRevision}`);
      return { id: h.id, code: h.code, name: h.name, revision: h.currentRevision, body: parseJson(rev.body), updatedAt: h.updatedAt };
    });
  }

  /** Every current, not archived item of a site by name, without bodies. */
  async listHeads(siteId: number): Promise<Head[]> {
    const rows = await this.heads.findAll({
      where: { siteId, archived: false },
      attributes: ['id', 'code', 'name'],
      order: [['name', 'ASC']],
    });
    return rows.map(headRow).map((r) => ({ id: r.id, code: r.code, name: r.name }));
  }

  /**
   * The head row whose code is exactly `code`. The code columns compare byte for byte
   * (utf8mb4_bin, migration 0005), but a MariaDB collation still ignores trailing spaces, so the
   * rows the database matched are compared here again, as everything else compares ids.
   */
  private async exactHead(
    where: WhereOptions,
    code: string,
    options: { t?: Transaction; lock?: boolean; attributes?: string[] } = {},
  ): Promise<(Model & RevisionedRow) | null> {
    const rows = await this.heads.findAll({
      where: { ...where, code },
      ...(options.attributes ? { attributes: options.attributes } : {}),
      transaction: options.t,
      ...(options.lock && options.t ? { lock: options.t.LOCK.UPDATE } : {}),
    });
    return rows.find((r) => r.code === code) ?? null;
  }

  async findHead(siteId: number, code: string): Promise<Head | null> {
    const found = await this.exactHead({ siteId, archived: false }, code, { attributes: ['id', 'code', 'name'] });
    const row = found && headRow(found);
    return row ? { id: row.id, code: row.code, name: row.name } : null;
  }

  /** Locks an item's head row until the transaction ends (for numbering what belongs to it). */
  async lockHead(id: number, t: Transaction): Promise<void> {
    await this.heads.findByPk(id, { attributes: ['id'], transaction: t, lock: t.LOCK.UPDATE });
  }

  async findCurrent(siteId: number, code: string, t?: Transaction): Promise<Current<B> | null> {
    const found = await this.exactHead({ siteId, archived: false }, code, { t });
    if (!found) return null;
    const head = headRow(found);
    const rev = await this.revisions.findOne({ where: { [this.foreignKey]: head.id, revision: head.currentRevision }, transaction: t });
    if (!rev) return null;
    return {
      id: head.id,
      code: head.code,
      name: head.name,
      revision: head.currentRevision,
      body: parseJson(rev.body),
      updatedAt: head.updatedAt,
    };
  }

  async history(siteId: number, code: string): Promise<RevisionRow<B>[] | null> {
    const found = await this.exactHead({ siteId }, code);
    if (!found) return null;
    const revs = await this.revisions.findAll({ where: { [this.foreignKey]: headRow(found).id }, order: [['revision', 'DESC']] });
    return revs
      .map(revisionRow)
      .map((r) => ({ revision: r.revision, body: parseJson(r.body), note: r.note, authorId: r.authorId, createdAt: r.createdAt }));
  }

  /** The revisions of an item from `from` on, oldest first, read in the write's transaction. */
  async revisionsFrom(headId: number, from: number, t: Transaction): Promise<RevisionRow<B>[]> {
    const revs = await this.revisions.findAll({
      where: { [this.foreignKey]: headId, revision: { [Op.gte]: from } },
      order: [['revision', 'ASC']],
      transaction: t,
    });
    return revs
      .map(revisionRow)
      .map((r) => ({ revision: r.revision, body: parseJson(r.body), note: r.note, authorId: r.authorId, createdAt: r.createdAt }));
  }

  /**
   * As `write` for many items in one transaction, in a bounded number of queries (a few per
   * thousand items) rather than three per item: the book import's path. Returns each code's new
   * revision. The same refusal as `write` for a code the database would take for another one.
   */
  async writeMany(
    siteId: number,
    items: readonly { code: string; body: B }[],
    meta: { authorId: number | null; note: string },
    t: Transaction,
  ): Promise<Map<string, number>> {
    const written = new Map<string, number>();
    for (const chunk of statementChunks(items, (i) => jsonBytes(i.body), WRITE_CHUNK)) {
      const matched = (
        await this.heads.findAll({ where: { siteId, code: chunk.map((i) => i.code) }, transaction: t, lock: t.LOCK.UPDATE })
      ).map(headRow);
      const byCode = new Map<string, RevisionedRow>();
      for (const item of chunk) {
        const same = matched.filter((r) => sameCodeInDatabase(r.code, item.code));
        refuseOtherRow(item.code, same);
        if (same[0]) byCode.set(item.code, same[0]);
      }
      const fresh = new Set(chunk.filter((i) => !byCode.has(i.code)));
      if (fresh.size > 0) {
        await this.heads.bulkCreate(
          [...fresh].map((i) => ({ siteId, code: i.code, name: i.body.name, currentRevision: 1 }) as never),
          {
            transaction: t,
          },
        );
        const created = (
          await this.heads.findAll({
            where: { siteId, code: [...fresh].map((i) => i.code) },
            attributes: ['id', 'code', 'currentRevision'],
            transaction: t,
          })
        ).map(headRow);
        for (const row of created) byCode.set(row.code, row);
      }
      const revisions: object[] = [];
      const revised: object[] = [];
      for (const item of chunk) {
        const head = byCode.get(item.code);
        if (!head) throw new Error(`${item.code} was not written`);
        const isNew = fresh.has(item);
        const revision = isNew ? 1 : head.currentRevision + 1;
        revisions.push({ [this.foreignKey]: head.id, revision, body: item.body, ...meta });
        if (!isNew)
          revised.push({ id: head.id, siteId, code: head.code, name: item.body.name, currentRevision: revision, archived: false });
        written.set(item.code, revision);
      }
      // Every revised head in one statement: INSERT … ON DUPLICATE KEY UPDATE on the rows just locked.
      if (revised.length > 0) {
        await this.heads.bulkCreate(revised as never[], {
          updateOnDuplicate: ['currentRevision', 'name', 'archived', 'updatedAt'] as never[],
          transaction: t,
        });
      }
      await this.revisions.bulkCreate(revisions as never[], { transaction: t });
    }
    return written;
  }

  /**
   * Creates the item with revision 1, or adds a revision; returns the new revision number. A row
   * the database takes for `code` without being exactly it is never written: the write is
   * refused (and its transaction undone) rather than reach an item other than the one it names.
   */
  async write(siteId: number, code: string, body: B, meta: { authorId: number | null; note: string }, t: Transaction): Promise<number> {
    const matched = await this.heads.findAll({ where: { siteId, code }, transaction: t, lock: t.LOCK.UPDATE });
    refuseOtherRow(code, matched.map(headRow));
    const head = matched[0] ?? null;
    if (!head) {
      const created = await this.heads.create({ siteId, code, name: body.name, currentRevision: 1 } as never, { transaction: t });
      await this.revisions.create({ [this.foreignKey]: headRow(created).id, revision: 1, body, ...meta } as never, { transaction: t });
      return 1;
    }
    const next = head.currentRevision + 1;
    await this.revisions.create({ [this.foreignKey]: headRow(head).id, revision: next, body, ...meta } as never, { transaction: t });
    await head.update({ currentRevision: next, name: body.name, archived: false }, { transaction: t });
    return next;
  }
}
