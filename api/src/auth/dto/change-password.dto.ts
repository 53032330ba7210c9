import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import { LIMITS, type ChangePasswordRequest } from '@sagline/common/api-types';
import { IsNewPassword } from './new-password';

export class ChangePasswordDto implements ChangePasswordRequest {
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'is required: your current password' })
  @MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` })
  currentPassword: string;

  @IsNewPassword()
  newPassword: string;
}
