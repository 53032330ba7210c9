import { IsNotEmpty, IsOptional, IsString, MaxLength } from 'class-validator';
import { IMPORT_LIMITS, type CommitImportRequest } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

export class CommitImportDto implements CommitImportRequest {
  @IsOptional()
  @Trim()
  @IsString({ message: 'must be text' })
  @IsNotEmpty({ message: 'cannot be empty (leave it out instead)' })
  @MaxLength(IMPORT_LIMITS.labelMax, { message: `must be at most ${IMPORT_LIMITS.labelMax} characters` })
  label?: string;
}
