import { estimateTextWidth, px, type DrawingFrame } from './drawing-geometry';
import { drawingFont, drawingInk, type CurveStyle } from './drawing-style';

/** Which line is which combination: a line sample (colour and dash) and the name with its factors. */

const FONT = 11;
const ROW = 18;
const SWATCH = 28;

export interface LegendEntry {
  combination: string;
  text: string;
  style: CurveStyle;
}

export interface LegendLayout {
  items: Array<LegendEntry & { x: number; row: number }>;
  height: number;
}

export function layoutLegend(entries: readonly LegendEntry[], frame: DrawingFrame): LegendLayout {
  const items: LegendLayout['items'] = [];
  let x = frame.marginLeft;
  let row = 0;
  for (const e of entries) {
    const w = SWATCH + 6 + estimateTextWidth(e.text, FONT) + 18;
    if (x + w > frame.width - 4 && x > frame.marginLeft) {
      row++;
      x = frame.marginLeft;
    }
    items.push({ ...e, x, row });
    x += w;
  }
  return { items, height: items.length ? (row + 1) * ROW : 0 };
}

export function CurveLegend({ layout, y }: { layout: LegendLayout; y: number }) {
  return (
    <g data-testid="curve-legend">
      {layout.items.map((item) => {
        const cy = y + item.row * ROW + 9;
        return (
          <g key={item.combination} data-testid="legend-item" data-combination={item.combination}>
            <line
              x1={px(item.x)}
              y1={px(cy)}
              x2={px(item.x + SWATCH)}
              y2={px(cy)}
              stroke={item.style.colour}
              strokeWidth={2.5}
              strokeDasharray={item.style.dash}
            />
            <text x={px(item.x + SWATCH + 6)} y={px(cy + 4)} fontSize={FONT} fill={drawingInk.text} fontFamily={drawingFont}>
              {item.text}
            </text>
          </g>
        );
      })}
    </g>
  );
}
