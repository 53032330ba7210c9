import { Transform, Type } from 'class-transformer';
import { IsBoolean, IsIn, IsInt, IsOptional, Max, Min } from 'class-validator';
import { FLAG_LIMITS, FLAG_SORTS, FLAG_STATUSES, type FlagSort, type FlagStatus } from '@sagline/common/api-types';
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

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'must be a whole number (1 is the first page)' })
  @Min(1, { message: 'must be 1 or more' })
  page: number = 1;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'must be a whole number' })
  @Min(1, { message: 'must be 1 or more' })
  @Max(FLAG_LIMITS.pageSizeMax, { message: `must be at most ${FLAG_LIMITS.pageSizeMax}` })
  pageSize: number = FLAG_LIMITS.pageSizeDefault;
}
