import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import { LIMITS, type SignInRequest } from '@sagline/common/api-types';
import { NormaliseEmail } from '../../common/dto-helpers';

export class SignInDto implements SignInRequest {
  @NormaliseEmail()
  @IsString({ message: 'must be text: your e-mail address' })
  @IsNotEmpty({ message: 'is required: your e-mail address' })
  @MaxLength(LIMITS.emailMax, { message: `must be at most ${LIMITS.emailMax} characters` })
  email: string;

  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'is required' })
  @MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` })
  password: string;
}
