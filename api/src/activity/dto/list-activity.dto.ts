import { Type } from 'class-transformer';
import { IsInt, IsOptional, Min } from 'class-validator';
import { ACTIVITY_KINDS, ACTIVITY_LIMITS, type ActivityKind } from '@sagline/common/api-types';
import { PageNumber, PageSize } from '../../common/paging.dto';
import { SearchText, WordList } from '../../members/dto/list-params';
import { CalendarDay } from './calendar-day';

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

  @PageNumber('the newest page')
  page: number = 1;

  @PageSize(ACTIVITY_LIMITS)
  pageSize: number = ACTIVITY_LIMITS.pageSizeDefault;
}
