import type { MemberFilterFields } from './dto/list-members.dto';
import { idsAnd } from './dto/list-params';
import type { MemberFilter } from './members.repository';

/** The Members filter of a request (query or bulk-flag body), parsed for the repository. */
export function toMemberFilter(q: MemberFilterFields & { verdict?: MemberFilter['verdicts'] }): MemberFilter {
  const reviewer = idsAnd(q.reviewer, 'none');
  return {
    levelIds: q.level?.map(Number),
    categories: q.category,
    materials: q.material,
    reviewerIds: reviewer.ids,
    reviewerNone: reviewer.word,
    verdicts: q.verdict,
    failingChecks: q.check,
    utilMin: q.utilMin,
    utilMax: q.utilMax,
    q: q.q || undefined,
  };
}
