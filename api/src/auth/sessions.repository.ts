import { randomBytes } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import { SessionModel, type SessionEndReason } from './session.model';

/** How long an ended or expired session's row is kept before it is deleted. */
const KEEP_ENDED_MS = 7 * 24 * 60 * 60 * 1000;

/** The only place that reads and writes the sessions table. */
@Injectable()
export class SessionsRepository {
  constructor(@InjectModel(SessionModel) private readonly sessions: typeof SessionModel) {}

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

  /** The session if it is still running at `now`: not ended, neither idle too long nor past its end. */
  findLive(id: string, now: Date) {
    return this.sessions.findOne({
      where: { id, endedAt: null, idleExpiresAt: { [Op.gt]: now }, expiresAt: { [Op.gt]: now } },
    });
  }

  /** Moves the idle end on, never past the absolute end; false when the session is no longer running. */
  async renew(id: string, now: Date, idleExpiresAt: Date): Promise<boolean> {
    const [changed] = await this.sessions.update(
      { idleExpiresAt },
      { where: { id, endedAt: null, idleExpiresAt: { [Op.gt]: now }, expiresAt: { [Op.gte]: idleExpiresAt } } },
    );
    return changed === 1;
  }

  async end(id: string, reason: SessionEndReason) {
    await this.sessions.update({ endedAt: new Date(), endReason: reason }, { where: { id, endedAt: null } });
  }

  /** Ends every running session of a user, but the one given (the person making the change keeps theirs). */
  async endAllOf(userId: number, reason: SessionEndReason, except?: string) {
    await this.sessions.update(
      { endedAt: new Date(), endReason: reason },
      { where: { userId, endedAt: null, ...(except ? { id: { [Op.ne]: except } } : {}) } },
    );
  }
}
