import { Injectable, Logger } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Me, SignInRequest } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { checkPassword, DUMMY_HASH } from '../users/password';
import { UsersRepository } from '../users/users.repository';

@Injectable()
export class AuthService {
  private readonly logger = new Logger('Auth');

  constructor(
    private readonly users: UsersRepository,
    private readonly jwt: JwtService,
  ) {}

  /** Checks the credentials; the same plain message whether the email or the password is wrong. */
  async signIn({ email, password }: SignInRequest): Promise<{ me: Me; token: string }> {
    const row = await this.users.findByEmail(email);
    const ok = await checkPassword(password, row?.passwordHash ?? DUMMY_HASH);
    if (!row || !ok || !row.active) {
      this.logger.warn(`Refused sign-in for ${email}`);
      throw new AppError('bad-credentials', 'Email or password is not right.');
    }
    const token = await this.jwt.signAsync({ sub: row.id });
    return { me: { id: row.id, email: row.email, name: row.name, role: row.role }, token };
  }
}
