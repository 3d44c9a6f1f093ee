import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { SessionModel } from './session.model';
import { SessionsRepository } from './sessions.repository';
import { SignInLimits } from './sign-in-limits.repository';

/** Sessions and sign-in limits kept in the database; users and auth both use them. */
@Module({
  imports: [SequelizeModule.forFeature([SessionModel])],
  providers: [SessionsRepository, SignInLimits],
  exports: [SessionsRepository, SignInLimits],
})
export class SessionsModule {}
