import { EngineError } from './engine-error';
import type { Support } from './types';

/**
 * A straight member without internal hinges is held in place (its stiffness
 * matrix is positive definite) exactly when it has a fixed support, or pins
 * at two or more distinct positions. Anything less is a mechanism: it can
 * translate (no support) or rotate about its only pin position.
 * Throws EngineError MECHANISM with path `supports`.
 */
export function assertStable(supports: readonly Support[]): void {
  if (supports.some((s) => s.kind === 'fixed')) return;
  const positions = new Set(supports.map((s) => s.x + 0));
  if (positions.size >= 2) return;
  if (positions.size === 0) {
    throw new EngineError(
      'MECHANISM',
      'supports',
      'The member has no supports, so it can move freely (a mechanism). Add at least two pins, or one fixed support.',
    );
  }
  const x = [...positions][0];
  throw new EngineError(
    'MECHANISM',
    'supports',
    `Every support is a pin at x = ${x} m, so the member can rotate about that point (a mechanism). Add a support at another position, or make this one fixed.`,
  );
}

/** Supports closer than this fraction of the length cannot be told apart by the solve. */
export const MIN_SUPPORT_GAP = 1e-9;

/**
 * Two supports at different x closer than MIN_SUPPORT_GAP × length: the
 * span between them would be so short that its stiffness swamps the rest of
 * the solve. Equal x is fine (they merge). Throws EngineError OUT_OF_RANGE
 * with the path of the second support.
 */
export function assertSupportsApart(supports: readonly Support[], length: number): void {
  const gap = MIN_SUPPORT_GAP * length;
  for (let i = 0; i < supports.length; i++) {
    for (let j = 0; j < supports.length; j++) {
      const d = supports[i].x - supports[j].x;
      if (d > 0 && d < gap) {
        throw new EngineError(
          'OUT_OF_RANGE',
          `supports[${i}].x`,
          `supports[${i}] at x = ${supports[i].x} m is only ${d} m from supports[${j}] at x = ${supports[j].x} m: supports closer than ${MIN_SUPPORT_GAP} × the length cannot be told apart. Give them the same x (they merge; a fixed one wins) or move them apart.`,
        );
      }
    }
  }
}
