import type { CSSProperties } from 'react';
import type { Verdict } from '@sagline/common/api-types';
import { palette } from '@/app/theme';

/**
 * The look of antd's success / error / default tags in our palette (app/theme.ts),
 * drawn as a plain span: a Members page shows up to 500 of them at once, and
 * antd's Tag costs a styled component per instance.
 */
const base: CSSProperties = {
  display: 'inline-block',
  padding: '0 7px',
  fontSize: 12,
  lineHeight: '20px',
  borderRadius: 4,
  border: '1px solid',
  whiteSpace: 'nowrap',
};
const STYLES = {
  pass: { ...base, color: palette.pass, background: '#ebf2ed', borderColor: '#b5ccba' },
  fail: { ...base, color: palette.fail, background: '#f7ecec', borderColor: '#e1b7b6' },
  none: { ...base, color: 'rgba(29, 39, 48, 0.88)', background: '#fafafa', borderColor: '#d9d9d9' },
} as const;

/** Pass / fail as a tag; a member without any check says so rather than passing. */
export function VerdictTag({ verdict }: { verdict: Verdict | null }) {
  if (verdict === 'pass') return <span style={STYLES.pass}>Pass</span>;
  if (verdict === 'fail') return <span style={STYLES.fail}>Fail</span>;
  return <span style={STYLES.none}>No check</span>;
}
