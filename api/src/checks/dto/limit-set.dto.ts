import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsInt, IsNotEmpty, IsOptional, IsString, MaxLength, Min } from 'class-validator';
import { LIMIT_SET_LIMITS, type CopyLimitSetRequest, type LimitSetRuleInput, type UpdateLimitSetRequest, type UseLimitSetRequest } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

/**
 * The limit-set requests. The rules of an edit are checked field by field in
 * limit-set-input.ts (with paths like `body.rules[2].ratio`) and then by
 * common/src/limits validateLimitSet, so the DTO only checks their envelope.
 * Inside one property the rule listed LAST is reported first (common/validation.ts).
 */

export class CopyLimitSetDto implements CopyLimitSetRequest {
  @IsOptional()
  @Trim()
  @IsNotEmpty({ message: 'must be a preset id, e.g. "ibc-2021"' })
  @IsString({ message: 'must be a preset id, e.g. "ibc-2021"' })
  fromPreset?: string;

  @IsOptional()
  @Type(() => Number)
  @Min(1, { message: "must be the id of one of the project's limit sets" })
  @IsInt({ message: "must be the id of one of the project's limit sets" })
  fromSetId?: number;

  @IsOptional()
  @Trim()
  @MaxLength(LIMIT_SET_LIMITS.nameMax, { message: `must be at most ${LIMIT_SET_LIMITS.nameMax} characters` })
  @IsString({ message: 'must be text' })
  name?: string;
}

export class UpdateLimitSetDto implements UpdateLimitSetRequest {
  @Min(1, { message: "must be the set's version as you loaded it (1 or more)" })
  @IsInt({ message: "must be the set's version as you loaded it (a whole number)" })
  version: number;

  @Trim()
  @MaxLength(LIMIT_SET_LIMITS.nameMax, { message: `must be at most ${LIMIT_SET_LIMITS.nameMax} characters` })
  @IsNotEmpty({ message: 'is required: the name of the limit set' })
  @IsString({ message: 'must be text: the name of the limit set' })
  name: string;

  @IsOptional()
  @MaxLength(LIMIT_SET_LIMITS.descriptionMax, { message: `must be at most ${LIMIT_SET_LIMITS.descriptionMax} characters` })
  @IsString({ message: 'must be text' })
  description?: string;

  @IsOptional()
  @IsString({ each: true, message: 'must be a list of member category ids' })
  @IsArray({ message: 'must be a list of member category ids' })
  categories?: string[];

  @ArrayMaxSize(LIMIT_SET_LIMITS.rulesMax, { message: `may have at most ${LIMIT_SET_LIMITS.rulesMax} rules` })
  @IsArray({ message: 'must be the list of the set\'s rules' })
  rules: LimitSetRuleInput[];
}

export class UseLimitSetDto implements UseLimitSetRequest {
  @IsOptional()
  @Min(1, { message: "must be the set's version as you saw it (1 or more)" })
  @IsInt({ message: "must be the set's version as you saw it (a whole number)" })
  version?: number;
}
