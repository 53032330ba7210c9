import type { UnitSystemId } from '@sagline/common/units';
import type { LoadRowInput, MemberRowInput } from './template-workbook';

/**
 * The few members of the example download: one of each layout the format
 * supports (simple span, continuous spans, an overhang, a cantilever, a
 * roof joist, a girder with point loads on the Loads sheet), in the header
 * units of each unit system. Invented values, sized by rule of thumb to
 * pass; for illustration, not design.
 */
export function exampleSchedule(
  system: UnitSystemId,
  levels: { low: string; high: string },
  categories: { floor: string; roof: string },
): { members: MemberRowInput[]; loads: LoadRowInput[] } {
  const si = system === 'SI';
  const floor = (v: Record<string, string | number | null>, D: number, L: number): MemberRowInput => ({
    values: { level: levels.low, category: categories.floor, material: 'steel', supports: 'pinned', E: si ? 200 : 29000, ...v },
    loads: { D, L },
  });
  const members: MemberRowInput[] = si
    ? [
        floor({ mark: 'EX-B1', grid: 'B/1-2', section: 'W410x54', spans: 7.2, I: 186, depth: 403, notes: 'Simple span' }, 3.5, 6.0),
        floor({ mark: 'EX-B2', grid: 'C/1-4', section: 'W360x44', spans: '6.0+4.5+6.0', I: 122, depth: 352, notes: 'Three continuous spans' }, 2.0, 3.5),
        floor({ mark: 'EX-B3', grid: 'D/4-5', section: 'W410x67', spans: 6.0, rightOverhang: 1.8, I: 245, depth: 410, notes: 'Overhang to the right' }, 3.0, 4.0),
        floor({ mark: 'EX-C1', grid: 'E/5', section: 'W310x39', spans: 1.5, supports: 'cantilever-left', I: 84.9, depth: 310, notes: 'Balcony cantilever' }, 2.0, 4.0),
        floor({ mark: 'EX-G1', grid: '3/A-D', section: 'W610x101', spans: 9.0, I: 764, depth: 603, notes: 'Girder; point loads on the Loads sheet' }, 1.5, 0),
        {
          values: { mark: 'EX-J1', level: levels.high, grid: 'A-B/6', category: categories.roof, material: 'engineered-wood', section: 'I-joist 302', spans: 5.4, supports: 'pinned', E: 11, I: 60, depth: 302, notes: 'Roof joist' },
          loads: { D: 0.6, S: 1.2 },
        },
      ]
    : [
        floor({ mark: 'EX-B1', grid: 'B/1-2', section: 'W16x36', spans: 24, I: 448, depth: 15.9, notes: 'Simple span' }, 240, 400),
        floor({ mark: 'EX-B2', grid: 'C/1-4', section: 'W14x30', spans: '20+15+20', I: 291, depth: 13.8, notes: 'Three continuous spans' }, 150, 250),
        floor({ mark: 'EX-B3', grid: 'D/4-5', section: 'W16x45', spans: 20, rightOverhang: 6, I: 586, depth: 16.1, notes: 'Overhang to the right' }, 200, 280),
        floor({ mark: 'EX-C1', grid: 'E/5', section: 'W12x26', spans: 5, supports: 'cantilever-left', I: 204, depth: 12.2, notes: 'Balcony cantilever' }, 150, 280),
        floor({ mark: 'EX-G1', grid: '3/A-D', section: 'W24x68', spans: 30, I: 1830, depth: 23.7, notes: 'Girder; point loads on the Loads sheet' }, 100, 0),
        {
          values: { mark: 'EX-J1', level: levels.high, grid: 'A-B/6', category: categories.roof, material: 'engineered-wood', section: 'I-joist 11 7/8', spans: 18, supports: 'pinned', E: 1600, I: 150, depth: 11.875, notes: 'Roof joist' },
          loads: { D: 40, S: 80 },
        },
      ];
  const loads: LoadRowInput[] = si
    ? [
        { mark: 'EX-G1', case: 'D', kind: 'point', position: 3.0, value: 40, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'L', kind: 'point', position: 3.0, value: 45, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'D', kind: 'point', position: 6.0, value: 40, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'L', kind: 'point', position: 6.0, value: 45, notes: 'reaction of EX-B1' },
      ]
    : [
        { mark: 'EX-G1', case: 'D', kind: 'point', position: 10, value: 9, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'L', kind: 'point', position: 10, value: 10, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'D', kind: 'point', position: 20, value: 9, notes: 'reaction of EX-B1' },
        { mark: 'EX-G1', case: 'L', kind: 'point', position: 20, value: 10, notes: 'reaction of EX-B1' },
      ];
  return { members, loads };
}
