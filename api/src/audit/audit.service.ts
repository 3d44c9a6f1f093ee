import { Injectable, Logger } from '@nestjs/common';
import type { AuditAction, AuditActor } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { currentRequest } from '../common/request-context';
import { AuditRepository } from './audit.repository';

/** What a write says about itself in the trail. */
export interface AuditEntry {
  action: AuditAction;
  /** What kind of record (ingredient, recipe, user…) and its id there. */
  record?: { kind: string; id: string | number } | null;
  /** In words, for the Audit page and the export. */
  summary: string;
  /** The record before and after the write (for a revisioned item: the previous revision's body and the new one). */
  before?: unknown;
  after?: unknown;
  /** Who did it, where the request has no signed-in user (a sign-in, the first manager); null for an anonymous event. */
  actor?: AuditActor | null;
  /** The client's address, where the event is recorded outside the request's handling (a refusal). */
  address?: string | null;
}

const SUMMARY_MAX = 1000;

/**
 * Records events in the append-only audit trail. A write calls `record` with its own transaction,
 * so the event is saved with the write or not at all; who and from where come from the request.
 */
@Injectable()
export class AuditService {
  private readonly logger = new Logger('Audit');

  constructor(private readonly repo: AuditRepository) {}

  async record(entry: AuditEntry, t?: Transaction): Promise<void> {
    const request = currentRequest();
    const actor = entry.actor !== undefined ? entry.actor : (request?.actor ?? null);
    const summary = entry.summary.length > SUMMARY_MAX ? `${entry.summary.slice(0, SUMMARY_MAX - 1)}…` : entry.summary;
    await this.repo.add(
      {
        at: new Date(),
        actorId: actor?.id ?? null,
        actorName: actor?.name ?? null,
        actorRole: actor?.role ?? null,
        action: entry.action,
        recordKind: entry.record?.kind ?? null,
        recordId: entry.record ? String(entry.record.id) : null,
        summary,
        before: entry.before ?? null,
        after: entry.after ?? null,
        address: entry.address !== undefined ? entry.address : (request?.address ?? null),
        siteId: request?.kitchenId ?? null,
      },
      t,
    );
  }

  /**
   * An event that describes no write (a refused request): recorded on its own; when it cannot be
   * saved, that is logged and the refusal still goes to the client.
   */
  async recordRefusal(entry: AuditEntry): Promise<void> {
    try {
      await this.record(entry);
    } catch (err) {
      this.logger.error(`The audit trail could not record a refusal: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
}
