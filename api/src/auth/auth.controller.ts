import { Body, Controller, Get, HttpCode, Post, Req, Res } from '@nestjs/common';
import type { Request, Response } from 'express';
import type { MeResponse } from '@sagline/common/api-types';
import { CurrentUser, SignedIn } from './auth.decorators';
import { AuthService } from './auth.service';
import { ChangePasswordDto } from './dto/change-password.dto';
import { SignInDto } from './dto/sign-in.dto';
import type { SessionUser } from './session-user';
import { SignInService } from './sign-in.service';

@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly sessions: SignInService,
  ) {}

  /** The body is validated by the DTO first; passport-local then reads the same fields. */
  @Post('sign-in')
  @HttpCode(200)
  async signIn(@Body() _credentials: SignInDto, @Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<MeResponse> {
    return { user: await this.sessions.signIn(req, res) };
  }

  @Post('sign-out')
  @HttpCode(204)
  async signOut(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    await this.sessions.signOut(req, res);
  }

  @Get('me')
  @SignedIn()
  me(@CurrentUser() user: SessionUser): MeResponse {
    return { user };
  }

  @Post('password')
  @HttpCode(204)
  @SignedIn()
  async changePassword(@CurrentUser() user: SessionUser, @Body() dto: ChangePasswordDto, @Req() req: Request): Promise<void> {
    await this.auth.changePassword(user, dto, req.sessionID);
  }
}
