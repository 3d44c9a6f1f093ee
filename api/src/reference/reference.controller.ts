import { Body, Controller, Get, HttpCode, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { KITCHEN_WRITERS, ROLES, sourceEntrySchema } from '@crumbproof/shared';
import { z } from 'zod';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { RulesService } from '../rules/rules.service';

const scanSchema = z.strictObject({
  text: z.string().max(4000, 'Use at most 4,000 characters.'),
  contains: z.array(sourceEntrySchema).optional(),
});

@ApiTags('reference')
@Controller()
export class ReferenceController {
  constructor(private readonly rules: RulesService) {}

  @Get('reference/nutrients')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'The reference nutrient table (per 100 g), each row with its source' })
  nutrients() {
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
  @ApiZodBody(scanSchema)
  scan(@Body(new ZodPipe(scanSchema)) body: z.infer<typeof scanSchema>) {
    return this.rules.scan(body.text, body.contains);
  }
}
