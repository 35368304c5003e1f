import { Body, Controller, Get, HttpCode, Inject, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { CookieOptions, Response } from 'express';
import type { CurrentUser as SessionUser, SignInResponse } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import type { AppRequest } from '../common/request.types';
import { CompletePasswordResetDto } from '../users/dto/complete-password-reset.dto';
import { UsersService } from '../users/users.service';
import { AuthService } from './auth.service';
import { SignInDto } from './dto/sign-in.dto';
import { SignInThrottlerGuard } from './sign-in-throttler.guard';
import { fromSessionCookie, sessionCookieName } from './jwt.strategy';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  private readonly cookieName: string;

  constructor(
    private readonly auth: AuthService,
    private readonly users: UsersService,
    @Inject(APP_ENV) private readonly env: AppEnv,
  ) {
    this.cookieName = sessionCookieName(env);
  }

  @Public()
  @UseGuards(SignInThrottlerGuard)
  @Post('sign-in')
  @HttpCode(200)
  async signIn(
    @Body() body: SignInDto,
    @Req() request: AppRequest,
    @Res({ passthrough: true }) response: Response,
  ): Promise<SignInResponse> {
    const { user, token } = await this.auth.signIn(body, request.ip ?? 'unknown');
    response.cookie(this.cookieName, token, { ...this.cookieOptions(), maxAge: this.env.jwtTtlS * 1000 });
    return { user };
  }

  /** Ends this session: its token is refused from now on, even if replayed, and the cookie is cleared. */
  @Public()
  @Post('sign-out')
  @HttpCode(204)
  async signOut(@Req() request: AppRequest, @Res({ passthrough: true }) response: Response): Promise<void> {
    await this.auth.signOut(fromSessionCookie(this.cookieName)(request));
    response.clearCookie(this.cookieName, this.cookieOptions());
  }

  /** Ends every session of the signed-in account on every device (its tokens stop working at once). */
  @ApiCookieAuth()
  @Post('sign-out-everywhere')
  @HttpCode(204)
  async signOutEverywhere(
    @CurrentUser() user: SessionUser,
    @Req() request: AppRequest,
    @Res({ passthrough: true }) response: Response,
  ): Promise<void> {
    await this.auth.signOutEverywhere(user.id, user.email, request.ip ?? 'unknown');
    response.clearCookie(this.cookieName, this.cookieOptions());
  }

  /** Sets a new password with the token of a one-time link an admin issued; ends the account's sessions. */
  @Public()
  @Post('password-reset')
  @HttpCode(204)
  async completePasswordReset(@Body() body: CompletePasswordResetDto): Promise<void> {
    await this.users.completeReset(body.token, body.password, new Date());
  }

  @ApiCookieAuth()
  @Get('me')
  me(@CurrentUser() user: SessionUser): SignInResponse {
    return { user: { id: user.id, email: user.email, displayName: user.displayName, role: user.role } };
  }

  private cookieOptions(): CookieOptions {
    return { httpOnly: true, sameSite: 'strict', secure: this.env.cookieSecure, path: '/' };
  }
}
