import { createHash, randomBytes } from 'node:crypto';
import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { Transaction } from 'sequelize';
import type {
  AccountLinkPurpose,
  AccountLinkState,
  InviteUserRequest,
  PasswordResetAnswer,
  PasswordResetRequest,
  Role,
  SetPasswordRequest,
  User,
  UserAdded,
} from '@crumbproof/shared';
import { AuditService } from '../audit/audit.service';
import { SessionsRepository } from '../auth/sessions.repository';
import { SignInLimits } from '../auth/sign-in-limits.repository';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { Clock } from '../common/clock';
import { TransactionRunner } from '../common/transaction';
import { appAddress, type AppConfig } from '../config/config';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { SiteRepository } from '../kitchen/site.repository';
import { MailService } from '../mail/mail.service';
import { invitationMail, passwordResetMail } from '../mail/templates/account-links';
import { hashPassword, refuseCommonPassword } from '../users/password';
import type { UserModel } from '../users/user.model';
import { toUser, UsersRepository } from '../users/users.repository';
import { UsersService } from '../users/users.service';
import { AccountLinksRepository, type AccountLinkRow } from './account-links.repository';

/** How long a mailed link works. */
export const LINK_MINUTES: Record<AccountLinkPurpose, number> = { invitation: 72 * 60, 'password-reset': 60 };
/** Reset links one account is sent in an hour at most; past that a request is answered alike and sends nothing. */
export const RESETS_PER_HOUR = 3;

/**
 * Every answer to a reset request takes at least this long, so that a known address (a link
 * written and a mail queued) cannot be told from an unknown one by the time the answer takes.
 */
const RESET_ANSWER_MS = 400;

export const RESET_ANSWER: PasswordResetAnswer = {
  message: `If an account has this email address, a link to choose a new password is on its way to it. The link works once, for ${LINK_MINUTES['password-reset']} minutes.`,
};

const sha256 = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** Why a link cannot be used, in words, with what to do. */
const REFUSED: Record<'used' | 'expired' | 'replaced' | 'unknown', string> = {
  used: 'This link has been used already: each link works once.',
  expired: 'This link has expired.',
  replaced: 'A newer link was sent since this one: use the newest mail.',
  unknown: 'This link is not known: open it from the mail again, or ask for a new one.',
};

/**
 * Accounts by mail: a manager invites someone (a user with no password yet, who gets a one-time
 * link to choose one), sends the invitation again, and anyone may ask for a password reset link.
 * Links are random 32 bytes, only their SHA-256 is kept, they expire and work once; setting a
 * password with one ends every session of that user.
 */
@Injectable()
export class AccountsService {
  private readonly logger = new Logger('Accounts');

  constructor(
    private readonly users: UsersRepository,
    private readonly links: AccountLinksRepository,
    private readonly mail: MailService,
    private readonly sites: SiteRepository,
    private readonly sessions: SessionsRepository,
    private readonly limits: SignInLimits,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly clock: Clock,
    private readonly kitchen: KitchenService,
    private readonly kitchenRoles: KitchenRolesRepository,
    private readonly people: UsersService,
  ) {}

  /**
   * Adds a user with no password at the request's kitchen and queues their invitation, in one
   * transaction. An address that already has an account is given the role at this kitchen
   * instead, with no invitation (UsersService.addExisting).
   */
  async invite(actor: AuthUser, req: InviteUserRequest): Promise<UserAdded> {
    const existing = await this.users.findByEmail(req.email);
    if (existing) return this.people.addExisting(existing, req.role);
    return this.tx.run(async (t) => {
      const row = await this.users.create({ email: req.email, name: req.name, role: req.role, passwordHash: null }, t);
      // Invited to the kitchen the manager invites them at, in the role given.
      const site = await this.kitchen.find(t);
      if (site) await this.kitchenRoles.set(row.id, site.id, req.role, t);
      const user = toUser(row, { role: req.role, elsewhere: 0 });
      const expiresAt = await this.sendLink(row, 'invitation', actor.name, t);
      await this.audit.record(
        {
          action: 'user.invited',
          record: { kind: 'user', id: user.id },
          summary: `Invited ${user.name} (${user.email}) as ${user.role}${site ? ` at ${site.name}` : ''}; the invitation link works until ${expiresAt.toISOString()}.`,
          before: null,
          after: user,
        },
        t,
      );
      return {
        ...user,
        outcome: 'created',
        message: `${user.name} was invited: a link to choose a password is on its way to ${user.email}.`,
      };
    });
  }

