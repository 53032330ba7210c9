import { IsNotEmpty, IsString, MaxLength, MinLength } from 'class-validator';
import { LIMITS, type AcceptInvitationRequest } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

export class AcceptInvitationDto implements AcceptInvitationRequest {
  @Trim()
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'is required: the name colleagues will see' })
  @MaxLength(LIMITS.nameMax, { message: `must be at most ${LIMITS.nameMax} characters` })
  name: string;

  @IsString({ message: 'must be text' })
  @MinLength(LIMITS.passwordMin, { message: `must be at least ${LIMITS.passwordMin} characters` })
  @MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` })
  password: string;
}
