import { Global, Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { parseConfig } from './config';

/** Validated configuration, available everywhere as ConfigService<AppConfig, true>. */
@Global()
@Module({
  imports: [
    ConfigModule.forRoot({
      isGlobal: true,
      ignoreEnvFile: true,
      cache: true,
      validate: (env) => parseConfig(env as Record<string, string | undefined>),
    }),
  ],
})
export class AppConfigModule {}
