import { Module } from '@nestjs/common';
import { RulesModule } from '../rules/rules.module';
import { ReferenceController } from './reference.controller';

@Module({ imports: [RulesModule], controllers: [ReferenceController] })
export class ReferenceModule {}
