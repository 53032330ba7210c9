import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';
import { OVERVIEW_LIMITS } from '@sagline/common/api-types';

export class FlagsOverTimeQuery {
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: `must be a whole number of days, e.g. ${OVERVIEW_LIMITS.daysDefault}` })
  @Max(OVERVIEW_LIMITS.daysMax, { message: `must be at most ${OVERVIEW_LIMITS.daysMax} days` })
  @Min(1, { message: 'must be 1 day or more' })
  days: number = OVERVIEW_LIMITS.daysDefault;
}
