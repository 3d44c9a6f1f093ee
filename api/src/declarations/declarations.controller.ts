import { Body, Controller, Get, HttpCode, Post, Query, Req, Res } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { FastifyReply, FastifyRequest } from 'fastify';
import { bookRecipeSchema, REGIMES, ROLES, KITCHEN_WRITERS, type Regime } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { sendPrepared } from '../common/prepared-json';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { DeclarationsService } from './declarations.service';
import { regimeQuery } from './regime-query';

/** Declarations of every product, and of a recipe as edited. One product's is GET /api/recipes/:code/declaration (RecipesController). */
@ApiTags('declarations')
@Controller('declarations')
export class DeclarationsController {
  constructor(private readonly declarations: DeclarationsService) {}

  @Get()
  @Roles(ROLES)
  @ApiOperation({ summary: 'Declarations of every product for sale' })
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  async all(@Req() request: FastifyRequest, @Res() reply: FastifyReply, @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    // Sent as serialised once for this state of the kitchen, with its entity tag (If-None-Match: 304).
    return sendPrepared(request, reply, await this.declarations.preparedAll(regime));
  }

  @Post('preview')
  @HttpCode(200)
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Declare a recipe as edited, without saving it' })
  @ApiZodBody(bookRecipeSchema)
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  preview(@Body() body: unknown, @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.preview(body, regime);
  }
}
