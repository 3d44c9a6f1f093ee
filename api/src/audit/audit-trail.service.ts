import { Readable } from 'node:stream';
import { Injectable, StreamableFile } from '@nestjs/common';
import {
  AUDIT_ACTION_LABELS,
  AUDIT_DEFAULT_PAGE_SIZE,
  csvLine,
  type AuditAction,
  type AuditEventDetail,
  type AuditEventRow,
  type AuditPage,
  type AuditQuery,
  type Role,
} from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { currentRequest } from '../common/request-context';
import { AuditRepository, type AuditEventFull, type AuditEventRecord, type AuditSearch } from './audit.repository';

/** The start of a calendar day in the kitchen's time (the server's, as the rest of the kitchen's days). */
function dayStart(day: string, plusDays = 0): Date {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(y, m - 1, d + plusDays);
}

/** The manager reads the trail of the kitchen the request is for (RolesGuard). */
function search(q: AuditQuery): AuditSearch {
  return {
    siteId: currentRequest()?.kitchenId ?? null,
    actorId: q.user,
    action: q.action,
    recordId: q.record,
    from: q.from ? dayStart(q.from) : undefined,
    before: q.to ? dayStart(q.to, 1) : undefined,
    order: q.sort ?? 'newest',
  };
}

function row(r: AuditEventRecord): AuditEventRow {
  return {
    id: r.id,
    at: r.at.toISOString(),
    actor: r.actorId !== null && r.actorName !== null ? { id: r.actorId, name: r.actorName, role: r.actorRole as Role } : null,
    action: r.action as AuditAction,
    recordKind: r.recordKind,
    recordId: r.recordId,
    summary: r.summary,
    address: r.address,
    hasChange: r.hasChange,
  };
}

const CSV_HEADER = [
  'Id',
  'At (UTC)',
  'User id',
  'User',
  'Role',
  'Action',
  'What',
  'Record kind',
  'Record',
  'Summary',
  'Address',
  'Before',
  'After',
];

function csvRow(r: AuditEventFull): string {
  const json = (v: unknown) => (v === null || v === undefined ? null : JSON.stringify(v));
  return csvLine([
    r.id,
    r.at.toISOString(),
    r.actorId,
    r.actorName,
    r.actorRole,
    r.action,
    AUDIT_ACTION_LABELS[r.action as AuditAction] ?? r.action,
    r.recordKind,
    r.recordId,
    r.summary,
    r.address,
    json(r.before),
    json(r.after),
  ]);
}

/** The manager's reading of the audit trail: a page of it, one event in full, and the CSV export. */
@Injectable()
export class AuditTrailService {
  constructor(private readonly repo: AuditRepository) {}

  async page(q: AuditQuery): Promise<AuditPage> {
    const page = q.page ?? 1;
    const pageSize = q.pageSize ?? AUDIT_DEFAULT_PAGE_SIZE;
    const found = await this.repo.search(search(q), pageSize, (page - 1) * pageSize);
    return { items: found.items.map(row), total: found.total, page, pageSize };
  }

  async event(id: string): Promise<AuditEventDetail> {
    const found = /^[1-9]\d{0,17}$/.test(id) ? await this.repo.find(id, currentRequest()?.kitchenId ?? null) : null;
    if (!found) throw new AppError('not-found', `There is no audit event ${id}.`);
    return { ...row(found), before: found.before, after: found.after };
  }

  /**
   * Every matching event as CSV (RFC 4180, CRLF, formula cells kept as text), with a UTF-8 byte
   * order mark so spreadsheets read accents and the kitchen's names right. Written as it is read.
   */
  export(q: AuditQuery, now = new Date()): StreamableFile {
    const events = this.repo.each(search(q));
    async function* lines() {
      yield `\uFEFF${csvLine(CSV_HEADER)}`;
      for await (const e of events) yield csvRow(e);
    }
    const stamp = now.toISOString().slice(0, 10);
    return new StreamableFile(Readable.from(lines()), {
      type: 'text/csv; charset=utf-8',
      disposition: `attachment; filename="crumbproof-audit-${stamp}.csv"`,
    });
  }
}