  /** A new invitation for a person of the request's kitchen who has not chosen a password yet; the earlier link stops working. */
  async resendInvitation(actor: AuthUser, id: number): Promise<User> {
    return this.tx.run(async (t) => {
      const row = await this.users.findById(id, t);
      const site = await this.kitchen.find(t);
      const role = row && site ? await this.kitchenRoles.roleAt(row.id, site.id, t) : null;
      if (site && !role) throw new AppError('not-found', `There is no user ${id} at this kitchen (${site.name}).`);
      if (!row) throw new AppError('not-found', `There is no user ${id}.`);
      if (!row.active) throw new AppError('conflict', `${row.name} is deactivated: make them active first.`);
      if (row.passwordHash !== null) {
        throw new AppError(
          'conflict',
          `${row.name} has chosen a password already. If they have forgotten it, they can use “Forgot your password?” on the sign-in page.`,
        );
      }
      const expiresAt = await this.sendLink(row, 'invitation', actor.name, t, role ?? row.role);
      await this.audit.record(
        {
          action: 'invitation.resent',
          record: { kind: 'user', id: row.id },
          summary: `Sent ${row.name} (${row.email}) a new invitation; it works until ${expiresAt.toISOString()} and the earlier link no longer does.`,
        },
        t,
      );
      return toUser(row, role ? { role, elsewhere: (await this.kitchenRoles.ofUser(row.id, t)).length - 1 } : undefined);
    });
  }

  /**
   * "Forgot your password?": the same answer whatever the address. An active account gets a link
   * (at most RESETS_PER_HOUR in an hour); the trail records each request and what came of it.
   */
  async requestReset(req: PasswordResetRequest, address: string): Promise<PasswordResetAnswer> {
    await this.limits.beginReset(address, this.clock.now());
    const started = Date.now();
    try {
      return await this.reset(req);
    } finally {
      await new Promise((resolve) => setTimeout(resolve, Math.max(0, RESET_ANSWER_MS - (Date.now() - started))));
    }
  }

  private async reset(req: PasswordResetRequest): Promise<PasswordResetAnswer> {
    const row = await this.users.findByEmail(req.email);
    const record = { action: 'password-reset.requested' as const, actor: null };
    if (!row || !row.active) {
      await this.audit.record({
        ...record,
        record: { kind: 'email', id: req.email.slice(0, 120) },
        summary: `A password reset link was asked for ${req.email}: ${row ? 'the account is deactivated' : 'no account has this email'}, so no mail was sent.`,
      });
      return RESET_ANSWER;
    }
    await this.tx.run(async (t) => {
      await this.users.findById(row.id, t); // locks the user, so two requests at once count each other
      const now = this.clock.now();
      const recent = await this.links.countSince(row.id, 'password-reset', new Date(now.getTime() - 3_600_000), t);
      if (recent >= RESETS_PER_HOUR) {
        await this.audit.record(
          {
            ...record,
            record: { kind: 'user', id: row.id },
            summary: `A password reset link was asked for ${row.email}: ${recent} were sent in the last hour, so no mail was sent.`,
          },
          t,
        );
        return;
      }
      const expiresAt = await this.sendLink(row, 'password-reset', null, t);
      await this.audit.record(
        {
          ...record,
          record: { kind: 'user', id: row.id },
          summary: `Sent ${row.name} (${row.email}) a password reset link that works until ${expiresAt.toISOString()}.`,
        },
        t,
      );
    });
    return RESET_ANSWER;
  }

