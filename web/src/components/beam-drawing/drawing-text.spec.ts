import { combinationFormula, deflectionText, loadValueText } from './drawing-text';

describe('words of the drawing', () => {
  it('writes a deflection as a magnitude and a direction, never with a sign', () => {
    // calc-contract.md: deflection is positive up.
    expect(deflectionText(-0.0124, 'SI')).toBe('12.4 mm down');
    expect(deflectionText(0.0031, 'SI')).toBe('3.1 mm up');
    expect(deflectionText(-0.0124, 'US')).toBe('0.49 in down'); // 12.4 mm / 25.4 mm per in
    // A value that rounds to zero points nowhere.
    expect(deflectionText(-0.00001, 'SI')).toBe('0.0 mm');
    expect(deflectionText(0, 'SI')).toBe('0 mm');
  });

  it('says "up" for an upward load instead of printing a negative value', () => {
    expect(loadValueText({ case: 'W', kind: 'point', x: 1, P: -2000 }, 'SI')).toBe('2.00 kN up');
    expect(loadValueText({ case: 'W', kind: 'udl', x1: 0, x2: 1, w: -1500 }, 'SI')).toBe('1.50 kN/m up');
    expect(loadValueText({ case: 'D', kind: 'linear', x1: 0, x2: 1, w1: 1000, w2: -500 }, 'SI')).toBe('1.00 kN/m → 0.50 kN/m up');
    expect(loadValueText({ case: 'W', kind: 'moment', x: 1, M: -2500 }, 'SI')).toBe('2.50 kN·m CW');
  });

  it('spells a combination out from its factors', () => {
    expect(combinationFormula({ D: 1, L: 0.5, S: 0 })).toBe('1 D + 0.5 L');
    expect(combinationFormula({ D: 1, W: -0.6 })).toBe('1 D − 0.6 W');
  });
});
