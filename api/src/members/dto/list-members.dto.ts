import { applyDecorators } from '@nestjs/common';
import { IsIn, IsOptional, Matches } from 'class-validator';
import { MEMBER_LIMITS, MEMBER_SORTS, type MemberSort } from '@sagline/common/api-types';
import { PageNumber, PageSize } from '../../common/paging.dto';
import { IdList, SearchText, TextList, Utilization, WordList } from './list-params';

const VERDICTS = ['pass', 'fail', 'unchecked'] as const;

/** `?revision=`: "latest" (the default, on the field) or a revision id. */
const Revision = () =>
  applyDecorators(IsOptional(), Matches(/^(latest|[1-9]\d{0,9})$/, { message: 'must be "latest" or a revision id of this project' }));

/** The Members filter (also the `filter` of a bulk flag raise, without revision, verdict, sort and paging). */
export class MemberFilterFields {
  @IdList('level')
  level?: string[];

  @TextList('steel-floor-beam')
  category?: string[];

  @TextList('steel,timber')
  material?: string[];

  @IdList('reviewer (user)', ['none'])
  reviewer?: string[];

  @TextList('check=L/360 live&check=L/240 total', { commas: false })
  check?: string[];

  @Utilization()
  utilMin?: number;

  @Utilization()
  utilMax?: number;

  @SearchText(MEMBER_LIMITS.queryMax)
  q?: string;
}

/** `?revision=` of the facets and the member detail. */
export class RevisionQuery {
  @Revision()
  revision: string = 'latest';
}

export class ListMembersQuery extends MemberFilterFields {
  @Revision()
  revision: string = 'latest';

  @WordList(VERDICTS)
  verdict?: ('pass' | 'fail' | 'unchecked')[];

  @IsOptional()
  @IsIn(MEMBER_SORTS, { message: `must be one of ${MEMBER_SORTS.join(', ')}` })
  sort: MemberSort = 'mark';

  @PageNumber()
  page: number = 1;

  @PageSize(MEMBER_LIMITS)
  pageSize: number = MEMBER_LIMITS.pageSizeDefault;
}
