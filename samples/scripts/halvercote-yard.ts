/**
 * The invented demo project "Halvercote Yard" (product.md, demo scenario): a
 * six-storey mixed-use building. Retail on L1, offices on L2, flats on L3–L5,
 * a timber roof. Steel floor framing on L1–L5 (girders on the numbered grid
 * lines, beams between them), concrete transfer beams and glazing wind posts
 * on L1, balcony beams with overhangs and corner cantilevers on L3–L5,
 * engineered-wood joists on glulam girders at the roof. Every name, number
 * and person is invented.
 *
 * Sizes: each member gets the lightest section whose ESTIMATED deflection
 * passes (deflection-estimate.ts: simple-span closed forms such as 5wL⁴/384EI,
 * not the engine), and about 7 % are deliberately given a smaller section so
 * that they fail. Section properties are approximate, from memory, for
 * demonstration only; the calculation uses the E and I columns.
 */
import { checksFor, type MaterialId } from '../../common/src/limits';
import { toSI, type UnitSystemId } from '../../common/src/units';
import type { SupportCode } from '../../common/src/schedule';
import { estimateDeflection, estimateRequiredI, type EstimateCheck, type EstimateLoad, type EstimateMember } from './deflection-estimate';
import type { LoadRowInput, MemberRowInput } from './schedule-workbook';
import { DEMO_LIMIT_SET } from './categories';
import { SeededRandom } from './seeded-random';

export const REVIEWERS = {
  ines: 'ines.okafor@halvercote.example',
  tomas: 'tomas.brandvik@halvercote.example',
  priya: 'priya.castellanos@halvercote.example',
} as const;

export const LEVELS = ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'] as const;

/** A section: name, I and depth in the workbook's units. */
interface Section {
  name: string;
  I: number;
  depth: number;
}

/** Units of the workbook headers. */
interface Units {
  system: UnitSystemId;
  length: string;
  lineLoad: string;
  force: string;
  moment: string;
  modulus: string;
  inertia: string;
  depth: string;
}

const SI_UNITS: Units = { system: 'SI', length: 'm', lineLoad: 'kN/m', force: 'kN', moment: 'kN·m', modulus: 'GPa', inertia: '10^6 mm^4', depth: 'mm' };
const US_UNITS: Units = { system: 'US', length: 'ft', lineLoad: 'plf', force: 'kip', moment: 'kip·ft', modulus: 'ksi', inertia: 'in^4', depth: 'in' };

// Approximate section properties (I in 10^6 mm^4, depth in mm), from memory, for the demo only.
const W_METRIC: Section[] = [
  ['W310x39', 84.9, 310], ['W360x39', 102, 353], ['W360x44', 122, 352], ['W410x39', 126, 399], ['W410x46', 156, 403],
  ['W410x54', 186, 403], ['W410x60', 216, 407], ['W410x67', 245, 410], ['W460x60', 255, 455], ['W460x68', 297, 459],
  ['W460x74', 333, 457], ['W530x66', 351, 525], ['W530x74', 410, 529], ['W530x85', 485, 535], ['W610x82', 562, 599],
  ['W610x92', 646, 603], ['W610x101', 764, 603], ['W610x113', 875, 608], ['W610x125', 985, 612], ['W690x125', 1190, 678],
  ['W690x140', 1360, 684], ['W760x147', 1660, 753], ['W760x173', 2060, 762],
].map(([name, I, depth]) => ({ name: name as string, I: I as number, depth: depth as number }));

// Rectangular hollow sections for the shopfront wind posts (approximate, from memory).
const HSS_METRIC: Section[] = [
  ['HSS102x76x4.8', 2.6, 102], ['HSS127x76x4.8', 3.7, 127], ['HSS127x76x6.4', 4.6, 127], ['HSS152x102x4.8', 6.5, 152], ['HSS152x102x6.4', 8.0, 152], ['HSS203x102x6.4', 16.5, 203], ['HSS254x152x6.4', 40.2, 254],
].map(([name, I, depth]) => ({ name: name as string, I: I as number, depth: depth as number }));

