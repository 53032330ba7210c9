import { formatCombination, parseCombination } from './combination-text';

describe('combinations as people write them', () => {
  it('reads factors and load cases, spaces and signs allowed', () => {
    expect(parseCombination('L')).toEqual({ value: { L: 1 } });
    expect(parseCombination('D + L')).toEqual({ value: { D: 1, L: 1 } });
    expect(parseCombination('0.5D+L')).toEqual({ value: { D: 0.5, L: 1 } });
    expect(parseCombination('0.42W')).toEqual({ value: { W: 0.42 } });
    expect(parseCombination('D - 0.6W')).toEqual({ value: { D: 1, W: -0.6 } });
    expect(parseCombination('2*D + Lr')).toEqual({ value: { D: 2, Lr: 1 } });
  });

  it('says what is wrong with anything else', () => {
    expect(parseCombination('  ')).toEqual({ error: 'Write the load cases with their factors, e.g. "L", "D+L" or "0.5D+L".' });
    expect(parseCombination('D+L/2')).toEqual({ error: '"L/2" is not a factor and a load case; write e.g. "0.5D" or "L".' });
    expect(parseCombination('D+L+D')).toEqual({ error: 'D appears twice; write each load case once.' });
  });

  it('writes them back as the checks table names them, so an edit round-trips', () => {
    for (const text of ['L', 'D+L', '0.5D+L', '0.42W', 'D-0.6W', '2D+Lr']) {
      const parsed = parseCombination(text);
      expect('value' in parsed && formatCombination(parsed.value)).toBe(text);
    }
  });
});
