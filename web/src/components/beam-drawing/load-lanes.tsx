import type { Load } from '@sagline/common/engine';
import type { UnitSystemId } from '@sagline/common/units';
import {
  assignRows,
  estimateTextWidth,
  placeLabel,
  px,
  xToPx,
  type DrawingFrame,
  type Extent,
  type LabelBox,
} from './drawing-geometry';
import { drawingFont, drawingInk } from './drawing-style';
import { loadSentence, loadValueText } from './drawing-text';

/**
 * Loads grouped by load case: one horizontal lane per case above the member,
 * each lane a projection of the member at the same x scale, tagged with the
 * case label at the left. Values sit above their glyphs; labels that would
 * touch are lifted to a further row.
 */

const LABEL_FONT = 11;
const LABEL_ROW = 14;
/** Height of the glyph area of a lane: point arrows use all of it. */
const GLYPH = 30;
/** Height of a distributed-load band (shorter than a point arrow, so both read). */
const BAND = 19;
const LANE_GAP = 8;
const ARROW_HEAD = 6;

export interface PlacedLoad {
  load: Load;
  index: number;
  label: string;
  box: LabelBox;
  row: number;
}

export interface LoadLane {
  case: string;
  /** 0 for the lane nearest the member; distributed loads of one case that overlap take further tiers. */
  tier: number;
  colour: string;
  rows: number;
  /** Offset of the lane's top from the top of the lane block, px. */
  top: number;
  height: number;
  loads: PlacedLoad[];
}

export interface LoadLanesLayout {
  lanes: LoadLane[];
  /** Height of the whole block including the gap to the member, px. */
  height: number;
}

/** Anchor x (m) of a load's value label. */
function labelAnchor(load: Load): number {
  return load.kind === 'point' || load.kind === 'moment' ? load.x : (load.x1 + load.x2) / 2;
}

/**
 * Tier of every load of one case: distributed loads that overlap along the
 * member go to separate tiers (so a partial load never hides under a full
 * one); point loads and moments stay in tier 0.
 */
function tiersOf(entries: ReadonlyArray<{ load: Load }>): number[] {
  const spread = entries
    .map((e, i) => ({ e, i }))
    .filter(({ e }) => e.load.kind === 'udl' || e.load.kind === 'linear')
    .sort((a, b) => extentOf(a.e.load).left - extentOf(b.e.load).left);
  const rows = assignRows(spread.map(({ e }) => extentOf(e.load)), 0);
  const tiers = entries.map(() => 0);
  spread.forEach(({ i }, k) => (tiers[i] = rows[k]));
  return tiers;
}

function extentOf(load: Load): Extent {
  return load.kind === 'udl' || load.kind === 'linear' ? { left: load.x1, right: load.x2 } : { left: load.x, right: load.x };
}

export function layoutLoadLanes(
  loads: readonly Load[],
  colours: ReadonlyMap<string, string>,
  length: number,
  frame: DrawingFrame,
  system: UnitSystemId,
): LoadLanesLayout {
  const order: string[] = [];
  for (const l of loads) if (!order.includes(l.case)) order.push(l.case);
  const lanes: LoadLane[] = [];
  let top = 0;
  for (const c of order) {
    const ofCase = loads.map((load, index) => ({ load, index })).filter((e) => e.load.case === c);
    const tiers = tiersOf(ofCase);
    const tierCount = Math.max(...tiers) + 1;
    for (let tier = tierCount - 1; tier >= 0; tier--) {
      const entries = ofCase
        .filter((_, k) => tiers[k] === tier)
        .map((e) => {
          const label = loadValueText(e.load, system);
          const width = estimateTextWidth(label, LABEL_FONT);
          const box = placeLabel(xToPx(labelAnchor(e.load), length, frame), width, 4, frame.width - 4);
          return { ...e, label, box };
        })
        .sort((a, b) => a.box.left - b.box.left);
      const rows = assignRows(entries.map((e) => e.box), 8);
      const placed = entries.map((e, i) => ({ ...e, row: rows[i] }));
      const rowCount = Math.max(1, ...rows.map((r) => r + 1));
      const height = rowCount * LABEL_ROW + GLYPH;
      lanes.push({ case: c, tier, colour: colours.get(c) ?? drawingInk.muted, rows: rowCount, top, height, loads: placed });
      top += height + LANE_GAP;
    }
  }
  return { lanes, height: lanes.length ? top : 0 };
}

function arrowHead(x: number, tipY: number, pointsDown: boolean, colour: string, size = ARROW_HEAD) {
  const back = pointsDown ? tipY - size : tipY + size;
  return <path d={`M${px(x)} ${px(tipY)} L${px(x - size * 0.55)} ${px(back)} L${px(x + size * 0.55)} ${px(back)} Z`} fill={colour} />;
}