// Engineered-wood I-joists, our own generic designations; I = EI / E with E = 13.1 GPa (approximate).
const I_JOISTS_METRIC: Section[] = [
  ['I-joist 241', 40, 241], ['I-joist 302', 72, 302], ['I-joist 356', 110, 356], ['I-joist 406', 153, 406], ['I-joist 457', 205, 457],
].map(([name, I, depth]) => ({ name: name as string, I: I as number, depth: depth as number }));

/** Glulam b × d, I = b d³ / 12 (exact for the rectangle), depths in 45 mm laminations. */
function glulamMetric(): Section[] {
  const out: Section[] = [];
  for (const b of [140, 165, 215]) {
    for (let d = 405; d <= 990; d += 45) out.push({ name: `GL ${b}x${d}`, I: Math.round((b * d ** 3) / 12 / 1e6), depth: d });
  }
  return out.sort((a, b) => a.I - b.I);
}

/** Concrete transfer beams: I = 0.5 Ig (cracked, an engineer's estimate), b × d in mm. */
function concreteMetric(): Section[] {
  return [[500, 900], [500, 1050], [600, 1050], [600, 1200], [600, 1350], [700, 1500]]
    .map(([b, d]) => ({ name: `RC ${b}x${d}`, I: Math.round((0.5 * b * d ** 3) / 12 / 1e6), depth: d }))
    .sort((a, b) => a.I - b.I);
}

// US customary: W shapes (I in in^4, depth in in), approximate, from memory.
const W_US: Section[] = [
  ['W10x19', 96.3, 10.2], ['W12x19', 130, 12.2], ['W12x26', 204, 12.2], ['W14x22', 199, 13.7], ['W14x26', 245, 13.9],
  ['W16x26', 301, 15.7], ['W16x31', 375, 15.9], ['W16x36', 448, 15.9], ['W18x35', 510, 17.7], ['W18x40', 612, 17.9],
  ['W18x50', 800, 18.0], ['W21x44', 843, 20.7], ['W21x50', 984, 20.8], ['W21x62', 1330, 21.0], ['W24x55', 1350, 23.6],
  ['W24x62', 1550, 23.7], ['W24x76', 2100, 23.9], ['W27x84', 2850, 26.7], ['W30x99', 3990, 29.7],
].map(([name, I, depth]) => ({ name: name as string, I: I as number, depth: depth as number }));

const I_JOISTS_US: Section[] = [
  ['I-joist 9-1/2', 96, 9.5], ['I-joist 11-7/8', 173, 11.875], ['I-joist 14', 264, 14], ['I-joist 16', 368, 16],
].map(([name, I, depth]) => ({ name: name as string, I: I as number, depth: depth as number }));

/**
 * The checks the estimate sizes against: the demo limit set's rules for the
 * member's category and material (common/src/limits checksFor: IBC 2021
 * Table 1604.3 with L + 0.5D for wood and D dropped for steel, TMS 402 for
 * masonry, IBC §1604.3.7 for glass framing, ACI 318-19 Table 24.2.2).
 */
function checksOf(d: DraftMember, est: EstimateMember): EstimateCheck[] {
  const cases = [...new Set(est.loads.map((l) => l.case))];
  const length = est.leftOverhang + est.spans.reduce((a, b) => a + b, 0) + est.rightOverhang;
  const { combinations, checks } = checksFor(DEMO_LIMIT_SET, d.category, d.material as MaterialId, { cases, length });
  return checks.map((c) => ({ name: c.name, combination: combinations[c.combination], ratio: c.ratio, maxAbs: c.maxAbs, plus: c.plus }));
}

/** A Loads sheet row in the workbook's units. */
interface DraftLoad {
  case: string;
  kind: 'point' | 'udl' | 'linear' | 'moment';
  position?: number;
  from?: number;
  to?: number;
  value: number;
  endValue?: number;
  notes?: string;
}

interface DraftMember {
  mark: string;
  level: string;
  grid: string;
  category: string;
  material: string;
  sections: Section[];
  supports: SupportCode;
  spans: number[];
  leftOverhang?: number;
  rightOverhang?: number;
  E: number;
  /** Uniform loads over the whole member, by case, in the line-load unit. */
  uniform: Partial<Record<'D' | 'L' | 'Lr' | 'S' | 'W', number>>;
  extra?: DraftLoad[];
  reviewer: string;
  notes?: string;
  /** Give the member a camber of about 80 % of its dead-load deflection when that is large. */
  camber?: boolean;
}

