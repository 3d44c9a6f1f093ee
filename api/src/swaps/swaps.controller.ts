import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { KITCHEN_WRITERS, swapRequestSchema, type SwapRequest } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { SwapsService } from './swaps.service';

@ApiTags('swap check')
@Controller('swaps')
@Roles(KITCHEN_WRITERS)
export class SwapsController {
  constructor(private readonly swaps: SwapsService) {}

  @Post('preview')
  @HttpCode(200)
  @ApiOperation({ summary: 'What every affected product would declare after a swap; nothing is saved' })
  @ApiZodBody(swapRequestSchema)
  preview(@Body(new ZodPipe(swapRequestSchema)) body: SwapRequest) {
    return this.swaps.preview(body);
  }

  @Post('apply')
  @HttpCode(200)
  @ApiOperation({ summary: 'Apply a swap: new revisions of the affected recipes, in one transaction' })
  @ApiZodBody(swapRequestSchema)
  apply(@CurrentUser() user: AuthUser, @Body(new ZodPipe(swapRequestSchema)) body: SwapRequest) {
    return this.swaps.apply(body, user.id);
  }
}
