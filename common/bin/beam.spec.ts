/**
 * The `beam` command line as a user runs it: a child process reading JSON on
 * standard input (calc-contract.md, "Command line").
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

function run(stdin: string): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), ['common/bin/beam.ts'], { cwd: ROOT, input: stdin, encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('npm run -s beam', () => {
  it('prints one BeamReport for a good member and exits 0', () => {
    const member = readFileSync(path.join(ROOT, 'samples/beam/simple-span-floor-beam.json'), 'utf8');
    const r = run(member);
    expect(r.status).toBe(0);
    const report = JSON.parse(r.stdout);
    expect(report.segments).toEqual([{ from: 0, to: 7.5, kind: 'span' }]);
    const live = report.checks.find((c: { name: string }) => c.name === 'L/360 live');
    expect(live.segments[0]).toMatchObject({ kind: 'span', effectiveLength: 7.5, limitRatio: 360, pass: false });
    expect(live.segments[0].spanRatio).toBeCloseTo(341.79, 2);
  }, 60_000);

  it('answers malformed JSON with exit 2 and only the error object', () => {
    const r = run('{"length": 6, "E": ');
    expect(r.status).toBe(2);
    const body = JSON.parse(r.stdout);
    expect(Object.keys(body)).toEqual(['error']);
    expect(body.error).toMatchObject({ code: 'MALFORMED_JSON', path: '' });
    expect(body.error.message).toMatch(/not valid JSON/);
    expect(r.stdout.trim().split('\n')).toHaveLength(1);
  }, 60_000);

  it('answers a load outside the member with exit 2, its code and its path', () => {
    const member = {
      length: 6,
      E: 200e9,
      I: 1e-4,
      supports: [{ x: 0, kind: 'pin' }, { x: 6, kind: 'pin' }],
      loads: [{ case: 'D', kind: 'point', x: 6.5, P: 1000 }],
    };
    const r = run(JSON.stringify(member));
    expect(r.status).toBe(2);
    expect(JSON.parse(r.stdout)).toEqual({
      error: { code: 'OUT_OF_RANGE', path: 'loads[0].x', message: 'loads[0].x = 6.5 m lies outside the member, which runs from x = 0 to x = 6 m. Measure x from the left end.' },
    });
  }, 60_000);
});
