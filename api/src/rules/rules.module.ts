import { Module } from '@nestjs/common';
import { RulesService } from './rules.service';

/** Wraps the pure rules core (rules/core) for the rest of the API. */
@Module({
  providers: [RulesService],
  exports: [RulesService],
})
export class RulesModule {}