  /** What a link is, for the page it opens: whose account, or why it cannot be used. */
  async check(token: string): Promise<AccountLinkState> {
    const link = await this.links.find(sha256(token));
    const user = link ? await this.users.findById(link.userId) : null;
    const state = this.stateOf(link, user);
    if (state !== 'usable') return state === 'unknown' || !link ? { state: 'unknown' } : { state, purpose: link.purpose };
    return { state, purpose: link!.purpose, name: user!.name, email: user!.email, expiresAt: link!.expiresAt.toISOString() };
  }

  /** Sets the password with a link; the link is used, the user's other links void, every session of theirs ends. */
  async setPassword(req: SetPasswordRequest): Promise<{ email: string }> {
    refuseCommonPassword(req.password);
    const passwordHash = await hashPassword(req.password);
    const hash = sha256(req.token);
    const outcome = await this.tx.run(async (t) => {
      const link = await this.links.find(hash, t);
      const user = link ? await this.users.findById(link.userId, t) : null;
      const state = this.stateOf(link, user);
      if (state !== 'usable') return { refused: state, link, user };
      const now = this.clock.now();
      await this.users.update(user!.id, { passwordHash, demoPassword: false }, t);
      await this.links.use(link!.id, user!.id, now, t);
      await this.audit.record(
        {
          action: 'password.set',
          actor: { id: user!.id, name: user!.name, role: user!.role },
          record: { kind: 'user', id: user!.id },
          summary: `${user!.name} (${user!.email}) chose ${link!.purpose === 'invitation' ? 'their password with the invitation link' : 'a new password with a reset link'}; their sessions were ended.`,
        },
        t,
      );
      return { refused: null, link, user };
    });
    if (outcome.refused) {
      await this.audit.recordRefusal({
        action: 'account-link.refused',
        actor: null,
        record: outcome.user ? { kind: 'user', id: outcome.user.id } : null,
        summary: `A ${outcome.link?.purpose ?? 'mailed'} link was refused: ${REFUSED[outcome.refused]}`,
      });
      throw new AppError('forbidden', `${REFUSED[outcome.refused]} Ask for a new one.`);
    }
    const user = outcome.user!;
    await this.sessions.endAllOf(user.id, 'password-changed');
    await this.limits.forget(user.email);
    this.logger.log(`${user.email} set a password with a mailed link.`);
    return { email: user.email };
  }

  private stateOf(link: AccountLinkRow | null, user: UserModel | null): 'usable' | 'used' | 'expired' | 'replaced' | 'unknown' {
    if (!link || !user || !user.active) return 'unknown';
    // An invitation has done its work once the account has a password (a manager may have set one).
    if (link.usedAt || (link.purpose === 'invitation' && user.passwordHash !== null)) return 'used';
    if (link.voidedAt) return 'replaced';
    if (link.expiresAt <= this.clock.now()) return 'expired';
    return 'usable';
  }

  /** A new link of this purpose for the user (earlier ones void) and its mail, queued in `t`; an invitation names their role at the kitchen. */
  private async sendLink(user: UserModel, purpose: AccountLinkPurpose, invitedBy: string | null, t: Transaction, role: Role = user.role) {
    const token = randomBytes(32).toString('base64url');
    const now = this.clock.now();
    const expiresAt = new Date(now.getTime() + LINK_MINUTES[purpose] * 60_000);
    await this.links.replace(user.id, purpose, sha256(token), expiresAt, now, t);
    // An invitation names the kitchen it is to; a reset, asked for outside any kitchen, the book's owner.
    const site = await (purpose === 'invitation' ? this.kitchen.find(t) : this.sites.first(t));
    const kitchen = site?.name ?? 'your kitchen';
    const url = `${appAddress(this.config)}/set-password#token=${token}`;
    const body =
      purpose === 'invitation'
        ? invitationMail({
            kitchen,
            name: user.name,
            role,
            invitedBy: invitedBy ?? 'A manager',
            url,
            validMinutes: LINK_MINUTES[purpose],
          })
        : passwordResetMail({ kitchen, name: user.name, url, validMinutes: LINK_MINUTES[purpose] });
    await this.mail.enqueueWithSecret(
      { kind: purpose, kitchenId: purpose === 'invitation' ? (site?.id ?? null) : null, to: [user.email], ...body },
      token,
      t,
    );
    return expiresAt;
  }
}
