import { render, screen } from '@testing-library/react';
import type { FlagsOverTimePoint } from '@sagline/common/api-types';
import { FlagsChart, niceStep, visibleDays } from './flags-chart';

const day = (d: number, c: Partial<FlagsOverTimePoint> = {}): FlagsOverTimePoint => ({
  day: `2026-11-${String(d).padStart(2, '0')}`, open: 0, answered: 0, closed: 0, waived: 0, raised: 0, ...c,
});

describe('FlagsChart', () => {
  it('stacks the statuses to scale: the top of the stack is every flag of the day', () => {
    const points = Array.from({ length: 14 }, (_, i) => day(i + 1, i < 7 ? { open: 4 } : { open: 1, answered: 1, closed: 2 }));
    const { container } = render(<FlagsChart points={points} />);
    expect(screen.getByRole('img', { name: 'Flags over time. On 14 Nov: 1 open, 1 answered, 2 closed, 0 waived.' })).toBeInTheDocument();
    // y axis 0..4 in steps of 1; the open band's top edge runs level (4 flags every day).
    expect([...container.querySelectorAll('svg text')].slice(0, 5).map((t) => t.textContent)).toEqual(['0', '1', '2', '3', '4']);
    const open = container.querySelector('path[data-series="open"]')!.getAttribute('d')!;
    const tops = open.split(' Z')[0].split(' ').slice(0, 14).map((p) => Number(p.slice(1).split(',')[1]));
    expect(new Set(tops).size).toBe(1);
    // Every band is drawn, in the legend order a reader expects.
    expect([...container.querySelectorAll('path[data-series]')].map((p) => p.getAttribute('data-series'))).toEqual(['closed', 'waived', 'answered', 'open']);
  });

  it('leaves out the flat days before the first flag, keeping two weeks', () => {
    const points = Array.from({ length: 60 }, (_, i) => day((i % 28) + 1, i >= 50 ? { open: 1, raised: i === 50 ? 1 : 0 } : {}));
    expect(visibleDays(points)).toHaveLength(14);
    const early = Array.from({ length: 60 }, (_, i) => day((i % 28) + 1, i >= 20 ? { open: 1 } : {}));
    expect(visibleDays(early)).toHaveLength(41);
    expect(visibleDays(Array.from({ length: 5 }, (_, i) => day(i + 1)))).toHaveLength(5);
  });

  it('picks readable steps for the axis', () => {
    expect([niceStep(3), niceStep(8), niceStep(37), niceStep(180), niceStep(2000)]).toEqual([1, 2, 10, 50, 500]);
  });
});
