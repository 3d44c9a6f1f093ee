import { Injectable } from '@nestjs/common';
import type { CreateUserRequest, UpdateUserRequest, User } from '@crumbproof/shared';
import { UniqueConstraintError } from 'sequelize';
import { AppError } from '../common/app-error';
import { hashPassword } from './password';
import { toUser, UsersRepository } from './users.repository';

@Injectable()
export class UsersService {
  constructor(private readonly repo: UsersRepository) {}

  async list(): Promise<User[]> {
    return (await this.repo.list()).map(toUser);
  }

  async create(req: CreateUserRequest): Promise<User> {
    if (await this.repo.findByEmail(req.email)) {
      throw new AppError('conflict', 'A user with that email already exists.', [
        { path: 'email', message: 'A user with that email already exists.' },
      ]);
    }
    try {
      const row = await this.repo.create({
        email: req.email,
        name: req.name,
        role: req.role,
        passwordHash: await hashPassword(req.password),
      });
      return toUser(row);
    } catch (e) {
      if (e instanceof UniqueConstraintError) throw new AppError('conflict', 'A user with that email already exists.');
      throw e;
    }
  }

  async update(actorId: number, id: number, req: UpdateUserRequest): Promise<User> {
    const row = await this.repo.findById(id);
    if (!row) throw new AppError('not-found', `There is no user ${id}.`);
    const losesManager = row.role === 'manager' && row.active && (req.active === false || (req.role && req.role !== 'manager'));
    if (losesManager && (await this.repo.countActiveManagers()) <= 1) {
      throw new AppError('conflict', 'The kitchen needs at least one active manager. Make someone else manager first.');
    }
    if (id === actorId && req.active === false) {
      throw new AppError('conflict', 'You cannot deactivate your own account.');
    }
    const updated = await this.repo.update(id, {
      ...(req.name !== undefined ? { name: req.name } : {}),
      ...(req.role !== undefined ? { role: req.role } : {}),
      ...(req.active !== undefined ? { active: req.active } : {}),
      ...(req.password !== undefined ? { passwordHash: await hashPassword(req.password) } : {}),
    });
    return toUser(updated!);
  }
}