/** A vertical arrow from y1 to y2, head at y2. */
function arrow(x: number, y1: number, y2: number, colour: string, width: number, head = ARROW_HEAD) {
  const down = y2 > y1;
  const shaftEnd = down ? y2 - head + 1 : y2 + head - 1;
  return (
    <g>
      <line x1={px(x)} y1={px(y1)} x2={px(x)} y2={px(shaftEnd)} stroke={colour} strokeWidth={width} />
      {arrowHead(x, y2, down, colour, head)}
    </g>
  );
}

/** Evenly spaced arrow positions across [a, b] px, ends included, about every 22 px. */
function arrowStations(a: number, b: number): number[] {
  const n = Math.max(2, Math.round((b - a) / 22) + 1);
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}

interface GlyphProps {
  placed: PlacedLoad;
  colour: string;
  length: number;
  frame: DrawingFrame;
  /** The lane bottom (the member's projection), px. */
  bottom: number;
  /** Bottom of the label row this load's label sits in, px. */
  labelBottom: number;
}

function LoadGlyph({ placed, colour, length, frame, bottom, labelBottom }: GlyphProps) {
  const { load } = placed;
  const X = (x: number) => xToPx(x, length, frame);
  const bandTop = bottom - BAND;
  const leader = (x: number, toY: number) =>
    placed.row > 0 ? <line x1={px(x)} y1={px(labelBottom)} x2={px(x)} y2={px(toY)} stroke={colour} strokeWidth={0.8} strokeDasharray="2 2" /> : null;

  switch (load.kind) {
    case 'point': {
      const x = X(load.x);
      // Downward (the usual case): head on the member. Upward: tail on the member.
      return load.P >= 0 ? arrow(x, labelBottom, bottom, colour, 2.4, 8) : arrow(x, bottom, labelBottom + 1, colour, 2.4, 8);
    }
    case 'udl': {
      const a = X(load.x1);
      const b = X(load.x2);
      const down = load.w >= 0;
      return (
        <g>
          {leader((a + b) / 2, bandTop)}
          <rect x={px(a)} y={px(bandTop)} width={px(Math.max(0.5, b - a))} height={px(BAND)} fill={colour} fillOpacity={0.1} />
          <line x1={px(a)} y1={px(bandTop)} x2={px(b)} y2={px(bandTop)} stroke={colour} strokeWidth={1.4} />
          {arrowStations(a, b).map((x, i) => (
            <g key={i}>{down ? arrow(x, bandTop, bottom, colour, 1, 5) : arrow(x, bottom, bandTop + 1, colour, 1, 5)}</g>
          ))}
        </g>
      );
    }
    case 'linear': {
      const a = X(load.x1);
      const b = X(load.x2);
      const peak = Math.max(Math.abs(load.w1), Math.abs(load.w2));
      const h = (w: number) => (peak > 0 ? (BAND * Math.abs(w)) / peak : 0);
      const wAt = (x: number) => (b > a ? load.w1 + ((load.w2 - load.w1) * (x - a)) / (b - a) : load.w1);
      const outline: Array<[number, number]> = [
        [a, bottom],
        [a, bottom - h(load.w1)],
      ];
      if (load.w1 * load.w2 < 0) {
        // The load changes sense inside: its magnitude touches zero here.
        outline.push([a + ((b - a) * Math.abs(load.w1)) / (Math.abs(load.w1) + Math.abs(load.w2)), bottom]);
      }
      outline.push([b, bottom - h(load.w2)], [b, bottom]);
      const d = outline.map(([x, y], i) => `${i ? 'L' : 'M'}${px(x)} ${px(y)}`).join(' ') + ' Z';
      const top = outline.slice(1, -1);
      return (
        <g>
          {leader((a + b) / 2, bottom - h(wAt((a + b) / 2)) - 1)}
          <path d={d} fill={colour} fillOpacity={0.1} />
          <path d={top.map(([x, y], i) => `${i ? 'L' : 'M'}${px(x)} ${px(y)}`).join(' ')} fill="none" stroke={colour} strokeWidth={1.4} />
          {arrowStations(a, b).map((x, i) => {
            const w = wAt(x);
            const hh = h(w);
            if (hh < 6) return null;
            return <g key={i}>{w >= 0 ? arrow(x, bottom - hh, bottom, colour, 1, 5) : arrow(x, bottom, bottom - hh + 1, colour, 1, 5)}</g>;
          })}
        </g>
      );
    }
    case 'moment': {
      const cx = X(load.x);
      const r = 10;
      const cy = bottom - r - 3;
      const ccw = load.M >= 0;
      // Math angles, screen counter-clockwise positive; point(θ) flips y for the screen.
      const start = ccw ? -40 : 220;
      const end = ccw ? 220 : -40;
      const pt = (deg: number): [number, number] => {
        const t = (deg * Math.PI) / 180;
        return [cx + r * Math.cos(t), cy - r * Math.sin(t)];
      };
      const steps = 24;
      const arc: Array<[number, number]> = [];
      for (let i = 0; i <= steps; i++) arc.push(pt(start + ((end - start) * i) / steps));
      const t = (end * Math.PI) / 180;
      const dir = ccw ? 1 : -1;
      // Tangent of the travel direction at the end of the arc, in screen coordinates.
      const tx = -Math.sin(t) * dir;
      const ty = -Math.cos(t) * dir;
      const [ex, ey] = arc[arc.length - 1];
      const s = 6;
      const head = `M${px(ex + tx * s * 0.6)} ${px(ey + ty * s * 0.6)} L${px(ex - tx * s * 0.5 - ty * s * 0.5)} ${px(ey - ty * s * 0.5 + tx * s * 0.5)} L${px(
        ex - tx * s * 0.5 + ty * s * 0.5,
      )} ${px(ey - ty * s * 0.5 - tx * s * 0.5)} Z`;
      return (
        <g>
          {leader(cx, cy - r - 1)}
          <path d={arc.map(([x, y], i) => `${i ? 'L' : 'M'}${px(x)} ${px(y)}`).join(' ')} fill="none" stroke={colour} strokeWidth={1.6} />
          <path d={head} fill={colour} />
          <circle cx={px(cx)} cy={px(cy)} r={1.8} fill={colour} />
        </g>
      );
    }
  }
}