export interface SampleSchedule {
  members: MemberRowInput[];
  loads: LoadRowInput[];
  /** Marks the estimate expects to fail, and the reason. */
  expectedFailures: { mark: string; check: string; utilisation: number }[];
}

function toEstimate(d: DraftMember, u: Units): EstimateMember {
  const len = (v: number) => toSI(v, u.length);
  const total = (d.leftOverhang ?? 0) + d.spans.reduce((a, b) => a + b, 0) + (d.rightOverhang ?? 0);
  const length = d.supports.startsWith('cantilever') ? d.spans[0] : total;
  const loads: EstimateLoad[] = [];
  for (const [c, w] of Object.entries(d.uniform)) {
    if (w) loads.push({ case: c, kind: 'udl', x1: 0, x2: len(length), w: toSI(w, u.lineLoad) });
  }
  for (const l of d.extra ?? []) {
    if (l.kind === 'point') loads.push({ case: l.case, kind: 'point', x: len(l.position!), P: toSI(l.value, u.force) });
    else if (l.kind === 'moment') loads.push({ case: l.case, kind: 'moment', x: len(l.position!), M: toSI(l.value, u.moment) });
    else if (l.kind === 'udl') loads.push({ case: l.case, kind: 'udl', x1: len(l.from ?? 0), x2: len(l.to ?? length), w: toSI(l.value, u.lineLoad) });
    else loads.push({ case: l.case, kind: 'linear', x1: len(l.from ?? 0), x2: len(l.to ?? length), w1: toSI(l.value, u.lineLoad), w2: toSI(l.endValue!, u.lineLoad) });
  }
  return {
    spans: d.spans.map(len),
    leftOverhang: len(d.leftOverhang ?? 0),
    rightOverhang: len(d.rightOverhang ?? 0),
    supports: d.supports,
    E: toSI(d.E, u.modulus),
    loads,
  };
}

/** Worst estimated utilisation and the check it comes from, for a section. */
function worst(est: EstimateMember, checks: EstimateCheck[], I_SI: number): { check: string; utilisation: number } {
  let best = { check: '', utilisation: 0 };
  for (const check of checks) {
    const one = estimateRequiredI(est, [check]) / I_SI;
    if (one > best.utilisation) best = { check: check.name, utilisation: one };
  }
  return best;
}

function round(v: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(v * f) / f;
}

/** A member whose estimate is close to exact: one pinned span, no overhang (midspan within 2.6 % of the maximum). */
function isSimpleSpan(d: DraftMember): boolean {
  return d.supports === 'pinned' && d.spans.length === 1 && !d.leftOverhang && !d.rightOverhang;
}

/**
 * Picks sections, fills the rows, and keeps the estimate's expected failures.
 * A failing member is chosen only among simple spans (where the estimate is
 * close to exact), and its governing check fails by 5 to 60 %.
 */
