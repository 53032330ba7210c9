import { IsEmail, IsIn, IsNotEmpty, IsOptional, IsString, MaxLength } from 'class-validator';
import { LIMITS, PROJECT_ROLES, type InviteRequest, type ProjectRole } from '@sagline/common/api-types';
import { NormaliseEmail, Trim } from '../../common/dto-helpers';

export class InviteDto implements InviteRequest {
  @NormaliseEmail()
  @IsString({ message: 'must be text' })
  @MaxLength(LIMITS.emailMax, { message: `must be at most ${LIMITS.emailMax} characters` })
  @IsEmail({}, { message: 'must be an e-mail address, e.g. name@firm.example' })
  email: string;

  @IsIn(PROJECT_ROLES, { message: `must be one of ${PROJECT_ROLES.join(', ')}` })
  role: ProjectRole;

  @IsOptional()
  @Trim()
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'cannot be empty (leave it out instead)' })
  @MaxLength(LIMITS.nameMax, { message: `must be at most ${LIMITS.nameMax} characters` })
  name?: string;
}
