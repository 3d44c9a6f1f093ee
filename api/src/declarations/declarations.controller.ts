import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import { bookRecipeSchema, REGIMES, ROLES, KITCHEN_WRITERS, type Regime } from '@crumbproof/shared';
import { z } from 'zod';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { DeclarationsService } from './declarations.service';

const regimeQuery = z.enum(REGIMES, { message: `Use one of ${REGIMES.join(', ')}.` }).optional();

@ApiTags('declarations')
@Controller()
export class DeclarationsController {
  constructor(private readonly declarations: DeclarationsService) {}

  @Get('declarations')
  @Roles(ROLES)
  @ApiOperation({ summary: 'Declarations of every product for sale' })
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  all(@Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.all(regime);
  }

  @Get('recipes/:code/declaration')
  @Roles(ROLES)
  @ApiOperation({ summary: 'A product’s declaration for a regime (the kitchen’s by default)' })
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  one(@Param('code') code: string, @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.forProduct(code, regime);
  }

  @Post('declarations/preview')
  @HttpCode(200)
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Declare a recipe as edited, without saving it' })
  @ApiZodBody(bookRecipeSchema)
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  preview(@Body() body: unknown, @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.preview(body, regime);
  }
}
