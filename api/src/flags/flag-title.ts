import type { MemberCheckRow, MemberFullRow } from '../members/members.repository';

function util(u: number): string {
  return u.toFixed(2);
}

/**
 * The title a flag gets when the checker gives none: what fails and by how
 * much, from the latest revision's results ("B12 fails L/360 live
 * (utilisation 1.24)"), else "B12 needs a look".
 */
export function defaultFlagTitle(member: Pick<MemberFullRow, 'mark' | 'verdict' | 'governing_check' | 'max_utilization'>, checkName: string | null, checks: MemberCheckRow[]): string {
  if (checkName) {
    const c = checks.find((x) => x.check_name === checkName);
    if (c && !c.pass) return `${member.mark} fails ${checkName} (utilisation ${util(c.utilization)})`;
    if (c) return `${member.mark}: ${checkName} needs a look (utilisation ${util(c.utilization)})`;
    return `${member.mark}: ${checkName} needs a look`;
  }
  if (member.verdict === 'fail' && member.governing_check && member.max_utilization !== null) {
    return `${member.mark} fails ${member.governing_check} (utilisation ${util(member.max_utilization)})`;
  }
  return `${member.mark} needs a look`;
}