function finish(drafts: DraftMember[], u: Units, rng: SeededRandom, failShare: number, forceFail: ReadonlySet<string>): SampleSchedule {
  const out: SampleSchedule = { members: [], loads: [], expectedFailures: [] };
  for (const d of drafts) {
    const est = toEstimate(d, u);
    const checks = checksOf(d, est);
    const req = estimateRequiredI(est, checks) / toSI(1, u.inertia);
    const sections = d.sections;
    const fail = forceFail.has(d.mark) || (isSimpleSpan(d) && rng.chance(failShare));
    let section: Section | undefined;
    if (fail) section = [...sections].reverse().find((s) => s.I <= req / 1.05 && s.I >= req / 1.6);
    if (!section) {
      const ok = sections.findIndex((s) => s.I >= req / 0.92);
      const index = ok < 0 ? sections.length - 1 : Math.min(sections.length - 1, ok + (rng.chance(0.25) ? 1 : 0));
      section = sections[index];
    }
    const I_SI = toSI(section.I, u.inertia);
    const verdict = worst(est, checks, I_SI);
    if (verdict.utilisation > 1) out.expectedFailures.push({ mark: d.mark, check: verdict.check, utilisation: round(verdict.utilisation, 2) });

    let camber: number | null = null;
    if (d.camber) {
      const dead = estimateDeflection(est, { D: 1 }, I_SI);
      // About 80 % of the dead-load deflection, rounded to 5 mm / 1/4 in; none under 20 mm / 3/4 in (common practice, no source).
      const c = u.system === 'SI' ? Math.round((0.8 * dead * 1000) / 5) * 5 : Math.round(((0.8 * dead) / 0.0254) * 4) / 4;
      if (c >= (u.system === 'SI' ? 20 : 0.75)) camber = c;
    }
    out.members.push({
      values: {
        mark: d.mark,
        level: d.level,
        grid: d.grid,
        category: d.category,
        material: d.material,
        section: section.name,
        spans: d.spans.length > 1 ? d.spans.map((s) => s.toFixed(u.system === 'SI' ? 1 : 0)).join('+') : d.spans[0],
        leftOverhang: d.leftOverhang ?? null,
        rightOverhang: d.rightOverhang ?? null,
        supports: d.supports,
        E: d.E,
        I: section.I,
        depth: section.depth,
        camber,
        reviewer: d.reviewer,
        notes: d.notes ?? null,
      },
      loads: Object.fromEntries(Object.entries(d.uniform).filter(([, w]) => w)),
    });
    for (const l of d.extra ?? []) {
      out.loads.push({
        mark: d.mark,
        case: l.case,
        kind: l.kind,
        position: l.position ?? null,
        from: l.from ?? null,
        to: l.to ?? null,
        value: l.value,
        endValue: l.endValue ?? null,
        notes: l.notes ?? null,
      });
    }
  }
  return out;
}