interface LoadLanesProps {
  layout: LoadLanesLayout;
  length: number;
  frame: DrawingFrame;
  system: UnitSystemId;
  /** Screen y of the top of the block, px. */
  y: number;
}

export function LoadLanes({ layout, length, frame, system, y }: LoadLanesProps) {
  const x0 = xToPx(0, length, frame);
  const xL = xToPx(length, length, frame);
  return (
    <g data-testid="load-lanes">
      {layout.lanes.map((lane) => {
        const top = y + lane.top;
        const glyphTop = top + lane.rows * LABEL_ROW;
        const bottom = glyphTop + GLYPH;
        const tagWidth = Math.max(22, estimateTextWidth(lane.case, 11) + 12);
        return (
          <g key={`${lane.case}-${lane.tier}`} data-testid="load-lane" data-case={lane.case} data-tier={lane.tier}>
            <title>{`Load case ${lane.case}`}</title>
            <rect x={6} y={px(bottom - 19)} width={px(tagWidth)} height={18} rx={3} fill={lane.colour} />
            <text x={px(6 + tagWidth / 2)} y={px(bottom - 6)} fontSize={11} fontWeight={600} fill="#ffffff" textAnchor="middle">
              {lane.case}
            </text>
            <line x1={px(x0)} y1={px(bottom + 0.5)} x2={px(xL)} y2={px(bottom + 0.5)} stroke={drawingInk.lane} strokeWidth={1} />
            {lane.loads.map((placed) => (
              <g key={placed.index} data-testid="load" data-case={lane.case} data-kind={placed.load.kind} data-load-index={placed.index}>
                <title>{loadSentence(placed.load, system)}</title>
                <LoadGlyph
                  placed={placed}
                  colour={lane.colour}
                  length={length}
                  frame={frame}
                  bottom={bottom}
                  labelBottom={glyphTop - placed.row * LABEL_ROW}
                />
              </g>
            ))}
            {/* Labels above every glyph of the lane, on a pale ground: an arrow from a higher row runs under them. */}
            {lane.loads.map((placed) => {
              const labelBottom = glyphTop - placed.row * LABEL_ROW;
              return (
                <g key={`label-${placed.index}`}>
                  <rect
                    x={px(placed.box.left - 2)}
                    y={px(labelBottom - 13)}
                    width={px(placed.box.right - placed.box.left + 4)}
                    height={12}
                    rx={2}
                    fill={drawingInk.background}
                    fillOpacity={0.9}
                  />
                  <text
                    x={px(placed.box.x)}
                    textAnchor={placed.box.anchor}
                    y={px(labelBottom - 3)}
                    fontSize={LABEL_FONT}
                    fill={drawingInk.text}
                    fontFamily={drawingFont}
                    data-testid="load-label"
                    data-load-index={placed.index}
                  >
                    {placed.label}
                  </text>
                </g>
              );
            })}
          </g>
        );
      })}
    </g>
  );
}
