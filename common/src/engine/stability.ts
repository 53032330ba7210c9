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
