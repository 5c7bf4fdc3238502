// Property tests (issue 17): random and mutated worksheets never crash or
// hang the engine, and every problem comes back as an error with a place.
// The seed is fixed so that CI runs the same cases every time; fast-check
// prints the seed and the smallest failing sheet when a property fails.
// WAKESHEET_FUZZ_SEED and WAKESHEET_FUZZ_RUNS try other cases.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ERROR_CODES } from '../../server/diagnostics.js';
import { SheetPipeline, type SheetReport } from '../../server/pipeline/index.js';

const SEED = Number(process.env.WAKESHEET_FUZZ_SEED ?? 17017);
const RUNS = Number(process.env.WAKESHEET_FUZZ_RUNS ?? 1);
/** A short time budget: a case that would run long stops at it. */
const LIMITS = { maxSteps: 200_000, maxListLength: 20_000, timeoutMs: 400 };
/** Generous: the whole suite shares two cores, and a property's cases run one after another. */
const TIMEOUT = 120_000;

/** What every run must give, whatever the sheet: errors with places, finite numbers, html. */
function checkReport(text: string, r: SheetReport): void {
  const lines = text.split(/\r\n?|\n/).length;
  for (const e of r.errors) {
    expect(Object.keys(ERROR_CODES)).toContain(e.code);
    expect(Number.isInteger(e.line) && e.line >= 1 && e.line <= lines + 1, `line ${e.line} of ${lines}: ${e.message}`).toBe(true);
    expect(Number.isInteger(e.column) && e.column >= 1).toBe(true);
    expect(e.message.length).toBeGreaterThan(0);
  }
  // An internal fault is a bug of ours, never an answer to bad input.
  expect(r.errors.filter((e) => e.code === 'internal')).toEqual([]);
  const finite = (v: { si: number | null; fields?: Record<string, unknown>; items?: unknown[] }): void => {
    if (v.si !== null) expect(Number.isFinite(v.si)).toBe(true);
    for (const f of Object.values(v.fields ?? {})) finite(f as typeof v);
    for (const i of v.items ?? []) finite(i as typeof v);
  };
  for (const v of Object.values(r.values)) finite(v);
  for (const p of r.parts) expect(typeof p.html).toBe('string');
}

function runSheet(text: string, pipeline = new SheetPipeline({ limits: LIMITS })): SheetReport {
  const r = pipeline.run(text);
  checkReport(text, r);
  return r;
}

