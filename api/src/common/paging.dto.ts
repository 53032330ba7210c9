import { applyDecorators } from '@nestjs/common';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';

// The paging fields of every list query (`?page=&pageSize=`). The default stays on the field
// (`page: number = 1`, `pageSize: number = LIMITS.pageSizeDefault`), where a reader looks for it.
// Inside applyDecorators the rule listed LAST is reported when several fail, so the basic one
// (a whole number) goes last: "abc" is told it must be a whole number, not that it must be 1 or more.

/** The page-size limits of one list, as its `*_LIMITS` in common/api-types give them. */
export interface PageSizeLimits {
  readonly pageSizeMax: number;
}

/** `?page=`: a whole number from 1. `firstPage` says what page 1 holds (e.g. "the newest page"). */
export const PageNumber = (firstPage = 'the first page') =>
  applyDecorators(
    IsOptional(),
    Type(() => Number),
    Min(1, { message: 'must be 1 or more' }),
    IsInt({ message: `must be a whole number (1 is ${firstPage})` }),
  );

/** `?pageSize=`: a whole number from 1 to the list's `pageSizeMax`. */
export const PageSize = ({ pageSizeMax }: PageSizeLimits) =>
  applyDecorators(
    IsOptional(),
    Type(() => Number),
    Max(pageSizeMax, { message: `must be at most ${pageSizeMax}` }),
    Min(1, { message: 'must be 1 or more' }),
    IsInt({ message: 'must be a whole number' }),
  );
