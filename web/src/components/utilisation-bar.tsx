import { Typography } from 'antd';
import { palette } from '@/app/theme';

/** The bar's full width stands for this utilisation; the limit (1.00) sits at two thirds of it. */
export const BAR_SCALE = 1.5;
/** From here on a passing member is shown as close to its limit. */
export const NEAR_LIMIT = 0.9;

export function utilisationColour(value: number): string {
  if (value > 1) return palette.fail;
  if (value >= NEAR_LIMIT) return palette.caution;
  return palette.pass;
}

/** "1.24", with words for a screen reader: over, near or within the limit. */
export function utilisationWords(value: number): string {
  const text = value.toFixed(2);
  if (value > 1) return `utilisation ${text}, over the limit`;
  if (value >= NEAR_LIMIT) return `utilisation ${text}, near the limit`;
  return `utilisation ${text}, within the limit`;
}

/**
 * A member's utilisation (1 = at the limit) as a bar with a tick at the
 * limit and the number beside it. Colour repeats what the number and the
 * tick say; it never carries the meaning alone. Values beyond 1.5 fill the
 * bar and keep their number. `bar={false}` shows the number alone (the
 * same number, colour and screen-reader words), for tables too narrow or
 * too secondary for a bar, such as the Imports screen's diff.
 */
export function UtilisationBar({ value, width = 96, bar = true }: { value: number | null; width?: number; bar?: boolean }) {
  if (value === null || !Number.isFinite(value)) {
    return (
      <Typography.Text type="secondary" aria-label="no check applies">
        —
      </Typography.Text>
    );
  }
  const words = utilisationWords(value);
  const number = (
    <span
      aria-hidden
      style={{
        fontVariantNumeric: 'tabular-nums',
        minWidth: 34,
        textAlign: 'right',
        color: value > 1 ? palette.fail : undefined,
        fontWeight: value > 1 ? 600 : undefined,
      }}
    >
      {value.toFixed(2)}
    </span>
  );
  if (!bar) {
    return (
      <span role="img" aria-label={words} title={words} style={{ whiteSpace: 'nowrap' }} data-testid="utilisation-number">
        {number}
      </span>
    );
  }
  const fill = Math.max(0, Math.min(value, BAR_SCALE)) / BAR_SCALE;
  const colour = utilisationColour(value);
  const limitAt = (1 / BAR_SCALE) * 100;
  return (
    <span
      role="img"
      aria-label={words}
      title={words}
      style={{ display: 'inline-flex', alignItems: 'center', gap: 8, whiteSpace: 'nowrap' }}
      data-testid="utilisation-bar"
    >
      <span
        aria-hidden
        style={{ position: 'relative', display: 'inline-block', width, height: 8, background: '#e6ebee', borderRadius: 2 }}
      >
        <span
          style={{
            position: 'absolute',
            left: 0,
            top: 0,
            bottom: 0,
            width: `${fill * 100}%`,
            background: colour,
            borderRadius: 2,
          }}
        />
        <span
          style={{ position: 'absolute', left: `${limitAt}%`, top: -3, bottom: -3, width: 1, background: palette.ink }}
        />
      </span>
      {number}
    </span>
  );
}
