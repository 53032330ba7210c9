import { ImportCommitService } from '../../src/imports/import-commit.service';
import { ImportsService } from '../../src/imports/imports.service';
import type { TestApp } from './test-app';

/**
 * One member row of a schedule, in the units of the CSV header below (SI as
 * engineers write it: m, GPa, 10^6 mm^4, kN/m). Defaults: a 6 m simple-span
 * steel floor beam (E = 200 GPa) under D = 5 and L = 6 kN/m.
 */
export interface MemberSpec {
  mark: string;
  level?: string;
  grid?: string;
  category?: string;
  material?: string;
  section?: string;
  /** "7.2" or "7.2+7.2" (continuous). */
  spans?: string;
  leftOverhang?: number;
  rightOverhang?: number;
  supports?: string;
  E?: number;
  /** 10^6 mm^4 */
  I?: number;
  /** kN/m; null for no load of the case. */
  D?: number | null;
  L?: number | null;
  reviewer?: string;
  notes?: string;
}

const HEADER =
  'Mark,Level,Grid,Category,Material,Section,Spans [m],Left overhang [m],Right overhang [m],Supports,E [GPa],I [10^6 mm^4],Depth [mm],Camber [mm],D [kN/m],L [kN/m],Lr [kN/m],S [kN/m],W [kN/m],Reviewer,Notes';

function csvCell(v: string | number | undefined): string {
  if (v === undefined) return '';
  const s = String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The schedule as CSV text (the import's own format, samples/halvercote-yard-members.csv). */
export function scheduleCsv(members: MemberSpec[]): string {
  const rows = members.map((m) =>
    [
      m.mark, m.level ?? 'L1', m.grid ?? '', m.category ?? 'floor', m.material ?? 'steel', m.section ?? '', m.spans ?? '6',
      m.leftOverhang, m.rightOverhang, m.supports ?? 'pinned', m.E ?? 200, m.I ?? 100, '', '', m.D === null ? '' : (m.D ?? 5), m.L === null ? '' : (m.L ?? 6), '', '', '',
      m.reviewer ?? '', m.notes ?? '',
    ].map(csvCell).join(','),
  );
  return [HEADER, ...rows].join('\n') + '\n';
}

/**
 * Revisions made the way an engineer makes them: the schedule goes through
 * the import's preview (parse, validate, engine) and commit (one
 * transaction), in process, so members, loads and results are exactly what
 * an upload stores.
 *
 * Handbook check of the defaults (AISC Steel Construction Manual, 15th ed.,
 * Table 3-23 case 1, simple beam, uniform load: Δ = 5wL⁴/384EI): L = 6 kN/m
 * over 6 m, E = 200 GPa, I = 100 ×10⁶ mm⁴ gives 5·6000·6⁴/(384·200e9·1e-4) =
 * 5.06 mm against L/360 = 16.7 mm: passes. I = 20 gives 25.3 mm: fails L/360 live.
 */
export class MembersFactory {
  private files = 0;

  constructor(private readonly t: TestApp) {}

  async revision(projectId: number, uploaderId: number, members: MemberSpec[], label?: string): Promise<{ id: number; number: number }> {
    const imports = this.t.app.get(ImportsService, { strict: false });
    const commit = this.t.app.get(ImportCommitService, { strict: false });
    const fileName = `schedule-${++this.files}.csv`;
    const preview = await imports.preview(projectId, uploaderId, { fileName, bytes: Buffer.from(scheduleCsv(members), 'utf8') });
    const { revision } = await commit.commit(projectId, preview.draftId, { label: label ?? null, actorId: uploaderId });
    return { id: revision.id, number: revision.number };
  }
}
