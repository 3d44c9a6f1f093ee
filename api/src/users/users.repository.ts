import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Role, User } from '@crumbproof/shared';
import { UserModel } from './user.model';

export interface NewUser {
  email: string;
  name: string;
  role: Role;
  passwordHash: string;
}

/** The only place that reads and writes the users table. */
@Injectable()
export class UsersRepository {
  constructor(@InjectModel(UserModel) private readonly users: typeof UserModel) {}

  findByEmail(email: string) {
    return this.users.findOne({ where: { email } });
  }

  findById(id: number) {
    return this.users.findByPk(id);
  }

  list() {
    return this.users.findAll({ order: [['name', 'ASC']] });
  }

  create(user: NewUser) {
    return this.users.create({ ...user });
  }

  async update(id: number, changes: Partial<Pick<UserModel, 'name' | 'role' | 'active' | 'passwordHash'>>) {
    const row = await this.users.findByPk(id);
    if (!row) return null;
    return row.update(changes);
  }

  count() {
    return this.users.count();
  }

  countActiveManagers() {
    return this.users.count({ where: { role: 'manager', active: true } });
  }
}

export function toUser(row: UserModel): User {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    active: row.active,
    createdAt: row.createdAt.toISOString(),
  };
}
