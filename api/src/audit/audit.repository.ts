import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { literal, Op, type Transaction, type WhereOptions } from 'sequelize';
import { parseJson } from '../common/json-column';
import { AuditEventModel } from './audit-event.model';

export interface NewAuditEvent {
  at: Date;
  actorId: number | null;
  actorName: string | null;
  actorRole: string | null;
  action: string;
  recordKind: string | null;
  recordId: string | null;
  summary: string;
  before: unknown;
  after: unknown;
  address: string | null;
  /** The kitchen it was recorded at (the request's); null: none in particular. */
  siteId: number | null;
}

export interface AuditEventRecord extends Omit<NewAuditEvent, 'before' | 'after'> {
  id: string;
  hasChange: boolean;
}

export interface AuditEventFull extends AuditEventRecord {
  before: unknown;
  after: unknown;
}

/**
 * Changes to the recipe book every kitchen shares: each kitchen's managers read these wherever
 * they were made, as a change at one kitchen can change what every kitchen declares.
 */
export const SHARED_BOOK_ACTIONS = [
  'ingredient.saved',
  'recipe.saved',
  'recipe.archived',
  'book.imported',
  'ingredients.imported',
  'swap.applied',
  'specification.uploaded',
  'specifications.reviewed',
] as const;

export interface AuditSearch {
  /**
   * The kitchen whose trail is read: its own events, those at no kitchen in particular about its
   * people (see personWorksAt), and the changes to the shared book made anywhere (SHARED_BOOK_ACTIONS).
   */
  siteId: number | null;
  actorId?: number;
  action?: string;
  recordId?: string;
  /** From (included) and before (excluded). */
  from?: Date;
  before?: Date;
  order: 'newest' | 'oldest';
}

const LIST = [
  'id',
  'at',
  'actorId',
  'actorName',
  'actorRole',
  'action',
  'recordKind',
  'recordId',
  'summary',
  'address',
  'siteId',
  [literal('(`before` IS NOT NULL OR `after` IS NOT NULL)'), 'hasChange'],
] as const;

/** The only place that reads and adds rows of audit_events; it never updates or deletes one (nor could it: see migration 0009). */
@Injectable()
export class AuditRepository {
  constructor(@InjectModel(AuditEventModel) private readonly events: typeof AuditEventModel) {}

  async add(event: NewAuditEvent, t?: Transaction): Promise<void> {
    await this.events.create({ ...event }, { transaction: t });
  }

  /**
   * Of an event at no kitchen in particular (a sign-in, a sign-out, a refused sign-in), whether it
   * belongs on kitchen `siteId`'s trail: when the person it is about (who did it, or the account or
   * address it names) works there, or works at no kitchen (an unknown address, the command line).
   * So one kitchen's managers do not read when the people of another sign in.
   */
  private personWorksAt(siteId: number): WhereOptions {
    const person = `COALESCE(actor_id, IF(record_kind = 'user', record_id, NULL), (SELECT u.id FROM users u WHERE record_kind = 'email' AND u.email = record_id))`;
    // Over the person's roles: none at all gives NULL (shown), any at this kitchen 1 (shown).
    const here = `(SELECT MAX(kr.site_id = ${this.events.sequelize!.escape(siteId)}) FROM kitchen_roles kr WHERE kr.user_id = ${person})`;
    return literal(`COALESCE(${here}, 1) = 1`);
  }

  private where(q: AuditSearch): WhereOptions {
    return {
      ...(q.siteId !== null
        ? {
            [Op.or]: [
              { siteId: q.siteId },
              { [Op.and]: [{ siteId: null }, this.personWorksAt(q.siteId)] },
              { action: { [Op.in]: [...SHARED_BOOK_ACTIONS] } },
            ],
          }
        : {}),
      ...(q.actorId !== undefined ? { actorId: q.actorId } : {}),
      ...(q.action !== undefined ? { action: q.action } : {}),
      ...(q.recordId !== undefined ? { recordId: q.recordId } : {}),
      ...(q.from || q.before ? { at: { ...(q.from ? { [Op.gte]: q.from } : {}), ...(q.before ? { [Op.lt]: q.before } : {}) } } : {}),
    };
  }

  private order(q: Pick<AuditSearch, 'order'>): [string, string][] {
    const dir = q.order === 'newest' ? 'DESC' : 'ASC';
    return [
      ['at', dir],
      ['id', dir],
    ];
  }

  /** One page of matching rows (without before and after), and how many match in all. */
  async search(q: AuditSearch, limit: number, offset: number): Promise<{ items: AuditEventRecord[]; total: number }> {
    const where = this.where(q);
    const [rows, total] = await Promise.all([
      this.events.findAll({ where, attributes: [...LIST] as never, order: this.order(q), limit, offset }),
      this.events.count({ where }),
    ]);
    // The code columns compare byte for byte; compared again here so no other spelling ever matches.
    return { items: rows.map(toRecord).filter((r) => q.recordId === undefined || r.recordId === q.recordId), total };
  }

  /** Every matching row with before and after, in batches of `size`, for the export. */
  async *each(q: AuditSearch, size = 500): AsyncGenerator<AuditEventFull> {
    for (let offset = 0; ; offset += size) {
      const rows = await this.events.findAll({
        where: this.where(q),
        attributes: [...LIST, 'before', 'after'] as never,
        order: this.order(q),
        limit: size,
        offset,
      });
      for (const row of rows) {
        const r = toFull(row);
        if (q.recordId === undefined || r.recordId === q.recordId) yield r;
      }
      if (rows.length < size) return;
    }
  }

  /** Rows of the given actions after a moment, oldest first, with before and after (at most `limit`): what changed since an approval. */
  async since(actions: readonly string[], after: Date, limit = 500): Promise<AuditEventFull[]> {
    const rows = await this.events.findAll({
      where: { action: { [Op.in]: [...actions] }, at: { [Op.gt]: after } },
      attributes: [...LIST, 'before', 'after'] as never,
      order: this.order({ order: 'oldest' }),
      limit,
    });
    return rows.map(toFull);
  }

  /** One event, when it is on the kitchen's trail (see AuditSearch.siteId). */
  async find(id: string, siteId: number | null): Promise<AuditEventFull | null> {
    const row = await this.events.findOne({
      where: { [Op.and]: [{ id }, this.where({ siteId, order: 'newest' })] },
      attributes: [...LIST, 'before', 'after'] as never,
    });
    return row ? toFull(row) : null;
  }
}

function toRecord(m: AuditEventModel): AuditEventRecord {
  return {
    id: String(m.id),
    at: m.at,
    actorId: m.actorId,
    actorName: m.actorName,
    actorRole: m.actorRole,
    action: m.action,
    recordKind: m.recordKind,
    recordId: m.recordId,
    summary: m.summary,
    address: m.address,
    siteId: m.siteId ?? null,
    hasChange: Boolean(Number(m.getDataValue('hasChange' as never))),
  };
}

function toFull(m: AuditEventModel): AuditEventFull {
  const json = (v: unknown) => (v === null || v === undefined ? null : parseJson<unknown>(v));
  return { ...toRecord(m), before: json(m.before), after: json(m.after) };
}
