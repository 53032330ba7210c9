import type { Segment, Support } from '@sagline/common/engine';
import type { UnitSystemId } from '@sagline/common/units';
import { assignRows, estimateTextWidth, placeLabel, px, xToPx, type DrawingFrame, type LabelBox } from './drawing-geometry';
import { drawingFont, drawingInk } from './drawing-style';
import { lengthText, segmentWord, supportWord } from './drawing-text';

/**
 * The member itself: the bar, its supports (pin: a triangle on a ground
 * line; fixed: a hatched wall), and a chain of dimension lines giving every
 * span and overhang in the project's units, plus the overall length.
 */

export const MEMBER_THICKNESS = 6;
/** From the member axis to the lowest point of a support glyph, px. */
const SUPPORT_DEPTH = 24;
const DIM_FONT = 11;
const DIM_ROW = 15;

export interface DimensionLabel {
  from: number;
  to: number;
  text: string;
  box: LabelBox;
  /** 0: above the dimension line; 1, 2 …: below it, one row each. */
  row: number;
  kind: Segment['kind'] | 'overall';
}

export interface ElevationLayout {
  chain: DimensionLabel[];
  overall: DimensionLabel | null;
  /** From the member axis to the chain dimension line, px. */
  chainY: number;
  overallY: number;
  /** From the member axis to the bottom of the block, px. */
  below: number;
  /** Above the member axis the block needs (a fixed wall rises above it), px. */
  above: number;
}

/** The trade's cantilever: one fixed support and nothing else holding the member. */
export function isCantilever(supports: readonly Support[]): boolean {
  const xs = new Set(supports.map((s) => s.x));
  return xs.size === 1 && supports.some((s) => s.kind === 'fixed');
}

export function layoutElevation(
  segments: readonly Segment[],
  supports: readonly Support[],
  length: number,
  frame: DrawingFrame,
  system: UnitSystemId,
): ElevationLayout {
  const cantilever = isCantilever(supports);
  const label = (from: number, to: number, kind: DimensionLabel['kind']): Omit<DimensionLabel, 'row'> => {
    const len = lengthText(to - from, system);
    const text = kind === 'span' ? len : kind === 'overall' ? `${len} overall` : `${len} ${segmentWord({ from, to, kind }, cantilever)}`;
    const centre = (xToPx(from, length, frame) + xToPx(to, length, frame)) / 2;
    return { from, to, kind, text, box: placeLabel(centre, estimateTextWidth(text, DIM_FONT), 4, frame.width - 4) };
  };
  const items = segments.map((s) => label(s.from, s.to, s.kind));
  const rows = assignRows(items.map((i) => i.box), 8);
  const chain = items.map((i, k) => ({ ...i, row: rows[k] }));
  const belowRows = Math.max(0, ...rows);
  const chainY = SUPPORT_DEPTH + 10 + DIM_ROW;
  const showOverall = segments.length > 1;
  const overallY = chainY + belowRows * DIM_ROW + (showOverall ? DIM_ROW + 8 : 0);
  const overall = showOverall ? { ...label(0, length, 'overall'), row: 0 } : null;
  return { chain, overall, chainY, overallY, below: overallY + 6, above: 24 };
}

function PinSupport({ x, y }: { x: number; y: number }) {
  const top = y + MEMBER_THICKNESS / 2;
  const h = 15;
  const half = 9;
  const ground = top + h + 2;
  return (
    <g>
      <polygon
        points={`${px(x)},${px(top)} ${px(x - half)},${px(top + h)} ${px(x + half)},${px(top + h)}`}
        fill="#ffffff"
        stroke={drawingInk.support}
        strokeWidth={1.5}
        strokeLinejoin="round"
      />
      <line x1={px(x - 13)} y1={px(ground)} x2={px(x + 13)} y2={px(ground)} stroke={drawingInk.support} strokeWidth={1.5} />
      {[-12, -6, 0, 6].map((dx) => (
        <line key={dx} x1={px(x + dx + 5)} y1={px(ground)} x2={px(x + dx)} y2={px(ground + 5)} stroke={drawingInk.support} strokeWidth={1} />
      ))}
    </g>
  );
}

/** A wall at an end; the hatching faces away from the member (`side` = -1 left, +1 right). */
function FixedWall({ x, y, side }: { x: number; y: number; side: -1 | 1 }) {
  const h = 22;
  const ticks: number[] = [];
  for (let t = -h; t < h; t += 6) ticks.push(t);
  return (
    <g>
      <line x1={px(x)} y1={px(y - h)} x2={px(x)} y2={px(y + h)} stroke={drawingInk.support} strokeWidth={2} />
      {ticks.map((t) => (
        <line key={t} x1={px(x)} y1={px(y + t + 6)} x2={px(x + side * 8)} y2={px(y + t)} stroke={drawingInk.support} strokeWidth={1} />
      ))}
    </g>
  );
}

