import type { FlagsOverTimePoint } from '@sagline/common/api-types';
import { palette } from '@/app/theme';

/** Bottom to top in the stack: what is done sits low, what still waits on top. */
export const CHART_SERIES = [
  { key: 'closed', label: 'Closed', color: palette.pass },
  { key: 'waived', label: 'Waived', color: '#8a98a3' },
  { key: 'answered', label: 'Answered', color: palette.info },
  { key: 'open', label: 'Open', color: palette.caution },
] as const;

type SeriesKey = (typeof CHART_SERIES)[number]['key'];

const W = 960;
const H = 240;
const PAD = { left: 40, right: 12, top: 12, bottom: 28 };

/** A "nice" step for about `target` ticks up to `max` (1, 2, 5 × 10ⁿ). */
export function niceStep(max: number, target = 4): number {
  if (max <= target) return 1;
  const raw = max / target;
  const pow = 10 ** Math.floor(Math.log10(raw));
  const m = raw / pow;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * pow;
}

const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const dayLabel = (day: string) => shortDay.format(new Date(`${day}T00:00:00Z`));

/** What the chart says in words (its accessible name, and the caption under it). */
export function chartSummary(points: FlagsOverTimePoint[]): string {
  const last = points[points.length - 1];
  if (!last) return 'No flags yet.';
  return `On ${dayLabel(last.day)}: ${last.open} open, ${last.answered} answered, ${last.closed} closed, ${last.waived} waived.`;
}

/**
 * Flags in each status at the end of each day, stacked: the height of the
 * stack is every flag raised so far, and closure shows as the green band
 * growing under the open one. Drawn to scale from the server's daily counts;
 * no chart library, so it prints and renders offline the same way.
 */
/**
 * The days worth drawing: leading days before the first flag are left out
 * (a long flat line says nothing), keeping at least `minDays`.
 */
export function visibleDays(points: FlagsOverTimePoint[], minDays = 14): FlagsOverTimePoint[] {
  const first = points.findIndex((p) => p.open + p.answered + p.closed + p.waived + p.raised > 0);
  const start = first < 0 ? Math.max(0, points.length - minDays) : Math.max(0, Math.min(first - 1, points.length - minDays));
  return points.slice(start);
}

export function FlagsChart({ points: all, compact = false }: { points: FlagsOverTimePoint[]; compact?: boolean }) {
  const points = visibleDays(all);
  const height = compact ? 200 : H;
  const plotW = W - PAD.left - PAD.right;
  const plotH = height - PAD.top - PAD.bottom;
  const totals = points.map((p) => p.open + p.answered + p.closed + p.waived);
  const max = Math.max(1, ...totals);
  const step = niceStep(max);
  const top = Math.ceil(max / step) * step;
  const n = points.length;
  const x = (i: number) => PAD.left + (n <= 1 ? plotW / 2 : (i * plotW) / (n - 1));
  const y = (v: number) => PAD.top + plotH - (v / top) * plotH;

  // Cumulative stacks, bottom first.
  const stacks: Record<SeriesKey, { lo: number[]; hi: number[] }> = {} as never;
  const base = points.map(() => 0);
  for (const s of CHART_SERIES) {
    const lo = [...base];
    points.forEach((p, i) => (base[i] += p[s.key]));
    stacks[s.key] = { lo, hi: [...base] };
  }
  const area = (key: SeriesKey) => {
    const { lo, hi } = stacks[key];
    if (n === 1) {
      const w = Math.min(40, plotW / 4);
      return `M${x(0) - w},${y(lo[0])} L${x(0) + w},${y(lo[0])} L${x(0) + w},${y(hi[0])} L${x(0) - w},${y(hi[0])} Z`;
    }
    const upper = hi.map((v, i) => `${i === 0 ? 'M' : 'L'}${x(i).toFixed(1)},${y(v).toFixed(1)}`).join(' ');
    const lower = lo.map((_, i) => `L${x(n - 1 - i).toFixed(1)},${y(lo[n - 1 - i]).toFixed(1)}`).join(' ');
    return `${upper} ${lower} Z`;
  };

  const ticks: number[] = [];
  for (let v = 0; v <= top; v += step) ticks.push(v);
  const labelEvery = Math.max(1, Math.ceil(n / (compact ? 6 : 8)));
  const summary = chartSummary(points);

  return (
    <figure className="flags-chart" style={{ margin: 0 }}>
      <svg viewBox={`0 0 ${W} ${height}`} width="100%" role="img" aria-label={`Flags over time. ${summary}`} style={{ display: 'block', maxWidth: W }}>
        {ticks.map((v) => (
          <g key={v}>
            <line x1={PAD.left} x2={W - PAD.right} y1={y(v)} y2={y(v)} stroke={palette.line} strokeWidth={1} />
            <text x={PAD.left - 6} y={y(v) + 4} textAnchor="end" fontSize={11} fill={palette.slateLight}>
              {v}
            </text>
          </g>
        ))}
        {n > 0 && CHART_SERIES.map((s) => <path key={s.key} d={area(s.key)} fill={s.color} fillOpacity={0.85} stroke={s.color} strokeWidth={1} data-series={s.key} />)}
        {points.map((p, i) =>
          (i % labelEvery === 0 && n - 1 - i >= labelEvery / 2) || i === n - 1 ? (
            <text key={p.day} x={x(i)} y={height - 8} textAnchor={i === n - 1 && n > 1 ? 'end' : i === 0 && n > 1 ? 'start' : 'middle'} fontSize={11} fill={palette.slateLight}>
              {dayLabel(p.day)}
            </text>
          ) : null,
        )}
        <line x1={PAD.left} x2={W - PAD.right} y1={y(0)} y2={y(0)} stroke={palette.slateLight} strokeWidth={1} />
      </svg>
      <figcaption style={{ display: 'flex', flexWrap: 'wrap', gap: 16, fontSize: 12, marginTop: 4 }}>
        {[...CHART_SERIES].reverse().map((s) => (
          <span key={s.key} style={{ display: 'inline-flex', alignItems: 'center', gap: 6 }}>
            <span aria-hidden style={{ width: 12, height: 12, background: s.color, display: 'inline-block', borderRadius: 2 }} />
            {s.label}
          </span>
        ))}
        <span style={{ color: palette.slateLight }}>{summary} Days in UTC; each day shows the flags at its end.</span>
      </figcaption>
    </figure>
  );
}