// Pieces of sheets: names that are JavaScript's own (to reach no object through a
// name), unicode, keywords; numbers huge and tiny; units good and bad.
const name = fc.constantFrom('U', 'rho_air', 'ρ', 'μ_2', 'Re', 'x1', 'y_plus', 'hasOwnProperty', '__proto__', 'constructor', 'toString', 'check', 'to', 'e', 'pi');
const number = fc.oneof(
  fc.constantFrom('0', '1', '2.5', '1e309', '1e-400', '5e-324', '1.7976931348623157e308', '1e308', '.5', '12345678901234567890', '0.000e5', '3e'),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => String(Math.abs(x))),
);
const unit = fc.constantFrom('', ' m', ' m/s', ' km/h', ' degC', ' %', ' Pa s', ' J/(kg K)', ' m^2/s', ' kg/m^3', ' bogus', ' m^-1', ' K');
const text = fc.string({ maxLength: 12, unit: 'binary' }).map((s) => s.replace(/["\n\r]/g, ''));
const call = fc.constantFrom('sqrt', 'abs', 'ln', 'max', 'min', 'air', 'water', 'linspace', 'reynolds', 'nofunction', 'valueOf');

const { expr } = fc.letrec<{ expr: string }>((tie) => ({
  expr: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.tuple(number, unit).map(([n, u]) => n + u),
    name,
    text.map((t) => `"${t}"`),
    fc.constantFrom('true', 'false', 'air(T: 15 degC).rho', 'linspace(0, 1, 50)', 'linspace(0, 1, 20000)', '[1, 2, 3] m/s', 'air(T: [10, 20] degC)'),
    fc.tuple(tie('expr'), fc.constantFrom(' + ', ' - ', ' * ', ' / ', '^', ' and ', ' or ', ' < ', ' == ', ' >= '), tie('expr')).map(([a, op, b]) => a + op + b),
    tie('expr').map((a) => `(${a})`),
    tie('expr').map((a) => `-${a}`),
    tie('expr').map((a) => `not ${a}`),
    fc.tuple(call, fc.array(tie('expr'), { maxLength: 3 })).map(([f, args]) => `${f}(${args.join(', ')})`),
    fc.array(tie('expr'), { maxLength: 4 }).map((items) => `[${items.join(', ')}]`),
    fc.tuple(tie('expr'), fc.constantFrom('.rho', '.nu', '.nothing', '.__proto__')).map(([a, f]) => a + f),
    fc.tuple(tie('expr'), fc.constantFrom(' to mm', ' to km/h', ' to degC', ' to Pa', ' to')).map(([a, u]) => a + u),
  ),
}));

/** Lines past the limits: deep nesting, long chains, long lines. */
const extreme = fc.oneof(
  fc.integer({ min: 1, max: 1600 }).map((k) => `d = ${'('.repeat(k)}1${')'.repeat(k)}`),
  fc.integer({ min: 1, max: 3000 }).map((k) => `n = ${'-'.repeat(k)}1`),
  fc.integer({ min: 1, max: 2500 }).map((k) => `s = ${Array(k).fill('1').join('+')}`),
  fc.integer({ min: 1, max: 400 }).map((k) => `f = ${Array(k).fill('2').join('/')}`),
  fc.integer({ min: 1, max: 400 }).map((k) => `p = ${Array(k).fill('1').join('^')}`),
  fc.integer({ min: 1, max: 3000 }).map((k) => `l = ${'['.repeat(k)}1${']'.repeat(k)}`),
  fc.integer({ min: 3990, max: 4010 }).map((k) => `w = "${'x'.repeat(k - 6)}"`),
);

const line = fc.oneof(
  { weight: 6, arbitrary: fc.tuple(name, expr, fc.option(text)).map(([n, e, c]) => `${n} = ${e}${c === null ? '' : ` # ${c}`}`) },
  { weight: 2, arbitrary: fc.tuple(expr, fc.option(text)).map(([e, l]) => `check ${e}${l === null ? '' : ` "${l}"`}`) },
  { weight: 1, arbitrary: expr },
  { weight: 1, arbitrary: fc.constantFrom('', '# a comment', '   ', '\t') },
  { weight: 1, arbitrary: fc.string({ maxLength: 30, unit: 'binary' }).map((s) => s.replace(/[\n\r]/g, ' ')) },
);

const prose = fc.oneof(
  fc.constantFrom('# A heading', 'Plain prose with `=U` and `=rho_air * 2`.', '> quoted `=1/0`', '- a list\n- with `=nothing`', '<script>alert(1)</script>', '| a | b |\n|---|---|\n| `=U` | 2 |', '$x^2$ and \\(y\\)'),
  fc.string({ maxLength: 40, unit: 'binary' }),
);

const sheet = fc
  .tuple(
    fc.option(fc.constantFrom('---\ntitle: Fuzz\nsigfigs: 3\n---\n', '---\ntitle: [unclosed\n---\n', '---\n' + '['.repeat(500) + '\n---\n', '---\nsigfigs: 99\n---\n')),
    fc.array(fc.tuple(prose, fc.array(line, { maxLength: 8 })), { minLength: 1, maxLength: 4 }),
  )
  .map(([front, sections]) => (front ?? '') + sections.map(([p, lines]) => `${p}\n\n\`\`\`basis\n${lines.join('\n')}\n\`\`\`\n`).join('\n'));

/** Edits of a real sheet: characters in, out, doubled, and fences and brackets broken. */
const mutation = fc.oneof(
  fc.tuple(fc.nat(), fc.string({ maxLength: 6, unit: 'binary' })).map(([at, s]) => (t: string) => t.slice(0, at % (t.length + 1)) + s + t.slice(at % (t.length + 1))),
  fc.tuple(fc.nat(), fc.integer({ min: 1, max: 40 })).map(([at, n]) => (t: string) => t.slice(0, at % (t.length + 1)) + t.slice((at % (t.length + 1)) + n)),
  fc.tuple(fc.nat(), fc.constantFrom('(', ')', '[', ']', '"', '```', '\n```basis\n', '^', '/', '1e309', '#', '\u0000', '\uFFFD', '\uD800', 'é', '∞')).map(([at, s]) => (t: string) => t.slice(0, at % (t.length + 1)) + s + t.slice(at % (t.length + 1))),
  fc.tuple(fc.nat(), fc.integer({ min: 1, max: 200 })).map(([at, n]) => (t: string) => {
    const i = at % (t.length + 1);
    return t.slice(0, i) + t.slice(i, i + n).repeat(3) + t.slice(i);
  }),
);

const WORKSHEETS = path.join(process.cwd(), 'worksheets');
const realSheets = readdirSync(WORKSHEETS, { recursive: true, encoding: 'utf8' })
  .filter((f) => f.endsWith('.md'))
  .map((f) => readFileSync(path.join(WORKSHEETS, f), 'utf8'));

describe('the engine under random and broken sheets', () => {
  it('random sheets: no crash, every error with its place, every number finite', () => {
    fc.assert(
      fc.property(sheet, (t) => {
        runSheet(t);
      }),
      { seed: SEED, numRuns: 1000 * RUNS, endOnFailure: true },
    );
  }, TIMEOUT);

  it('lines past the limits, among ordinary ones: each an error on its own line', () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 4 }), extreme, fc.array(line, { maxLength: 4 }), fc.integer({ min: 0, max: 2000 }), (before, bad, after, quotes) => {
        const t = `${quotes ? '>'.repeat(quotes * 5) + ' deep\n\n' : ''}\`\`\`basis\n${[...before, bad, ...after].join('\n')}\n\`\`\`\n`;
        runSheet(t);
      }),
      { seed: SEED, numRuns: 100 * RUNS, endOnFailure: true },
    );
  }, TIMEOUT);

  it('real sheets with random edits, run one after another through one pipeline as saves would', () => {
    fc.assert(
      fc.property(fc.constantFrom(...realSheets), fc.array(mutation, { minLength: 1, maxLength: 6 }), (original, edits) => {
        // The step limit stays; the time limit is set far off, since a run that a busy machine cut short
        // at 400 ms is not the run a warm pipeline gives, and the comparison below is of values.
        const limits = { ...LIMITS, timeoutMs: 20_000 };
        const pipeline = new SheetPipeline({ limits });
        let t = original;
        for (const edit of edits) {
          t = edit(t);
          runSheet(t, pipeline);
        }
        // Back to the original: the caches give what a fresh run gives.
        const again = runSheet(original, pipeline);
        const fresh = runSheet(original, new SheetPipeline({ limits }));
        expect(again.values).toEqual(fresh.values);
        expect(again.errors).toEqual(fresh.errors);
      }),
      { seed: SEED, numRuns: 120 * RUNS, endOnFailure: true },
    );
  }, TIMEOUT);

  it('bytes that are not UTF-8, and binary, read as text', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        const t = Buffer.from(bytes).toString('utf8');
        runSheet(t);
        runSheet('```basis\n' + t + '\n```\n');
      }),
      { seed: SEED, numRuns: 400 * RUNS },
    );
  }, TIMEOUT);

  it('a 5 MB sheet evaluates within its time budget, and the values it reached are right', () => {
    const block = Array.from({ length: 2000 }, (_, k) => `v_${k} = ${k} m`).join('\n');
    const prose = 'Prose between the blocks, repeated to make the file large. '.repeat(40);
    let text = '';
    let blocks = 0;
    while (text.length < 5_000_000) {
      text += `${prose}\n\n\`\`\`basis\n${block.replaceAll('v_', `b${blocks}_`)}\n\`\`\`\n\n`;
      blocks++;
    }
    const r = runSheet(text, new SheetPipeline({ limits: { ...LIMITS, timeoutMs: 2000 } }));
    // Either every value, or the time limit named on a line and the rest not evaluated.
    const limit = r.errors.find((e) => e.code === 'limit');
    if (!limit) expect(Object.keys(r.values)).toHaveLength(blocks * 2000);
    for (const [k, v] of Object.entries(r.values)) expect(v.si).toBe(Number(k.split('_')[1]));
  }, TIMEOUT);
});
