import type { MemberDetail, MemberFacets, MemberResultView, MemberRow, MembersPage, RevisionSummary } from '@sagline/common/api-types';
import { analyzeBeam, type BeamInput } from '@sagline/common/engine';

/** Answers of the members routes for the Halvercote Yard demo (product.md, invented). */
export const revisionRef = { id: 32, number: 2, label: 'Rev B, issued for permit', createdAt: '2025-03-11T15:20:00.000Z' };
export const revision1Ref = { id: 31, number: 1, label: 'Rev A, scheme design', createdAt: '2025-03-04T10:00:00.000Z' };

const summary = (r: typeof revisionRef, failCount: number): RevisionSummary => ({
  ...r,
  uploadedBy: { id: 4, name: 'Rafe Lindqvist' },
  fileName: 'halvercote-yard.xlsx',
  fileType: 'xlsx',
  fileSize: 88_412,
  memberCount: 391,
  passCount: 391 - failCount,
  failCount,
  status: 'committed',
});
/** Newest first, as the API lists them. */
export const revisions: RevisionSummary[] = [summary(revisionRef, 15), summary(revision1Ref, 14)];

export const memberRow = (over: Partial<MemberRow> = {}): MemberRow => ({
  id: 9001,
  mark: 'L3-B12',
  level: { id: 102, name: 'L3' },
  grid: 'C/4-5',
  category: 'floor',
  material: 'steel',
  section: 'W310x39',
  supports: 'pinned',
  spans: [7.2],
  leftOverhang: 0,
  rightOverhang: 0,
  length: 7.2,
  governingCheck: 'L/360 live',
  maxUtilization: 1.24,
  verdict: 'fail',
  requiredI: 1.24 * 86.9e-6,
  I: 86.9e-6,
  reviewer: { id: 3, name: 'Ilse Varga' },
  reviewerEmail: 'ilse.varga@halvercote.example',
  openFlagCount: 1,
  ...over,
});

export const membersPage = (items: MemberRow[], over: Partial<MembersPage> = {}): MembersPage => ({
  items,
  total: items.length,
  page: 1,
  pageSize: 50,
  revision: revisionRef,
  ...over,
});

export const facets: MemberFacets = {
  revision: revisionRef,
  total: 391,
  verdicts: { pass: 370, fail: 15, unchecked: 6 },
  levels: [
    { id: 100, name: 'L1', count: 72, failCount: 2 },
    { id: 101, name: 'L2', count: 70, failCount: 3 },
    { id: 102, name: 'L3', count: 70, failCount: 4 },
    { id: 103, name: 'L4', count: 70, failCount: 3 },
    { id: 104, name: 'L5', count: 66, failCount: 2 },
    { id: 105, name: 'Roof', count: 43, failCount: 1 },
  ],
  categories: [
    { value: 'floor', count: 330, failCount: 13 },
    { value: 'roof-no-ceiling', count: 43, failCount: 1 },
    { value: 'concrete-floor', count: 18, failCount: 1 },
  ],
  materials: [
    { value: 'steel', count: 310, failCount: 12 },
    { value: 'timber', count: 63, failCount: 2 },
    { value: 'concrete', count: 18, failCount: 1 },
  ],
  reviewers: [
    { id: 3, name: 'Ilse Varga', count: 200, failCount: 9 },
    { id: 9, name: 'Noor Ambler', count: 180, failCount: 6 },
    { id: null, name: null, count: 11, failCount: 0 },
  ],
  checks: [
    { name: 'L/360 live', failCount: 12 },
    { name: 'L/240 total, D+L', failCount: 5 },
  ],
};

/**
 * L3-B12: a 7.2 m simply supported steel beam (E = 200 GPa, I = 86.9 ×10⁶ mm⁴)
 * with a dead and a live line load over its length and a live point load
 * at 2.4 m, checked for L/360 under live and L/240 under dead plus live
 * (IBC 2021 Table 1604.3). The report is the engine's own run, as the API
 * builds it.
 */
export const beamInput: BeamInput = {
  length: 7.2,
  E: 200e9,
  I: 86.9e-6,
  supports: [
    { x: 0, kind: 'pin' },
    { x: 7.2, kind: 'pin' },
  ],
  loads: [
    { case: 'D', kind: 'udl', x1: 0, x2: 7.2, w: 1500 },
    { case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 7000 },
    { case: 'L', kind: 'point', x: 2.4, P: 20000 },
  ],
  combinations: { L: { L: 1 }, 'D+L': { D: 1, L: 1 } },
  checks: [
    { name: 'L/360 live', combination: 'L', ratio: 360 },
    { name: 'L/240 total, D+L', combination: 'D+L', ratio: 240 },
  ],
};

export const report = analyzeBeam(beamInput);

const ruleIds: Record<string, string> = { 'L/360 live': 'ibc-floor-live', 'L/240 total, D+L': 'ibc-floor-total' };

export const results: MemberResultView[] = report.checks.flatMap((c) =>
  c.segments.map((s, i) => ({
    checkName: c.name,
    combination: c.combination,
    ruleId: ruleIds[c.name],
    segmentIndex: i,
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
  })),
);

const source = (clause: string) => ({ document: 'IBC', edition: '2021', clause, trust: 'from memory' });

export const memberDetail = (): MemberDetail => {
  const maxU = Math.max(...results.map((r) => r.utilization));
  const governing = results.find((r) => r.utilization === maxU)!;
  return {
    revision: revisionRef,
    isLatest: true,
    unitSystem: 'SI',
    member: {
      ...memberRow({
        maxUtilization: maxU,
        verdict: results.every((r) => r.pass) ? 'pass' : 'fail',
        governingCheck: governing.checkName,
        requiredI: Math.max(...results.map((r) => r.requiredI)),
      }),
      E: 200e9,
      depth: null,
      camber: null,
      notes: 'Supports the plant room partition.',
      sourceRow: 58,
    },
    loads: [],
    beamInput,
    report,
    results,
    rules: [
      {
        id: 'ibc-floor-live',
        category: 'floor',
        check: 'L/360 live',
        combination: { L: 1 },
        combinationName: 'L',
        ratio: 360,
        maxAbs: null,
        plus: null,
        materials: null,
        lengthRange: null,
        source: source('Table 1604.3'),
        sourceText: 'IBC 2021, Table 1604.3 (from memory)',
      },
      {
        id: 'ibc-floor-total',
        category: 'floor',
        check: 'L/240 total, D+L',
        combination: { D: 1, L: 1 },
        combinationName: 'D+L',
        ratio: 240,
        maxAbs: null,
        plus: null,
        materials: null,
        lengthRange: null,
        source: source('Table 1604.3'),
        sourceText: 'IBC 2021, Table 1604.3 (from memory)',
      },
    ],
    caution: 'Results support, and do not replace, the judgement of the engineer of record.',
    flags: [],
    history: [
      { revision: revision1Ref, present: true, verdict: 'pass', maxUtilization: 0.96, governingCheck: 'L/360 live', changes: [] },
      {
        revision: revisionRef,
        present: true,
        verdict: 'fail',
        maxUtilization: maxU,
        governingCheck: governing.checkName,
        changes: [{ field: 'loads.L', label: 'Loads L', before: null, after: null, beforeText: '7.00 kN/m', afterText: '7.00 kN/m, 20.0 kN at 2.40 m' }],
      },
    ],
  };
};
