/**
 * The command line over the engine (calc-contract.md, "Command line"):
 *   npm run -s beam < member.json
 * reads one BeamInput (SI units) as JSON on standard input and prints one
 * BeamReport as JSON on standard output, exit code 0. Bad input, malformed
 * JSON included: exit code 2 and {"error": {"code", "message", "path"}} on
 * standard output, nothing else. An unexpected failure: exit code 1, same shape, code INTERNAL.
 */
import { EngineError, analyzeBeam, parseBeamInput } from '../src/engine';

function readStdin(): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    process.stdin.on('data', (c: Buffer) => chunks.push(c));
    process.stdin.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    process.stdin.on('error', reject);
  });
}

function fail(exitCode: number, code: string, message: string, path = ''): void {
  process.stdout.write(`${JSON.stringify({ error: { code, message, path } })}\n`);
  process.exitCode = exitCode;
}

async function main(): Promise<void> {
  const text = await readStdin();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    const detail = e instanceof Error ? e.message : String(e);
    fail(2, 'MALFORMED_JSON', `Standard input is not valid JSON (${detail}). Pass one BeamInput object, e.g. npm run -s beam < samples/beam/simple-span-floor-beam.json.`);
    return;
  }
  try {
    const report = analyzeBeam(parseBeamInput(raw));
    process.stdout.write(`${JSON.stringify(report)}\n`);
  } catch (e) {
    if (e instanceof EngineError) fail(2, e.code, e.message, e.path);
    else fail(1, 'INTERNAL', `The engine failed unexpectedly: ${e instanceof Error ? e.message : String(e)}`);
  }
}

void main();
