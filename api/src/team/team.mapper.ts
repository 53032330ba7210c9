import type { TeamMember } from '@sagline/common/api-types';
import type { MemberRow } from './team.repository';

export function toTeamMember(row: MemberRow): TeamMember {
  return { userId: row.user_id, name: row.name, email: row.email, role: row.role, status: row.has_password ? 'active' : 'invited' };
}