/** A fixed support inside the member (rare): a hatched block under it. */
function FixedBlock({ x, y }: { x: number; y: number }) {
  const top = y + MEMBER_THICKNESS / 2;
  return (
    <g>
      <rect x={px(x - 10)} y={px(top)} width={20} height={16} fill="#ffffff" stroke={drawingInk.support} strokeWidth={1.5} />
      {[-10, -4, 2].map((dx) => (
        <line key={dx} x1={px(x + dx)} y1={px(top + 16)} x2={px(x + dx + 8)} y2={px(top)} stroke={drawingInk.support} strokeWidth={1} />
      ))}
    </g>
  );
}

function DimensionPiece({ label, y, length, frame }: { label: DimensionLabel; y: number; length: number; frame: DrawingFrame }) {
  const a = xToPx(label.from, length, frame);
  const b = xToPx(label.to, length, frame);
  const tick = (x: number) => <line x1={px(x - 4)} y1={px(y + 4)} x2={px(x + 4)} y2={px(y - 4)} stroke={drawingInk.dimension} strokeWidth={1.2} />;
  const textY = label.row === 0 ? y - 4 : y + 11 + (label.row - 1) * DIM_ROW;
  return (
    <g data-testid="dimension" data-kind={label.kind} data-from={label.from} data-to={label.to}>
      <line x1={px(a)} y1={px(y)} x2={px(b)} y2={px(y)} stroke={drawingInk.dimension} strokeWidth={1} />
      {tick(a)}
      {tick(b)}
      <rect
        x={px(label.box.left - 2)}
        y={px(textY - 10)}
        width={px(label.box.right - label.box.left + 4)}
        height={13}
        rx={2}
        fill={drawingInk.background}
        fillOpacity={0.9}
      />
      <text
        x={px(label.box.x)}
        textAnchor={label.box.anchor}
        y={px(textY)}
        fontSize={DIM_FONT}
        fill={drawingInk.text}
        fontFamily={drawingFont}
        data-testid="dimension-label"
      >
        {label.text}
      </text>
    </g>
  );
}

interface ElevationProps {
  layout: ElevationLayout;
  supports: readonly Support[];
  length: number;
  frame: DrawingFrame;
  /** Screen y of the member axis, px. */
  axisY: number;
}

export function MemberElevation({ layout, supports, length, frame, axisY }: ElevationProps) {
  const X = (x: number) => xToPx(x, length, frame);
  const x0 = X(0);
  const xL = X(length);
  const stations = new Set<number>([0, length, ...supports.map((s) => s.x)]);
  // Ends reach the overall line; inner supports stop at the chain, clear of the overall label.
  const extBottom = (x: number) => axisY + (layout.overall && (x === 0 || x === length) ? layout.overallY : layout.chainY) + 5;
  return (
    <g>
      <g data-testid="dimensions">
        {[...stations].map((x) => (
          <line
            key={x}
            x1={px(X(x))}
            y1={px(axisY + SUPPORT_DEPTH + 4)}
            x2={px(X(x))}
            y2={px(extBottom(x))}
            stroke={drawingInk.axis}
            strokeWidth={0.8}
          />
        ))}
        {layout.chain.map((l, i) => (
          <DimensionPiece key={i} label={l} y={axisY + layout.chainY} length={length} frame={frame} />
        ))}
        {layout.overall ? <DimensionPiece label={layout.overall} y={axisY + layout.overallY} length={length} frame={frame} /> : null}
      </g>
      <rect
        data-testid="member"
        x={px(x0)}
        y={px(axisY - MEMBER_THICKNESS / 2)}
        width={px(xL - x0)}
        height={MEMBER_THICKNESS}
        rx={1.5}
        fill={drawingInk.member}
      />
      {supports.map((s, i) => {
        const x = X(s.x);
        const atLeft = s.x <= 0;
        const atRight = s.x >= length;
        return (
          <g key={i} data-testid="support" data-kind={s.kind} data-x={s.x} data-x-px={px(x)}>
            <title>{`${supportWord(s.kind)} support`}</title>
            {s.kind === 'pin' ? (
              <PinSupport x={x} y={axisY} />
            ) : atLeft || atRight ? (
              <FixedWall x={x} y={axisY} side={atLeft ? -1 : 1} />
            ) : (
              <FixedBlock x={x} y={axisY} />
            )}
          </g>
        );
      })}
    </g>
  );
}
