import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { FastifyReply } from 'fastify';
import type { Me, SignInRequest } from '@crumbproof/shared';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import { isDemoKitchen, type AppConfig } from '../config/config';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { checkPassword, DUMMY_HASH } from '../users/password';
import { UsersRepository } from '../users/users.repository';
import { meOf } from './me';
import { SessionTokens } from './session-tokens';
import { SignInLimits } from './sign-in-limits.repository';

@Injectable()
export class AuthService {
  private readonly logger = new Logger('Auth');

  constructor(
    private readonly users: UsersRepository,
    private readonly limits: SignInLimits,
    private readonly tokens: SessionTokens,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly audit: AuditService,
    private readonly kitchenRoles: KitchenRolesRepository,
  ) {}

  /**
   * Checks the credentials (the same plain message whether the email or the password is wrong)
   * and starts a session. Every attempt passes the sign-in limits first.
   */
  async signIn({ email, password }: SignInRequest, address: string, reply: FastifyReply): Promise<Me> {
    const attempt = await this.limits.begin(email, address);
    const row = await this.users.findByEmail(email);
    const ok = await checkPassword(password, row?.passwordHash ?? DUMMY_HASH);
    if (!row || !ok || !row.active || row.passwordHash === null) {
      this.logger.warn(`Refused sign-in for ${email}`);
      await this.audit.recordRefusal({
        action: 'sign-in.failed',
        actor: null,
        record: { kind: 'email', id: email.slice(0, 120) },
        summary: `Refused a sign-in as ${email}: ${!row ? 'no account has this email' : !row.active ? 'the account is deactivated' : row.passwordHash === null ? 'the account has no password yet (its invitation was not used)' : 'the password is not right'}.`,
      });
      throw new AppError('bad-credentials', 'Email or password is not right.');
    }
    if (row.demoPassword && !isDemoKitchen(this.config)) {
      this.logger.warn(`Refused the published demo password for ${email}`);
      await this.audit.recordRefusal({
        action: 'sign-in.failed',
        actor: null,
        record: { kind: 'email', id: email.slice(0, 120) },
        summary: `Refused a sign-in as ${email}: the account still has the demo kitchen’s published password.`,
      });
      throw new AppError(
        'bad-credentials',
        'This account still has the demo kitchen’s published password, which works only in the demo. A manager must set it a new password.',
      );
    }
    await this.limits.succeeded(attempt);
    await this.tokens.start(row.id, reply);
    await this.audit.record({
      action: 'sign-in.succeeded',
      actor: { id: row.id, name: row.name, role: row.role },
      record: { kind: 'user', id: row.id },
      summary: `${row.name} signed in.`,
    });
    return meOf(row, await this.kitchenRoles.ofUser(row.id));
  }

  /** Records a sign-out of the user whose session the cookie named (nothing when it named none). */
  async signedOut(userId: number | null): Promise<void> {
    if (userId === null) return;
    const row = await this.users.findById(userId);
    await this.audit.record({
      action: 'signed-out',
      actor: row ? { id: row.id, name: row.name, role: row.role } : null,
      record: { kind: 'user', id: userId },
      summary: `${row?.name ?? `User ${userId}`} signed out.`,
    });
  }
}
