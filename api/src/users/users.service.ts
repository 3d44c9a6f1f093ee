import { Injectable } from '@nestjs/common';
import {
  ROLE_LABELS,
  type CreateUserRequest,
  type Role,
  type TakenOffKitchen,
  type UpdateUserRequest,
  type User,
  type UserAdded,
} from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { SessionsRepository } from '../auth/sessions.repository';
import { SignInLimits } from '../auth/sign-in-limits.repository';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { KitchenRolesRepository, type KitchenRoleRow } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import type { SiteRow } from '../kitchen/site.repository';
import { hashPassword, refuseCommonPassword } from './password';
import type { UserModel } from './user.model';
import { toUser, UsersRepository } from './users.repository';

const roleWords = (role: Role) => ROLE_LABELS[role].toLowerCase();
const kitchens = (n: number) => `${n} other kitchen${n === 1 ? '' : 's'}`;

/** One answer for a user who is not there and one who works only at other kitchens, so neither is told from the other. */
const notHere = (id: number, site: SiteRow) => new AppError('not-found', `There is no user ${id} at this kitchen (${site.name}).`);

/**
 * The people of the request's kitchen, as its managers see and change them. A person's role is
 * their role at one kitchen (kitchen_roles); their name, password and whether their account is
 * active are the account's. A manager acts on the people of their kitchen only, changes a role
 * there only, and changes a password or the account's active state only for someone working at
 * no kitchen where that manager is not a manager too. Every kitchen keeps at least one active manager.
 */
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

  /** The people with a role at the request's kitchen, each with their role there; before any kitchen, everyone. */
  async list(): Promise<User[]> {
    const site = await this.kitchen.find();
    if (!site) return (await this.repo.list()).map((row) => toUser(row));
    const roles = await this.kitchenRoles.atKitchen(site.id);
    const ids = [...roles.keys()];
    const [rows, elsewhere] = await Promise.all([this.repo.listByIds(ids), this.kitchenRoles.elsewhere(ids, site.id)]);
    return rows.map((row) => toUser(row, { role: roles.get(row.id)!, elsewhere: elsewhere.get(row.id) ?? 0 }));
  }

  /**
   * A new account with a password, at the request's kitchen in the role given. An address that
   * already has an account is given the role at this kitchen instead (see addExisting): the
   * password sent is not used.
   */
  async create(req: CreateUserRequest): Promise<UserAdded> {
    const existing = await this.repo.findByEmail(req.email);
    if (existing) return this.addExisting(existing, req.role);
    refuseCommonPassword(req.password);
    const passwordHash = await hashPassword(req.password);
    return this.tx.run(async (t) => {
      const row = await this.repo.create({ email: req.email, name: req.name, role: req.role, passwordHash }, t);
      // The person works at the kitchen they were added at, in the role given.
      const site = await this.kitchen.find(t);
      if (site) await this.kitchenRoles.set(row.id, site.id, req.role, t);
      const user = toUser(row, { role: req.role, elsewhere: 0 });
      await this.audit.record(
        {
          action: 'user.created',
          record: { kind: 'user', id: user.id },
          summary: `Added ${user.name} (${user.email}) as ${user.role}${site ? ` at ${site.name}` : ''}.`,
          before: null,
          after: user,
        },
        t,
      );
      return { ...user, outcome: 'created', message: `${user.name} was added as ${roleWords(user.role)}.` };
    });
  }

  /**
   * Someone whose address already has an account, added to the request's kitchen in `role`:
   * they keep their name, password and their roles at other kitchens, and sign in as before.
   * Refused for someone already at this kitchen (change their role instead), for a deactivated
   * account, and before any kitchen is set up.
   */
  async addExisting(found: UserModel, role: Role): Promise<UserAdded> {
    return this.tx.run(async (t) => {
      const row = await this.repo.findById(found.id, t);
      const site = await this.kitchen.find(t);
      const taken = () =>
        new AppError('conflict', 'A user with that email already exists.', [
          { path: 'email', message: 'A user with that email already exists.' },
        ]);
      if (!row || !site) throw taken();
      const here = await this.kitchenRoles.roleAt(row.id, site.id, t);
      if (here) {
        const message = `${row.name} (${row.email}) already works at ${site.name}, as ${roleWords(here)}. Change their role in the list instead.`;
        throw new AppError('conflict', message, [{ path: 'email', message: `Already works at ${site.name}.` }]);
      }
      if (!row.active) {
        const message = `${row.email} belongs to a deactivated account. A manager of every kitchen they work in can make it active again; then add them here.`;
        throw new AppError('conflict', message, [{ path: 'email', message: 'This account is deactivated.' }]);
      }
      const others = (await this.kitchenRoles.ofUser(row.id, t)).length;
      await this.kitchenRoles.set(row.id, site.id, role, t);
      const user = toUser(row, { role, elsewhere: others });
      const message =
        `${row.email} already has a Crumbproof account, as ${row.name}: they now work at ${site.name} too, as ${roleWords(role)}, ` +
        'and sign in with their own password (no invitation or new password was sent).';
      await this.audit.record(
        {
          action: 'user.added-to-kitchen',
          record: { kind: 'user', id: row.id },
          summary: `Added ${row.name} (${row.email}), who has an account already${others > 0 ? ` and works at ${kitchens(others)}` : ''}, to ${site.name} as ${role}.`,
          before: null,
          after: { ...user, kitchen: site.id },
        },
        t,
      );
      return { ...user, outcome: 'added', message };
    });
  }

  /**
   * Changes a person of the request's kitchen. A new password, a new role here or deactivation
   * ends every session of that user (the manager changing their own account keeps the session
   * they made it with), so an old cookie neither writes nor comes back with a reactivation. A new
   * password also lifts a lock.
   */
  async update(actor: AuthUser, id: number, req: UpdateUserRequest): Promise<User> {
    if (req.password !== undefined) refuseCommonPassword(req.password);
    const passwordHash = req.password !== undefined ? await hashPassword(req.password) : undefined;
    const { before, after } = await this.tx.run(async (t) => {
      const row = await this.repo.findById(id, t);
      const site = await this.kitchen.find(t);
      if (!row) throw site ? notHere(id, site) : new AppError('not-found', `There is no user ${id}.`);
      const theirs = site ? await this.kitchenRoles.ofUser(id, t) : [];
      const here = site ? theirs.find((k) => k.siteId === site.id) : undefined;
      if (site && !here) throw notHere(id, site);
      const roleBefore = here?.role ?? row.role;
      const elsewhere = theirs.length - (here ? 1 : 0);
      const before = toUser(row, { role: roleBefore, elsewhere });

      if (id === actor.id && req.active === false) throw new AppError('conflict', 'You cannot deactivate your own account.');
      const activeChanges = req.active !== undefined && req.active !== row.active;
      const account = [
        ...(activeChanges ? [req.active ? 'make active again' : 'deactivate'] : []),
        ...(req.password !== undefined ? ['set the password of'] : []),
      ];
      if (account.length > 0) await this.refuseUnlessManagerAtEach(actor, row, theirs, account.join(' or '), t);
      const losesRole = req.role !== undefined && req.role !== 'manager' && roleBefore === 'manager';
      if (row.active && !site && roleBefore === 'manager' && (losesRole || req.active === false)) {
        if ((await this.repo.countActiveManagers(t)) <= 1)
          throw new AppError('conflict', 'The kitchen needs at least one active manager. Make someone else manager first.');
      }
      if (row.active && site && losesRole) await this.keepAManager(site.id, site.name, t);
      // Deactivating an account takes a manager from every kitchen where they are one.
      if (row.active && req.active === false)
        for (const k of theirs.filter((k) => k.role === 'manager')) await this.keepAManager(k.siteId, k.name, t);

      const updated = await this.repo.update(
        id,
        {
          ...(req.name !== undefined ? { name: req.name } : {}),
          // Before any kitchen, the role is the one the person was created with; after, their role here.
          ...(req.role !== undefined && !site ? { role: req.role } : {}),
          ...(req.active !== undefined ? { active: req.active } : {}),
          ...(passwordHash !== undefined ? { passwordHash, demoPassword: false } : {}),
        },
        t,
      );
      if (site && req.role !== undefined) await this.kitchenRoles.set(id, site.id, req.role, t);
      const after = toUser(updated!, { role: req.role ?? roleBefore, elsewhere });
      const changed = [
        ...(['name', 'role', 'active'] as const).filter((k) => req[k] !== undefined && req[k] !== before[k]),
        ...(req.password !== undefined ? ['password'] : []),
      ];
      await this.audit.record(
        {
          action: 'user.updated',
          record: { kind: 'user', id },
          summary:
            `Changed ${before.name} (${before.email})${site ? ` at ${site.name}` : ''}: ` +
            `${changed.length > 0 ? changed.join(', ') : 'nothing different'}.`,
          before,
          after: { ...after, ...(req.password !== undefined ? { passwordChanged: true } : {}) },
        },
        t,
      );
      return { before, after };
    });
    const keep = id === actor.id ? actor.sessionId : undefined;
    if (req.active === false) await this.sessions.endAllOf(id, 'deactivated');
    if (req.password !== undefined) {
      await this.sessions.endAllOf(id, 'password-changed', keep);
      await this.limits.forget(before.email);
    }
    if (req.role !== undefined && req.role !== before.role) await this.sessions.endAllOf(id, 'role-changed', keep);
    return after;
  }

  /**
   * Takes a person off the request's kitchen: their role here goes, their account and their roles
   * at other kitchens stay, and their sessions end. Refused for oneself and for the kitchen's
   * last active manager.
   */
  async takeOffKitchen(actor: AuthUser, id: number): Promise<TakenOffKitchen> {
    const answer = await this.tx.run(async (t) => {
      const row = await this.repo.findById(id, t);
      const site = await this.kitchen.current(t);
      const role = row ? await this.kitchenRoles.roleAt(id, site.id, t) : null;
      if (!row || !role) throw notHere(id, site);
      if (id === actor.id) throw new AppError('conflict', `You cannot take yourself off ${site.name}: ask another manager here to do it.`);
      if (role === 'manager' && row.active) await this.keepAManager(site.id, site.name, t);
      await this.kitchenRoles.remove(id, site.id, t);
      const elsewhere = (await this.kitchenRoles.ofUser(id, t)).length;
      const message =
        `${row.name} no longer works at ${site.name}. ` +
        (elsewhere > 0
          ? `Their account stays, for the ${kitchens(elsewhere)} they work at.`
          : 'They work at no kitchen now; their account stays, and a manager can add them again by their email.');
      await this.audit.record(
        {
          action: 'user.taken-off-kitchen',
          record: { kind: 'user', id },
          summary: `Took ${row.name} (${row.email}) off ${site.name}, where they were ${role}; they work at ${elsewhere > 0 ? kitchens(elsewhere) : 'no other kitchen'}.`,
          before: { ...toUser(row, { role, elsewhere }), kitchen: site.id },
          after: null,
        },
        t,
      );
      return { id, kitchen: site.id, elsewhere, message };
    });
    await this.sessions.endAllOf(id, 'role-changed');
    return answer;
  }

  /** Refuses when taking one more active manager away would leave the kitchen without one. */
  private async keepAManager(siteId: number, name: string, t: Transaction): Promise<void> {
    if ((await this.kitchenRoles.countActiveManagersAt(siteId, t)) <= 1)
      throw new AppError('conflict', `${name} needs at least one active manager. Make someone else manager there first.`);
  }

  /**
   * A password and the account's active state are the account's, for every kitchen the person
   * works in: only a manager at each of those kitchens may change them.
   */
  private async refuseUnlessManagerAtEach(
    actor: AuthUser,
    row: UserModel,
    theirs: readonly KitchenRoleRow[],
    what: string,
    t: Transaction,
  ): Promise<void> {
    if (theirs.length === 0) return;
    const managing = new Set((await this.kitchenRoles.ofUser(actor.id, t)).filter((k) => k.role === 'manager').map((k) => k.siteId));
    const others = theirs.filter((k) => !managing.has(k.siteId)).map((k) => k.name);
    if (others.length === 0) return;
    throw new AppError(
      'forbidden',
      `You cannot ${what} ${row.name}’s account: it is theirs at every kitchen they work in, and you are not a manager at ${others.join(', ')}. ` +
        `A manager of every kitchen they work in can; or take them off this kitchen instead.`,
    );
  }
}
