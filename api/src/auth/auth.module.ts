import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { AuditStoreModule } from '../audit/audit-store.module';
import { TransactionRunner } from '../common/transaction';
import type { AppConfig } from '../config/config';
import { KitchenModule } from '../kitchen/kitchen.module';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { FirstManagerLinksRepository } from './first-manager-links.repository';
import { FirstManagerService } from './first-manager.service';
import { JwtStrategy } from './jwt.strategy';
import { sessionKey } from './session-key';
import { SessionTokens } from './session-tokens';
import { SessionsModule } from './sessions.module';

@Module({
  imports: [
    AuditStoreModule,
    UsersModule,
    KitchenModule,
    SessionsModule,
    PassportModule,
    JwtModule.registerAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => ({
        secret: sessionKey(config.get('JWT_SECRET', { infer: true })),
        signOptions: { expiresIn: config.get('SESSION_MINUTES', { infer: true }) * 60, algorithm: 'HS256' },
        verifyOptions: { algorithms: ['HS256'] },
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, JwtStrategy, SessionTokens, FirstManagerService, FirstManagerLinksRepository, TransactionRunner],
  exports: [JwtModule, SessionTokens, FirstManagerService],
})
export class AuthModule {}
