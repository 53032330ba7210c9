import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';
import { ACTIVITY_KINDS, ACTIVITY_LIMITS, type ActivityKind } from '@sagline/common/api-types';
import { SearchText, WordList } from '../../members/dto/list-params';
import { CalendarDay } from './calendar-day';

export const ACTIVITY_PAGE_SIZE_MAX = ACTIVITY_LIMITS.pageSizeMax;

export class ListActivityQuery {
  @WordList(ACTIVITY_KINDS)
  kind?: ActivityKind[];

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'must be the id of a person (a whole number)' })
  @Min(1, { message: 'must be the id of a person (a whole number)' })
  actorId?: number;

  @IsOptional()
  @CalendarDay()
  from?: string;

  @IsOptional()
  @CalendarDay()
  to?: string;

  @SearchText(ACTIVITY_LIMITS.qMax)
  q?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'must be a whole number (1 is the newest page)' })
  @Min(1, { message: 'must be 1 or more' })
  page: number = 1;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'must be a whole number' })
  @Min(1, { message: 'must be 1 or more' })
  @Max(ACTIVITY_PAGE_SIZE_MAX, { message: `must be at most ${ACTIVITY_PAGE_SIZE_MAX}` })
  pageSize: number = ACTIVITY_LIMITS.pageSizeDefault;
}
