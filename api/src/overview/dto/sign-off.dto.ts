import { IsNotEmpty, IsOptional, IsString, MaxLength } from 'class-validator';
import { OVERVIEW_LIMITS, type SignOffLevelRequest, type WithdrawSignOffRequest } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

export class SignOffLevelDto implements SignOffLevelRequest {
  @IsOptional()
  @Trim()
  @MaxLength(OVERVIEW_LIMITS.signOffCommentMax, { message: `must be at most ${OVERVIEW_LIMITS.signOffCommentMax} characters` })
  @IsString({ message: 'must be text' })
  comment?: string;
}

export class WithdrawSignOffDto implements WithdrawSignOffRequest {
  @Trim()
  @MaxLength(OVERVIEW_LIMITS.signOffCommentMax, { message: `must be at most ${OVERVIEW_LIMITS.signOffCommentMax} characters` })
  @IsNotEmpty({ message: 'is required: say why the sign-off no longer holds' })
  @IsString({ message: 'must be text' })
  reason: string;
}
