import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';

export const ACTIVITY_PAGE_SIZE_MAX = 100;

export class ListActivityQuery {
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
  pageSize: number = 25;
}
