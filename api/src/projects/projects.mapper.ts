import type { Project, ProjectRole, ProjectSummary } from '@sagline/common/api-types';
import type { LevelRow, ProjectRow } from './projects.repository';

export function toProjectSummary(row: ProjectRow, myRole: ProjectRole | 'admin'): ProjectSummary {
  return {
    id: row.id,
    name: row.name,
    number: row.number,
    unitSystem: row.unit_system,
    myRole,
    createdAt: row.created_at.toISOString(),
  };
}

export function toProject(row: ProjectRow, levels: LevelRow[], myRole: ProjectRole | 'admin'): Project {
  return { ...toProjectSummary(row, myRole), levels: levels.map((l) => ({ id: l.id, name: l.name, position: l.position })) };
}
