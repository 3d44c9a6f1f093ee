import { Injectable } from '@nestjs/common';
import type { CreateUserRequest, UpdateUserRequest, User } from '@crumbproof/shared';
import { SessionsRepository } from '../auth/sessions.repository';
import { SignInLimits } from '../auth/sign-in-limits.repository';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { hashPassword, refuseCommonPassword } from './password';
import { toUser, UsersRepository } from './users.repository';

@Injectable()
export class UsersService {
  constructor(
    private readonly repo: UsersRepository,
    private readonly sessions: SessionsRepository,
    private readonly limits: SignInLimits,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    private readonly kitchen: KitchenService,
    private readonly kitchenRoles: KitchenRolesRepository,
  ) {}

  async list(): Promise<User[]> {
    return (await this.repo.list()).map(toUser);
  }

  async create(req: CreateUserRequest): Promise<User> {
    refuseCommonPassword(req.password);
    if (await this.repo.findByEmail(req.email)) {
      throw new AppError('conflict', 'A user with that email already exists.', [
        { path: 'email', message: 'A user with that email already exists.' },
      ]);
    }
    const passwordHash = await hashPassword(req.password);
    return this.tx.run(async (t) => {
      const user = toUser(await this.repo.create({ email: req.email, name: req.name, role: req.role, passwordHash }, t));
      // The person works at the kitchen they were added at, in the role given; before any kitchen, they get it at the first.
      const site = await this.kitchen.find(t);
      if (site) await this.kitchenRoles.set(user.id, site.id, req.role, t);
      await this.audit.record(
        {
          action: 'user.created',
          record: { kind: 'user', id: user.id },
          summary: `Added ${user.name} (${user.email}) as ${user.role}.`,
          before: null,
          after: user,
        },
        t,
      );
      return user;
    });
  }

  /**
   * A new password, a new role or deactivation ends every session of that user (the manager
   * making a change to their own account keeps the session they made it with), so an old
   * cookie neither writes nor comes back with a reactivation. A new password also lifts a lock.
   */
  async update(actor: AuthUser, id: number, req: UpdateUserRequest): Promise<User> {
    const actorId = actor.id;
    if (req.password !== undefined) refuseCommonPassword(req.password);
    const passwordHash = req.password !== undefined ? await hashPassword(req.password) : undefined;
    const { row, updated } = await this.tx.run(async (t) => {
      const row = await this.repo.findById(id, t);
      if (!row) throw new AppError('not-found', `There is no user ${id}.`);
      const losesManager = row.role === 'manager' && row.active && (req.active === false || (req.role && req.role !== 'manager'));
      if (losesManager && (await this.repo.countActiveManagers(t)) <= 1) {
        throw new AppError('conflict', 'The kitchen needs at least one active manager. Make someone else manager first.');
      }
      if (id === actorId && req.active === false) {
        throw new AppError('conflict', 'You cannot deactivate your own account.');
      }
      const before = toUser(row);
      const updated = await this.repo.update(
        id,
        {
          ...(req.name !== undefined ? { name: req.name } : {}),
          ...(req.role !== undefined ? { role: req.role } : {}),
          ...(req.active !== undefined ? { active: req.active } : {}),
          ...(passwordHash !== undefined ? { passwordHash, demoPassword: false } : {}),
        },
        t,
      );
      // A role is the person's role at the kitchen the manager changes it at.
      const site = req.role !== undefined ? await this.kitchen.find(t) : null;
      if (site && req.role !== undefined) await this.kitchenRoles.set(id, site.id, req.role, t);
      const after = toUser(updated!);
      const changed = [
        ...(['name', 'role', 'active'] as const).filter((k) => req[k] !== undefined && req[k] !== before[k]),
        ...(req.password !== undefined ? ['password'] : []),
      ];
      await this.audit.record(
        {
          action: 'user.updated',
          record: { kind: 'user', id },
          summary: `Changed ${before.name} (${before.email}): ${changed.length > 0 ? changed.join(', ') : 'nothing different'}.`,
          before,
          after: { ...after, ...(req.password !== undefined ? { passwordChanged: true } : {}) },
        },
        t,
      );
      return { row: before, updated: after };
    });
    const keep = id === actorId ? actor.sessionId : undefined;
    if (req.active === false) await this.sessions.endAllOf(id, 'deactivated');
    if (req.password !== undefined) {
      await this.sessions.endAllOf(id, 'password-changed', keep);
      await this.limits.forget(row.email);
    }
    if (req.role !== undefined && req.role !== row.role) await this.sessions.endAllOf(id, 'role-changed', keep);
    return updated;
  }
}
