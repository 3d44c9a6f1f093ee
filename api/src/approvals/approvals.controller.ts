import { Body, Controller, Get, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { approvalRequestSchema, KITCHEN_WRITERS, type ApprovalRequest } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { ApprovalsService } from './approvals.service';

/** Products waiting for a manager's approval of their declaration, and the approvals. */
@ApiTags('approvals')
@Controller('approvals')
export class ApprovalsController {
  constructor(private readonly approvals: ApprovalsService) {}

  @Get()
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({
    summary:
      'Products whose current declaration is not their approved one (manager, pastry chef): the change in words, what caused it and whether it adds an allergen',
  })
  list(@CurrentUser() user: AuthUser) {
    return this.approvals.list(user);
  }

  @Post()
  @Roles(['manager'])
  @ApiOperation({
    summary:
      'Approve products at the declaration seen (each product’s inputHash); refused (409) naming the product when its declaration changed since (manager)',
  })
  @ApiZodBody(approvalRequestSchema)
  approve(@CurrentUser() user: AuthUser, @Body(new ZodPipe(approvalRequestSchema)) body: ApprovalRequest) {
    return this.approvals.approve(body, user);
  }
}
