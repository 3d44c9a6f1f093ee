import { Body, Controller, Get, HttpCode, Post, Res, UseGuards } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyReply } from 'fastify';
import { signInSchema, ROLES, type Me, type SignInRequest } from '@crumbproof/shared';
import type { AppConfig } from '../config/config';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Public, Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { AuthService } from './auth.service';
import { clearSessionCookie, setSessionCookie } from './session-cookie';
import { SignInThrottlerGuard } from './sign-in.throttler';

@ApiTags('auth')
@Controller()
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  @Post('auth/sign-in')
  @Public()
  @UseGuards(SignInThrottlerGuard)
  @HttpCode(200)
  @ApiOperation({ summary: 'Sign in; the session is set as an httpOnly cookie' })
  @ApiZodBody(signInSchema)
  async signIn(@Body(new ZodPipe(signInSchema)) body: SignInRequest, @Res({ passthrough: true }) reply: FastifyReply): Promise<Me> {
    const { me, token } = await this.auth.signIn(body);
    setSessionCookie(
      reply,
      token,
      this.config.get('SESSION_MINUTES', { infer: true }) * 60,
      this.config.get('COOKIE_SECURE', { infer: true }),
    );
    return me;
  }

  @Post('auth/sign-out')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'Sign out: clears the session cookie' })
  signOut(@Res({ passthrough: true }) reply: FastifyReply): void {
    clearSessionCookie(reply, this.config.get('COOKIE_SECURE', { infer: true }));
  }

  @Get('me')
  @Roles(ROLES)
  @ApiOperation({ summary: 'The signed-in user' })
  me(@CurrentUser() user: AuthUser): Me {
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }
}
