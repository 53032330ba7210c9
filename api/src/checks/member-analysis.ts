import { checkBeam, EngineError, type BeamInput, type Load } from '@sagline/common/engine';
import { checksFor, LimitError, type LimitSet, type MaterialId } from '@sagline/common/limits';
import { memberBeamInput, type ScheduleMember } from '@sagline/common/schedule';
import type { ImportProblem, Verdict } from '@sagline/common/api-types';

/** One member × check × segment, as stored in `results` (SI; deflection positive up). */
export interface ResultRow {
  checkName: string;
  combination: string;
  ruleId: string;
  segmentIndex: number;
  segmentKind: 'span' | 'overhang';
  segmentFrom: number;
  segmentTo: number;
  x: number;
  deflection: number;
  effectiveLength: number;
  spanRatio: number | null;
  limitRatio: number;
  maxAbs: number | null;
  plus: number;
  allowed: number;
  governing: 'ratio' | 'maxAbs';
  utilization: number;
  pass: boolean;
  requiredI: number;
}

/** The per-member summary the Members screen filters on. */
export interface MemberVerdict {
  /** Null when no check applies (no load of any checked case). */
  verdict: Verdict | null;
  governingCheck: string | null;
  maxUtilization: number | null;
  /** The I (m^4) at which every check of the member would pass; null when none applies. */
  requiredI: number | null;
}

export interface MemberAnalysis extends MemberVerdict {
  length: number;
  results: ResultRow[];
}

export interface AnalysisOutcome {
  /** Same order as the members given. */
  analyses: MemberAnalysis[];
  /** Fatal: members the engine or the limit set could not take. */
  problems: ImportProblem[];
  pass: number;
  fail: number;
  unchecked: number;
}

/**
 * Runs the engine over every member of a schedule under a limit set: for
 * each member the checks of its category and material (checksFor, with the
 * member's own load cases and length, so combinations never name a case it
 * lacks), then the engine's fast path (checkBeam: the same numbers as
 * analyzeBeam's checks). Deterministic, so a commit can rerun what a preview
 * ran. `onProgress(done)` is called every `every` members.
 */
export function analyzeMembers(
  members: readonly ScheduleMember[],
  limitSet: LimitSet,
  options: { sheet?: string; onProgress?: (done: number) => void; every?: number } = {},
): AnalysisOutcome {
  const { sheet = 'Members', onProgress, every = 500 } = options;
  const analyses: MemberAnalysis[] = [];
  const problems: ImportProblem[] = [];
  let pass = 0;
  let fail = 0;
  let unchecked = 0;
  for (let i = 0; i < members.length; i++) {
    const member = members[i];
    const base = memberBeamInput(member);
    let analysis: MemberAnalysis;
    try {
      analysis = analyzeOne(member, base, limitSet);
    } catch (e) {
      if (!(e instanceof EngineError || e instanceof LimitError)) throw e;
      problems.push({
        severity: 'error',
        code: e instanceof EngineError ? `ENGINE_${e.code}` : `LIMITS_${e.code}`,
        sheet,
        row: member.sourceRow,
        column: null,
        mark: member.mark,
        value: null,
        message: `Member ${member.mark} (row ${member.sourceRow}) cannot be checked: ${e.message} Correct the member's spans, supports or loads.`,
      });
      analysis = { length: base.length, results: [], verdict: null, governingCheck: null, maxUtilization: null, requiredI: null };
    }
    analyses.push(analysis);
    if (analysis.verdict === 'pass') pass++;
    else if (analysis.verdict === 'fail') fail++;
    else unchecked++;
    if (onProgress && (i + 1) % every === 0) onProgress(i + 1);
  }
  onProgress?.(members.length);
  return { analyses, problems, pass, fail, unchecked };
}

function analyzeOne(member: ScheduleMember, base: ReturnType<typeof memberBeamInput>, limitSet: LimitSet): MemberAnalysis {
  const cases = [...new Set(base.loads.map((l) => l.case))];
  const { combinations, checks, rules } = checksFor(limitSet, member.category, member.material as MaterialId, { cases, length: base.length });
  const input: BeamInput = { length: base.length, E: base.E, I: base.I, supports: base.supports, loads: base.loads as Load[], combinations, checks };
  const results: ResultRow[] = [];
  if (checks.length === 0) return { length: base.length, results, verdict: null, governingCheck: null, maxUtilization: null, requiredI: null };
  const reports = checkBeam(input);
  let governingCheck: string | null = null;
  let maxUtilization = -1;
  let requiredI = 0;
  let allPass = true;
  for (let c = 0; c < reports.length; c++) {
    const report = reports[c];
    const ruleId = rules[c].id;
    report.segments.forEach((s, index) => {
      results.push({
        checkName: report.name,
        combination: report.combination,
        ruleId,
        segmentIndex: index,
        segmentKind: s.kind,
        segmentFrom: s.from,
        segmentTo: s.to,
        x: s.x,
        deflection: s.deflection,
        effectiveLength: s.effectiveLength,
        spanRatio: s.spanRatio,
        limitRatio: s.limitRatio,
        maxAbs: s.maxAbs,
        plus: s.plus,
        allowed: s.allowed,
        governing: s.governing,
        utilization: s.utilization,
        pass: s.pass,
        requiredI: s.requiredI,
      });
      if (s.requiredI > requiredI) requiredI = s.requiredI;
    });
    if (!report.pass) allPass = false;
    if (report.utilization > maxUtilization) {
      maxUtilization = report.utilization;
      governingCheck = report.name;
    }
  }
  return { length: base.length, results, verdict: allPass ? 'pass' : 'fail', governingCheck, maxUtilization, requiredI };
}
