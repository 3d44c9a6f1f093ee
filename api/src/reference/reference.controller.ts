import { Body, Controller, Get, HttpCode, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  compositionScanRequestSchema,
  KITCHEN_WRITERS,
  ROLES,
  type CompositionScan,
  type CompositionScanRequest,
  type NutrientReference,
} from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { RulesService } from '../rules/rules.service';

@ApiTags('reference')
@Controller()
export class ReferenceController {
  constructor(private readonly rules: RulesService) {}

  @Get('reference/nutrients')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'The reference nutrient table (per 100 g), each row with its source' })
  nutrients(): NutrientReference {
    return this.rules.nutrients;
  }

  @Get('reference/allergen-sources')
  @Roles(ROLES)
  @ApiOperation({ summary: 'The allergen sources an ingredient can record' })
  sources() {
    return this.rules.sources();
  }

  @Post('composition/scan')
  @Roles(KITCHEN_WRITERS)
  @HttpCode(200)
  @ApiOperation({ summary: 'Terms the engine detects in a supplier’s composition text, and discrepancies with its list' })
  @ApiZodBody(compositionScanRequestSchema)
  scan(@Body(new ZodPipe(compositionScanRequestSchema)) body: CompositionScanRequest): CompositionScan {
    return this.rules.scan(body.text, body.contains);
  }
}
