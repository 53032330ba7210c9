import { Transform } from 'class-transformer';
import { IsBoolean, IsIn, IsOptional } from 'class-validator';
import { FLAG_LIMITS, FLAG_SORTS, FLAG_STATUSES, type FlagSort, type FlagStatus } from '@sagline/common/api-types';
import { PageNumber, PageSize } from '../../common/paging.dto';
import { IdList, SearchText, TextList, WordList } from '../../members/dto/list-params';

export class ListFlagsQuery {
  @WordList(FLAG_STATUSES)
  status?: FlagStatus[];

  @IdList('user', ['me', 'none'])
  assignee?: string[];

  @IdList('level')
  level?: string[];

  @SearchText(FLAG_LIMITS.markMax)
  mark?: string;

  @TextList('check=L/360 live&check=L/240 total', { commas: false })
  check?: string[];

  @IsOptional()
  @Transform(({ value }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'must be true or false' })
  overdue?: boolean;

  @IsOptional()
  @IsIn(FLAG_SORTS, { message: `must be one of ${FLAG_SORTS.join(', ')}` })
  sort: FlagSort = '-updated';

  @PageNumber()
  page: number = 1;

  @PageSize(FLAG_LIMITS)
  pageSize: number = FLAG_LIMITS.pageSizeDefault;
}
