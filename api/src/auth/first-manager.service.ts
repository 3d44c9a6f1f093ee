import { createHash, randomBytes } from 'node:crypto';
import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { Transaction } from 'sequelize';
import type { FirstManagerRequest, Me } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { isDemoKitchen, type AppConfig } from '../config/config';
import { AuditService } from '../audit/audit.service';
import { TransactionRunner } from '../common/transaction';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { SiteRepository } from '../kitchen/site.repository';
import { hashPassword, refuseCommonPassword } from '../users/password';
import { UsersRepository } from '../users/users.repository';
import { FirstManagerLinksRepository } from './first-manager-links.repository';
import { meOf } from './me';

/** How long a printed link works. A restart prints a new one while the kitchen has no manager. */
export const FIRST_MANAGER_LINK_MINUTES = 60;

const sha256 = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/**
 * A kitchen's own installation has no accounts at first. Its start prints a one-time link
 * (single use, expiring, only its SHA-256 kept) that sets the first manager's password; a
 * new link voids the earlier ones.
 */
@Injectable()
export class FirstManagerService {
  private readonly logger = new Logger('Auth');

  constructor(
    private readonly transactions: TransactionRunner,
    private readonly links: FirstManagerLinksRepository,
    private readonly users: UsersRepository,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly audit: AuditService,
    private readonly sites: SiteRepository,
    private readonly kitchenRoles: KitchenRolesRepository,
  ) {}

  private get demo() {
    return isDemoKitchen(this.config);
  }

  /**
   * Whether a first manager is still needed: not the demo, and no active manager who can sign in
   * (before any kitchen is set up), or a kitchen with none (nobody could manage its people).
   */
  async needed(transaction?: Transaction): Promise<boolean> {
    return !this.demo && (await this.kitchensWanting(transaction)) !== null;
  }

  /** The kitchens without a manager who can sign in ([] before any kitchen is set up and no such manager); null when none wants one. */
  private async kitchensWanting(t?: Transaction): Promise<number[] | null> {
    if ((await this.sites.first(t)) === null) return (await this.users.countManagersWhoCanSignIn(t)) === 0 ? [] : null;
    const wanting = await this.kitchenRoles.kitchensWithoutManagerWhoCanSignIn(t);
    return wanting.length > 0 ? wanting : null;
  }

  /** A new one-time link token, voiding earlier ones; null when the kitchen has its manager. */
  async issue(now = new Date()): Promise<{ token: string; expiresAt: Date } | null> {
    if (!(await this.needed())) return null;
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(now.getTime() + FIRST_MANAGER_LINK_MINUTES * 60_000);
    await this.transactions.run((t) => this.links.replace(sha256(token), expiresAt, now, t));
    return { token, expiresAt };
  }

  /** Uses a link: creates the first manager with the password given; the link works once. */
  async setFirstManager(req: FirstManagerRequest, now = new Date()): Promise<Me> {
    refuseCommonPassword(req.password);
    const passwordHash = await hashPassword(req.password);
    return this.transactions.run(async (t) => {
      if (!(await this.links.isUsable(sha256(req.token), now, t))) {
        throw new AppError(
          'forbidden',
          'This link has been used, has expired or was replaced by a newer one. Restart Crumbproof to print a new link.',
        );
      }
      const wanting = this.demo ? null : await this.kitchensWanting(t);
      if (wanting === null) {
        throw new AppError('conflict', 'This kitchen already has a manager who can sign in: sign in, or ask them to add you.');
      }
      if (await this.users.findByEmail(req.email, t)) {
        throw new AppError('conflict', 'A user with that email already exists.', [
          { path: 'email', message: 'A user with that email already exists.' },
        ]);
      }
      await this.links.voidAll(now, t);
      const row = await this.users.create({ email: req.email, name: req.name, role: 'manager', passwordHash }, t);
      await this.audit.record(
        {
          action: 'first-manager.set',
          actor: { id: row.id, name: row.name, role: row.role },
          record: { kind: 'user', id: row.id },
          summary: `${row.name} (${row.email}) was made the kitchen’s first manager with the one-time link.`,
          after: { id: row.id, email: row.email, name: row.name, role: row.role },
        },
        t,
      );
      // The kitchens already set up with no manager who can sign in (an installation restored so) are the first manager's.
      for (const siteId of wanting) await this.kitchenRoles.set(row.id, siteId, 'manager', t);
      this.logger.log(`The first manager, ${req.email}, was set with the one-time link.`);
      return meOf(row, await this.kitchenRoles.ofUser(row.id, t));
    });
  }
}
