import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import type { InvitationResponse } from '@sagline/common/api-types';
import { AcceptInvitationDto } from './dto/accept-invitation.dto';
import { InvitationsService } from './invitations.service';

/** Open routes: the invitee has no account yet; the token in the link is the credential. */
@Controller('invitations')
export class InvitationsController {
  constructor(private readonly invitations: InvitationsService) {}

  @Get(':token')
  get(@Param('token') token: string): Promise<InvitationResponse> {
    return this.invitations.get(token);
  }

  @Post(':token/accept')
  @HttpCode(204)
  async accept(@Param('token') token: string, @Body() dto: AcceptInvitationDto): Promise<void> {
    await this.invitations.accept(token, dto);
  }
}
