import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import { LIMITS, type AcceptInvitationRequest } from '@sagline/common/api-types';
import { IsNewPassword } from '../../auth/dto/new-password';
import { Trim } from '../../common/dto-helpers';

export class AcceptInvitationDto implements AcceptInvitationRequest {
  @Trim()
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'is required: the name colleagues will see' })
  @MaxLength(LIMITS.nameMax, { message: `must be at most ${LIMITS.nameMax} characters` })
  name: string;

  @IsNewPassword()
  password: string;
}
