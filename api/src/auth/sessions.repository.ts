import { randomBytes } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import { ChangeFeed, KeptUntilChanged } from '../database/change-feed';
import { SessionModel, type SessionEndReason } from './session.model';

/** How long an ended or expired session's row is kept before it is deleted. */
const KEEP_ENDED_MS = 7 * 24 * 60 * 60 * 1000;

/** A session row as a request's check reads it: never changed in place, since every request shares it. */
export type LiveSession = Readonly<Pick<SessionModel, 'id' | 'userId' | 'createdAt' | 'idleExpiresAt' | 'expiresAt'>>;

const running = (s: LiveSession | null, now: Date) =>
  s !== null && s.idleExpiresAt.getTime() > now.getTime() && s.expiresAt.getTime() > now.getTime();

/**
 * The only place that reads and writes the sessions table. Ending sessions raises the access
 * revision in the same transaction (ChangeFeed.accessWrite): this instance refuses them at once,
 * every other within CHANGE_STALE_MS (1 s; typically one poll, 200 ms).
 */
@Injectable()
export class SessionsRepository {
  /** Each running session as last read, by id: what every request's check reads (see findLive). */
  private readonly kept: KeptUntilChanged<string, LiveSession | null>;

  constructor(
    @InjectModel(SessionModel) private readonly sessions: typeof SessionModel,
    private readonly feed: ChangeFeed,
  ) {
    this.kept = new KeptUntilChanged(feed, 'access');
  }

  async start(userId: number, now: Date, idleMs: number, maxMs: number): Promise<SessionModel> {
    await this.sessions.destroy({ where: { expiresAt: { [Op.lt]: new Date(now.getTime() - KEEP_ENDED_MS) } } });
    const expiresAt = new Date(now.getTime() + maxMs);
    return this.sessions.create({
      id: randomBytes(16).toString('hex'),
      userId,
      createdAt: now,
      idleExpiresAt: new Date(Math.min(now.getTime() + idleMs, expiresAt.getTime())),
      expiresAt,
    });
  }

  /**
   * The session if it is still running at `now`: not ended, neither idle too long nor past its end.
   * A session read running is kept and checked against `now` at each request, until a change to
   * sessions is heard (see the class); one kept but idle or past its end by now is read again, since
   * another instance may have renewed it. Sessions not found are not kept.
   */
  async findLive(id: string, now: Date): Promise<LiveSession | null> {
    const kept = await this.kept.get(
      id,
      () => this.readLive(id, now),
      (s) => s !== null,
    );
    if (kept === null || running(kept, now)) return kept;
    // Kept from before it was renewed (on another instance), or past its end: read again.
    this.kept.forget(id);
    const again = await this.kept.get(
      id,
      () => this.readLive(id, now),
      (s) => s !== null,
    );
    return running(again, now) ? again : null;
  }

  private async readLive(id: string, now: Date): Promise<LiveSession | null> {
    const row = await this.sessions.findOne({
      where: { id, endedAt: null, idleExpiresAt: { [Op.gt]: now }, expiresAt: { [Op.gt]: now } },
    });
    return row
      ? Object.freeze({
          id: row.id,
          userId: row.userId,
          createdAt: row.createdAt,
          idleExpiresAt: row.idleExpiresAt,
          expiresAt: row.expiresAt,
        })
      : null;
  }

  /** Moves the idle end on, never past the absolute end; false when the session is no longer running. */
  async renew(id: string, now: Date, idleExpiresAt: Date): Promise<boolean> {
    const [changed] = await this.sessions.update(
      { idleExpiresAt },
      { where: { id, endedAt: null, idleExpiresAt: { [Op.gt]: now }, expiresAt: { [Op.gte]: idleExpiresAt } } },
    );
    // Moving the idle end on revokes nothing: only this instance's copy goes, the others read it again when theirs runs out.
    this.kept.forget(id);
    return changed === 1;
  }

  async end(id: string, reason: SessionEndReason) {
    await this.feed.accessWrite(undefined, (t) =>
      this.sessions.update({ endedAt: new Date(), endReason: reason }, { where: { id, endedAt: null }, transaction: t }),
    );
  }

  /** Ends every running session of a user, but the one given (the person making the change keeps theirs). */
  async endAllOf(userId: number, reason: SessionEndReason, except?: string) {
    await this.feed.accessWrite(undefined, (t) =>
      this.sessions.update(
        { endedAt: new Date(), endReason: reason },
        { where: { userId, endedAt: null, ...(except ? { id: { [Op.ne]: except } } : {}) }, transaction: t },
      ),
    );
  }
}
