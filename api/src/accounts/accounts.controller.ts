import { Body, Controller, HttpCode, Param, ParseIntPipe, Post, Req } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyRequest } from 'fastify';
import {
  accountLinkCheckSchema,
  inviteUserSchema,
  passwordResetRequestSchema,
  setPasswordSchema,
  type AccountLinkCheckRequest,
  type AccountLinkState,
  type InviteUserRequest,
  type PasswordResetAnswer,
  type PasswordResetRequest,
  type SetPasswordRequest,
  type User,
  type UserAdded,
} from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Public, Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { AccountsService } from './accounts.service';

@ApiTags('users')
@Controller()
export class AccountsController {
  constructor(private readonly accounts: AccountsService) {}

  @Post('users/invitations')
  @Roles(['manager'])
  @HttpCode(201)
  @ApiOperation({
    summary:
      'Invite a person by name, email and role at the request’s kitchen: they get a mail with a link to choose their password, or, with an account of another kitchen already, the role here and no mail (manager)',
  })
  @ApiZodBody(inviteUserSchema)
  invite(@CurrentUser() actor: AuthUser, @Body(new ZodPipe(inviteUserSchema)) body: InviteUserRequest): Promise<UserAdded> {
    return this.accounts.invite(actor, body);
  }

  @Post('users/:id/invitation')
  @Roles(['manager'])
  @HttpCode(200)
  @ApiOperation({
    summary:
      'Send an invitation again to a person of the request’s kitchen who has not chosen a password; the earlier link stops working (manager)',
  })
  resend(@CurrentUser() actor: AuthUser, @Param('id', ParseIntPipe) id: number): Promise<User> {
    return this.accounts.resendInvitation(actor, id);
  }

  @Post('auth/password-reset')
  @Public()
  @HttpCode(202)
  @ApiOperation({
    summary: 'Forgot your password: mails a one-time link (1 hour) when an account has the address; the answer is the same either way',
  })
  @ApiZodBody(passwordResetRequestSchema)
  requestReset(
    @Body(new ZodPipe(passwordResetRequestSchema)) body: PasswordResetRequest,
    @Req() req: FastifyRequest,
  ): Promise<PasswordResetAnswer> {
    return this.accounts.requestReset(body, req.ip);
  }

  @Post('auth/account-link')
  @Public()
  @HttpCode(200)
  @ApiOperation({ summary: 'What a mailed link is: whose account it opens, or whether it was used, expired or replaced' })
  @ApiZodBody(accountLinkCheckSchema)
  check(@Body(new ZodPipe(accountLinkCheckSchema)) body: AccountLinkCheckRequest): Promise<AccountLinkState> {
    return this.accounts.check(body.token);
  }

  @Post('auth/set-password')
  @Public()
  @HttpCode(200)
  @ApiOperation({ summary: 'Choose a password with a mailed link (invitation or reset); it works once and ends the user’s sessions' })
  @ApiZodBody(setPasswordSchema)
  setPassword(@Body(new ZodPipe(setPasswordSchema)) body: SetPasswordRequest): Promise<{ email: string }> {
    return this.accounts.setPassword(body);
  }
}
