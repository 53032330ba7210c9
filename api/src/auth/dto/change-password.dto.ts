import { IsNotEmpty, IsString, MaxLength, MinLength } from 'class-validator';
import { LIMITS, type ChangePasswordRequest } from '@sagline/common/api-types';

export class ChangePasswordDto implements ChangePasswordRequest {
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'is required: your current password' })
  @MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` })
  currentPassword: string;

  @IsString({ message: 'must be text' })
  @MinLength(LIMITS.passwordMin, { message: `must be at least ${LIMITS.passwordMin} characters` })
  @MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` })
  newPassword: string;
}
