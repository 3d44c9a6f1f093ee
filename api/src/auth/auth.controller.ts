import { Body, Controller, Get, HttpCode, Post, Req, Res } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyReply, FastifyRequest } from 'fastify';
import { firstManagerSchema, signInSchema, ROLES, type FirstManagerRequest, type Me, type SignInRequest } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { AnyKitchen, Public, Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { AuthService } from './auth.service';
import { FirstManagerService } from './first-manager.service';
import { meOf } from './me';
import { readSessionCookie } from './session-cookie';
import { SessionTokens } from './session-tokens';

@ApiTags('auth')
@Controller()
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly tokens: SessionTokens,
    private readonly firstManager: FirstManagerService,
  ) {}

  @Post('auth/sign-in')
  @Public()
  @HttpCode(200)
  @ApiOperation({
    summary:
      'Sign in; the session is set as an httpOnly cookie. Wrong passwords in a row make an email wait, then lock it; the kitchen and each address have a limit too',
  })
  @ApiZodBody(signInSchema)
  signIn(
    @Body(new ZodPipe(signInSchema)) body: SignInRequest,
    @Req() req: FastifyRequest,
    @Res({ passthrough: true }) reply: FastifyReply,
  ): Promise<Me> {
    return this.auth.signIn(body, req.ip, reply);
  }

  @Post('auth/sign-out')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'Sign out: ends the session on the server and clears the cookie' })
  async signOut(@Req() req: FastifyRequest, @Res({ passthrough: true }) reply: FastifyReply): Promise<void> {
    await this.auth.signedOut(await this.tokens.end(readSessionCookie(req), reply));
  }

  @Post('auth/first-manager')
  @Public()
  @HttpCode(201)
  @ApiOperation({
    summary: 'Set the first manager of a kitchen’s own installation, with the one-time link its first start printed',
  })
  @ApiZodBody(firstManagerSchema)
  setFirstManager(@Body(new ZodPipe(firstManagerSchema)) body: FirstManagerRequest): Promise<Me> {
    return this.firstManager.setFirstManager(body);
  }

  @Get('me')
  @Roles(ROLES)
  @AnyKitchen()
  @ApiOperation({
    summary: 'The signed-in user: their kitchens with their role at each, and the kitchen the request named (or their only one)',
  })
  me(@CurrentUser() user: AuthUser): Me {
    return meOf(user, user.kitchens ?? [], user.kitchenId ?? null);
  }
}