function reviewerFor(level: string): string {
  if (level === 'L1' || level === 'L2') return REVIEWERS.ines;
  if (level === 'L3' || level === 'L4') return REVIEWERS.tomas;
  return REVIEWERS.priya;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** The SI workbook: about 400 members. */
export function halvercoteYardSI(seed = 20250106): SampleSchedule {
  const rng = new SeededRandom(seed);
  const drafts: DraftMember[] = [];
  const X = ['A', 'B', 'C', 'D', 'E']; // 9.0 m bays
  const Y = [1, 2, 3, 4]; // 7.2 m bays
  const BAY_X = 9.0;
  const BAY_Y = 7.2;
  const SPACING = 3.0; // beams at thirds of the girder span
  // Area loads in kPa: dead (slab on metal deck, finishes, services, partitions) and live.
  const floor: Record<string, { D: number; L: number; use: string }> = {
    L1: { D: 4.2, L: 4.8, use: 'retail' },
    L2: { D: 4.3, L: 2.4, use: 'offices' },
    L3: { D: 4.0, L: 1.9, use: 'flats' },
    L4: { D: 4.0, L: 1.9, use: 'flats' },
    L5: { D: 4.0, L: 1.9, use: 'flats' },
  };
  const r2 = (v: number) => round(v, 2);

  for (const level of ['L1', 'L2', 'L3', 'L4', 'L5']) {
    const { D, L, use } = floor[level];
    const reviewer = reviewerFor(level);
    let b = 0;
    let g = 0;
    const beamD = (trib: number, facade = 0) => r2(D * trib + 0.5 + facade);
    const beamL = (trib: number) => r2(L * trib);

    // Beams span 1→2, 2→3, 3→4 on the lettered lines and at the third points between them.
    for (let yi = 0; yi < 3; yi++) {
      const yGrid = `${Y[yi]}-${Y[yi + 1]}`;
      const positions: { grid: string; trib: number; edge: boolean; xi: number; third: number }[] = [];
      for (let xi = 0; xi < X.length; xi++) {
        const edge = xi === 0 || xi === X.length - 1;
        positions.push({ grid: `${X[xi]}/${yGrid}`, trib: edge ? SPACING / 2 : SPACING, edge, xi, third: 0 });
        if (xi < X.length - 1) {
          positions.push({ grid: `${X[xi]}+3.0/${yGrid}`, trib: SPACING, edge: false, xi, third: 1 });
          positions.push({ grid: `${X[xi]}+6.0/${yGrid}`, trib: SPACING, edge: false, xi, third: 2 });
        }
      }
      for (const p of positions) {
        // L1: the two edge lines are one continuous beam over three spans (written on the first bay only).
        if (level === 'L1' && p.edge) {
          if (yi > 0) continue;
          drafts.push({
            mark: `${level}-B${pad(++b)}`, level, grid: `${p.grid.split('/')[0]}/1-4`, category: 'floor', material: 'steel', sections: W_METRIC,
            supports: 'pinned', spans: [BAY_Y, BAY_Y, BAY_Y], E: 200,
            uniform: { D: beamD(p.trib, 3.0), L: beamL(p.trib) }, reviewer,
            notes: 'continuous edge beam over grid lines 2 and 3; shopfront cladding 3.0 kN/m in D',
          });
          continue;
        }
        const balcony = ['L3', 'L4', 'L5'].includes(level) && yi === 0 && p.xi >= 1 && p.xi <= 3 && !(p.xi === 3 && p.third > 0);
        if (balcony) {
          const extra: DraftLoad[] = [
            { case: 'L', kind: 'udl', from: 0, to: 1.8, value: r2((4.0 - L) * p.trib), notes: 'balcony live load 4.0 kPa less the flat live load' },
            { case: 'D', kind: 'point', position: 0, value: r2(1.0 * p.trib), notes: 'glass balustrade 1.0 kN/m' },
          ];
          if (p.third === 0) extra.push({ case: 'L', kind: 'moment', position: 0, value: r2(0.74 * p.trib * 1.1), notes: 'balustrade line load 0.74 kN/m at 1.1 m height' });
          drafts.push({
            mark: `${level}-B${pad(++b)}`, level, grid: p.grid, category: 'floor', material: 'steel', sections: W_METRIC,
            supports: 'pinned', spans: [BAY_Y], leftOverhang: 1.8, E: 200,
            uniform: { D: beamD(p.trib), L: beamL(p.trib) }, extra, reviewer,
            notes: 'balcony beam: overhang south of grid 1 (x = 0 at the balcony edge)',
          });
          continue;
        }
        const extra: DraftLoad[] = [];
        if (level === 'L1' && p.third === 1 && yi === 1 && rng.chance(0.5)) {
          extra.push({ case: 'D', kind: 'udl', from: 0, to: 3.6, value: 2.4, notes: 'blockwork partition to the back-of-house store' });
        }
        if (level === 'L2' && p.third === 2 && yi === 2) {
          extra.push({ case: 'L', kind: 'udl', from: 2.0, to: 5.2, value: r2(2.6 * SPACING), notes: 'compact archive zone 5.0 kPa less the office live load' });
        }
        // Two office beams frame into the stair core wall with a moment connection.
        const core = level === 'L2' && yi === 1 && p.xi === 2 && p.third > 0;
        drafts.push({
          mark: `${level}-B${pad(++b)}`, level, grid: p.grid, category: 'floor', material: 'steel', sections: W_METRIC,
          supports: core ? 'fixed-pinned' : 'pinned', spans: [BAY_Y], E: 200,
          uniform: { D: beamD(p.trib, p.edge ? 3.0 : 0), L: beamL(p.trib) }, extra, reviewer,
          ...(p.edge ? { notes: 'edge beam; cladding 3.0 kN/m in D' } : core ? { notes: 'moment connection to the stair core wall at grid 2' } : {}),
        });
      }
    }

    // Girders on the numbered lines, 9.0 m between columns, carrying the beams at 3.0 m and 6.0 m.
    for (const y of Y) {
      const edge = y === 1 || y === 4;
      const sides = edge ? 1 : 2;
      for (let xi = 0; xi < X.length - 1; xi++) {
        const PD = r2(sides * (D * SPACING + 0.5) * (BAY_Y / 2));
        const PL = r2(sides * L * SPACING * (BAY_Y / 2));
        const masonry = level === 'L2' && y === 1;
        const mark = `${level}-G${pad(++g)}`;
        const from = (n: number) => `reactions of the ${sides === 2 ? 'two beams' : 'beam'} at ${X[xi]}+${n.toFixed(1)}`;
        const extra: DraftLoad[] = [
          { case: 'D', kind: 'point', position: 3.0, value: PD, notes: from(3) },
          { case: 'D', kind: 'point', position: 6.0, value: PD, notes: from(6) },
          { case: 'L', kind: 'point', position: 3.0, value: PL, notes: from(3) },
          { case: 'L', kind: 'point', position: 6.0, value: PL, notes: from(6) },
        ];
        if (edge && level !== 'L1' && xi === 1) {
          extra.push({ case: 'D', kind: 'moment', position: 0.3, value: 3.5, notes: 'eccentric cladding bracket near the column' });
        }
        drafts.push({
          mark, level, grid: `${y}/${X[xi]}-${X[xi + 1]}`, category: masonry ? 'supports-masonry' : 'floor', material: 'steel', sections: W_METRIC,
          supports: 'pinned', spans: [BAY_X], E: 200,
          uniform: { D: r2(1.2 + (edge ? 3.0 : 0) + (masonry ? 7.5 : 0)) }, extra, reviewer, camber: true,
          notes: masonry ? 'carries the brick band over the L1 shopfront (7.5 kN/m in D)' : edge ? 'edge girder; cladding 3.0 kN/m in D' : undefined,
        });
      }
    }

    if (level === 'L1') {
      // Transfer beams under the offset columns of the flats above.
      const transfers = [['2/B-C', 3.6], ['2/C-D', 5.4], ['3/B-C', 4.5], ['3/C-D', 4.5]] as const;
      transfers.forEach(([grid, x], i) => {
        drafts.push({
          mark: `L1-T${pad(i + 1)}`, level, grid, category: 'concrete-damage-prone', material: 'concrete', sections: concreteMetric(),
          supports: i === 1 ? 'fixed-fixed' : i === 3 ? 'pinned-fixed' : 'pinned', spans: [BAY_X], E: 30,
          uniform: { D: 18, L: 0 },
          extra: [
            { case: 'D', kind: 'point', position: x, value: 420, notes: 'column above (L2 to roof), dead' },
            { case: 'L', kind: 'point', position: x, value: 140, notes: 'column above (L2 to roof), live' },
          ],
          reviewer, notes: 'transfer beam; E = 4700√40 MPa (ACI 318-19 19.2.2.1); I = 0.5 Ig (cracked, estimated)',
        });
      });
      // Shopfront wind posts of the double-height retail glazing, 6.0 m floor to L2 edge beam,
      // 3.0 m apart, 1.6 kPa components-and-cladding pressure.
      for (let i = 1; i <= 6; i++) {
        drafts.push({
          mark: `L1-WP${pad(i)}`, level, grid: `1/A+${(3.0 * i).toFixed(1)}`, category: 'supports-glass', material: 'steel', sections: HSS_METRIC,
          supports: 'pinned', spans: [6.0], E: 200, uniform: { W: 4.8 }, reviewer,
          notes: 'vertical wind post of the shopfront glazing; W acts horizontally',
        });
      }
    }
    if (['L3', 'L4', 'L5'].includes(level)) {
      // Corner balconies: the west one is fixed at its right end (the column), the east one at its left end.
      for (const [i, grid, supports] of [[1, 'A/1 west', 'cantilever-right'], [2, 'E/1 east', 'cantilever-left']] as const) {
        drafts.push({
          mark: `${level}-C${pad(i)}`, level, grid, category: 'floor', material: 'steel', sections: W_METRIC,
          supports, spans: [1.5], E: 200,
          uniform: { D: 5.5, L: 6.0 },
          extra: [{ case: 'D', kind: 'point', position: supports === 'cantilever-right' ? 0 : 1.5, value: 1.5, notes: 'balustrade at the free end' }],
          reviewer, notes: `corner balcony cantilever, fixed at the column (${supports === 'cantilever-right' ? 'right' : 'left'} end)`,
        });
      }
    }
  }

  // Roof: glulam girders on the numbered lines, I-joists between them at 600 mm.
  const roofReviewer = reviewerFor('Roof');
  let j = 0;
  for (let yi = 0; yi < 3; yi++) {
    for (let xi = 0; xi < 4; xi++) {
      const plant = xi === 2 && yi >= 1;
      const corridor = xi === 1 && yi === 1;
      const category = plant ? 'roof-no-ceiling' : corridor ? 'roof-nonplaster-ceiling' : 'roof-plaster-ceiling';
      const Dk = plant ? 1.85 : 0.85;
      for (let z = 1; z <= 7; z++) {
        const grid = `${X[xi]}-${X[xi + 1]}/${Y[yi]}-${Y[yi + 1]} zone ${z}`;
        const extra: DraftLoad[] = [];
        let notes = `typical of ${z === 1 ? 12 : 2} at 600 mm centres`;
        if (z === 2 && yi === 2) {
          extra.push({ case: 'S', kind: 'linear', from: 4.8, to: 7.2, value: 0, endValue: 1.5, notes: 'snow drift against the north parapet' });
          notes = 'at the north parapet, drift';
        }
        if (z === 3) {
          extra.push({ case: 'D', kind: 'point', position: 2.4, value: 0.9, notes: 'trimmed joists at the rooflight' });
          extra.push({ case: 'S', kind: 'point', position: 2.4, value: 1.3, notes: 'trimmed joists at the rooflight' });
          notes = 'double trimmer at the rooflight';
        }
        if (z === 4 && !plant) {
          extra.push({ case: 'D', kind: 'udl', from: 1.2, to: 6.0, value: 0.15, notes: 'photovoltaic panels and rails' });
          notes = 'under the photovoltaic array';
        }
        drafts.push({
          mark: `R-J${pad(++j)}`, level: 'Roof', grid, category, material: 'engineered-wood', sections: I_JOISTS_METRIC,
          supports: 'pinned', spans: [BAY_Y], E: 13.1,
          uniform: { D: r2(Dk * 0.6), Lr: r2(1.0 * 0.6), S: r2(1.2 * 0.6) }, extra, reviewer: roofReviewer, notes,
        });
      }
    }
  }
  let rg = 0;
  for (const y of Y) {
    const half = y === 1 || y === 4;
    for (let xi = 0; xi < 4; xi++) {
      const trib = half ? BAY_Y / 2 : BAY_Y;
      const plant = xi === 2 && (y === 2 || y === 3 || y === 4);
      drafts.push({
        mark: `R-G${pad(++rg)}`, level: 'Roof', grid: `${y}/${X[xi]}-${X[xi + 1]}`, category: plant ? 'roof-no-ceiling' : 'roof-plaster-ceiling',
        material: 'engineered-wood', sections: glulamMetric(), supports: 'pinned', spans: [BAY_X], E: 12.6,
        uniform: { D: r2((plant ? 1.85 : 0.85) * trib + 0.8), Lr: r2(1.0 * trib), S: r2(1.2 * trib) }, reviewer: roofReviewer,
        notes: 'glulam girder carrying the roof joists',
      });
    }
  }
  for (let i = 1; i <= 4; i++) {
    drafts.push({
      mark: `R-SJ${pad(i)}`, level: 'Roof', grid: `C-D/3 plant deck ${i}`, category: 'roof-no-ceiling', material: 'timber',
      sections: [75, 100].flatMap((b) => [150, 200, 225, 250].map((d) => ({ name: `C24 ${b}x${d}`, I: Math.round((b * d ** 3) / 12 / 1e5) / 10, depth: d }))).sort((a, b) => a.I - b.I),
      supports: 'pinned', spans: [3.6], E: 11, uniform: { D: 0.9, Lr: 1.2 }, reviewer: roofReviewer,
      notes: 'sawn joist of the plant access deck',
    });
  }

  return finish(drafts, SI_UNITS, rng, 0.09, new Set(['L1-T03', 'L1-WP04']));
}

/** The US customary workbook: a smaller annex block, ft / plf / kip / ksi / in^4. */
export function halvercoteYardUS(seed = 20250107): SampleSchedule {
  const rng = new SeededRandom(seed);
  const drafts: DraftMember[] = [];
  const X = ['F', 'G', 'H']; // 30 ft bays
  const Y = [5, 6, 7]; // 24 ft bays
  const areas: Record<string, { D: number; L: number }> = { L2: { D: 85, L: 50 }, L3: { D: 80, L: 40 } }; // psf
  const r0 = (v: number) => Math.round(v);
  for (const level of ['L2', 'L3']) {
    const { D, L } = areas[level];
    const reviewer = reviewerFor(level);
    let b = 0;
    let g = 0;
    for (let yi = 0; yi < 2; yi++) {
      for (let xi = 0; xi < X.length; xi++) {
        const grids = [`${X[xi]}/${Y[yi]}-${Y[yi + 1]}`];
        if (xi < X.length - 1) grids.push(`${X[xi]}+10/${Y[yi]}-${Y[yi + 1]}`, `${X[xi]}+20/${Y[yi]}-${Y[yi + 1]}`);
        for (const grid of grids) {
          const edge = grid.startsWith('F/') || grid.startsWith('H/');
          const trib = edge ? 5 : 10;
          const overhang = level === 'L3' && yi === 0 && grid.includes('G');
          drafts.push({
            mark: `${level}-B${pad(++b)}`, level, grid, category: 'floor', material: 'steel', sections: W_US, supports: 'pinned',
            spans: [24], ...(overhang ? { leftOverhang: 6 } : {}), E: 29000,
            uniform: { D: r0(D * trib + 30 + (edge ? 200 : 0)), L: r0(L * trib) },
            ...(overhang ? { extra: [{ case: 'L', kind: 'udl', from: 0, to: 6, value: r0(60 * trib - L * trib), notes: 'balcony 60 psf' } as DraftLoad] } : {}),
            reviewer, ...(overhang ? { notes: 'balcony beam, overhang south of grid 5' } : edge ? { notes: 'edge beam; cladding 200 plf in D' } : {}),
          });
        }
      }
    }
    for (const y of Y) {
      const sides = y === 5 || y === 7 ? 1 : 2;
      for (let xi = 0; xi < X.length - 1; xi++) {
        const PD = Math.round(sides * ((D * 10 + 30) * 12) / 100) / 10;
        const PL = Math.round(sides * (L * 10 * 12) / 100) / 10;
        const extra: DraftLoad[] = [10, 20].flatMap((x) => [
          { case: 'D', kind: 'point' as const, position: x, value: PD, notes: `beam reactions at ${X[xi]}+${x}` },
          { case: 'L', kind: 'point' as const, position: x, value: PL, notes: `beam reactions at ${X[xi]}+${x}` },
        ]);
        drafts.push({
          mark: `${level}-G${pad(++g)}`, level, grid: `${y}/${X[xi]}-${X[xi + 1]}`, category: 'floor', material: 'steel', sections: W_US,
          supports: 'pinned', spans: [30], E: 29000, uniform: { D: 80 }, extra, reviewer, camber: true,
        });
      }
    }
  }
  // Roof: I-joists continuous over the middle line, 24 ft + 24 ft, at 24 in centres.
  let j = 0;
  for (let xi = 0; xi < 2; xi++) {
    for (let z = 1; z <= 6; z++) {
      const extra: DraftLoad[] = z === 2 ? [{ case: 'S', kind: 'linear', from: 40, to: 48, value: 0, endValue: 60, notes: 'drift at the parapet' }] : [];
      drafts.push({
        mark: `R-J${pad(++j)}`, level: 'Roof', grid: `${X[xi]}-${X[xi + 1]}/5-7 zone ${z}`, category: z === 5 ? 'roof-no-ceiling' : 'roof-plaster-ceiling',
        material: 'engineered-wood', sections: I_JOISTS_US, supports: 'pinned', spans: z === 6 ? [24] : [24, 24], E: 1900,
        uniform: { D: 30, Lr: 40, S: 50 }, extra, reviewer: reviewerFor('Roof'), notes: z === 6 ? 'single span at the stair opening' : 'continuous over grid 6',
      });
    }
  }
  return finish(drafts, US_UNITS, rng, 0.1, new Set());
}
