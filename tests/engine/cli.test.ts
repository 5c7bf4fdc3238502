// The command line: eval --json shape, check's file:line output and exit
// codes (0 ok, 1 failed checks or errors, 2 bad usage), render -o.
import { execFile, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const BIN = join(process.cwd(), 'bin', 'wakesheet.js');

function run(args: string[], cwd = process.cwd()): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile('node', [BIN, ...args], { cwd, env: { ...process.env, NO_COLOR: '1' } }, (err, stdout, stderr) => {
      resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr });
    });
  });
}

const dir = mkdtempSync(join(tmpdir(), 'ws-cli-'));
mkdirSync(join(dir, 'sub'));
writeFileSync(join(dir, 'good.md'), '# Good\n\n```basis\nT = 15 degC\nI = 5 %\nU = 12 m/s\ncheck U > 10 m/s "fast enough"\n```\n');
writeFileSync(join(dir, 'sub', 'bad.md'), '```basis\nU = 12 m/s\nx = U + 3 Pa\ncheck U > 20 m/s "fast"\n```\n');

describe('wakesheet CLI', () => {
  it('eval --json prints values in SI (kelvin, fractions), checks and errors', async () => {
    const r = await run(['eval', join(dir, 'good.md'), '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.values.T).toEqual({ si: 288.15, unit: 'K', display: '15 °C' });
    expect(out.values.I).toEqual({ si: 0.05, unit: '', display: '5 %' });
    expect(out.checks).toEqual([{ line: 7, passed: true, text: 'fast enough' }]);
    expect(out.errors).toEqual([]);
  });

  it('check lists each failure as file:line and exits 1', async () => {
    const r = await run(['check', '.'], dir);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('sub/bad.md:3:5: error cannot add m/s to Pa');
    // A failed check says what it compared, so a reader at the terminal sees by how much.
    expect(r.stdout).toContain('sub/bad.md:4: check failed fast (U = 12 m/s)\n');
    expect(r.stdout).not.toContain('good.md');
    expect(r.stdout).toContain('2 sheets, 2 checks, 2 problems');
  });

  it('check refuses a folder with no sheet: most often the wrong folder', async () => {
    const empty = mkdtempSync(join(tmpdir(), 'ws-cli-empty-'));
    const r = await run(['check', empty]);
    expect([r.code, r.stderr]).toEqual([2, expect.stringContaining(`no sheets (.md files) under ${empty}`)]);
  });

  it('eval ends with the planning caution when the sheet computes a load, in text and JSON', async () => {
    writeFileSync(join(dir, 'load.md'), '```basis\nU = 30 m/s\nq = dynamic_pressure(U, air(T: 15 degC))\n```\n');
    const text = await run(['eval', join(dir, 'load.md')]);
    expect(text.stdout.trimEnd().split('\n').at(-1)).toMatch(/^Planning estimates only\. Loads, pressures and anything structural/);
    const json = JSON.parse((await run(['eval', join(dir, 'load.md'), '--json'])).stdout) as { caution?: string };
    expect(json.caution).toMatch(/licensed engineer/);
    const plain = JSON.parse((await run(['eval', join(dir, 'good.md'), '--json'])).stdout) as { caution?: string };
    expect(plain.caution).toBeUndefined();
    // export keeps it too: in the JSON, and beside a CSV on standard error, never as a row.
    const exported = JSON.parse((await run(['export', join(dir, 'load.md'), '--json'])).stdout) as { caution?: string };
    expect(exported.caution).toMatch(/licensed engineer/);
    const csv = await run(['export', join(dir, 'load.md'), '--csv']);
    expect(csv.stderr).toMatch(/^note: Planning estimates only\./);
    expect(csv.stdout).not.toContain('Planning');
  });

  it('check counts the checks and notes a sheet with nothing to evaluate', async () => {
    const other = mkdtempSync(join(tmpdir(), 'ws-cli-fence-'));
    // A fence word far from `basis` (a slip of one letter is an error of its own): nothing on the sheet is evaluated.
    writeFileSync(join(other, 'notes.md'), '# Notes\n\n```calc\nU = 12 m/s\n```\n');
    const r = await run(['check', '.'], other);
    expect(r.code).toBe(0);
    expect(r.stdout).toBe('notes.md: note no `basis` block, nothing evaluated\n1 sheet, no checks\n');
    writeFileSync(join(other, 'notes.md'), '# Notes\n\n```bsis\nU = 12 m/s\n```\n');
    const slip = await run(['check', '.'], other);
    expect([slip.code, slip.stdout]).toEqual([1, expect.stringContaining("notes.md:3:4: error this block's fence says `bsis`")]);
  });

  it('render -o writes one self-contained HTML file', async () => {
    const out = join(dir, 'good.html');
    const r = await run(['render', join(dir, 'good.md'), '-o', out]);
    expect(r.code).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('data:font/woff2;base64,');
    expect(html).not.toMatch(/<link[^>]+stylesheet|https?:\/\/cdn/);
  });

  it('nothing printed is lost to a pipe that reads slowly (issue 17): all the bytes, and the exit code', async () => {
    // Long enough to fill a pipe's buffer many times over (it holds 64 KiB).
    const lines = Array.from({ length: 200 }, (_, i) => `x_${i} = linspace(0, ${i + 1}, 30)`);
    lines.push('check x_0 > 2 "a failing check, so the exit code is 1"');
    const file = join(dir, 'long.md');
    writeFileSync(file, '```basis\n' + lines.join('\n') + '\n```\n');
    const direct = await run(['eval', file, '--json']);
    expect(direct.code).toBe(1);
    expect(Buffer.byteLength(direct.stdout)).toBeGreaterThan(300_000);
    const piped = spawnSync('bash', ['-c', `node "${BIN}" eval "${file}" --json | (sleep 1; wc -c); exit \${PIPESTATUS[0]}`], { encoding: 'utf8' });
    expect(Number(piped.stdout.trim())).toBe(Buffer.byteLength(direct.stdout));
    expect(piped.status).toBe(1);
    // A reader that stops early ends the command quietly.
    const head = spawnSync('bash', ['-c', `node "${BIN}" eval "${file}" --json | head -c 10 >/dev/null; echo \${PIPESTATUS[0]}`], { encoding: 'utf8' });
    expect(head.stderr).toBe('');
  });

  it('exits 2 on bad usage and prints help on --help', async () => {
    expect((await run(['eval'])).code).toBe(2);
    expect((await run(['frobnicate'])).code).toBe(2);
    const help = await run(['check', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('wakesheet check [DIR | SHEET.md]');
  });

  it('refuses what is not one sheet in one plain line, exit 2: a folder, a data file, an unknown flag', async () => {
    const folder = await run(['eval', dir]);
    expect(folder.code).toBe(2);
    expect(folder.stderr.trim().split('\n')).toHaveLength(1);
    expect(folder.stderr).toContain('is a folder; eval takes one sheet');
    writeFileSync(join(dir, 'data.csv'), 'a,b\n1,2\n');
    const csv = await run(['eval', join(dir, 'data.csv')]);
    expect([csv.code, csv.stderr]).toEqual([2, expect.stringContaining('is not a sheet')]);
    const flag = await run(['eval', join(dir, 'good.md'), '--jsn']);
    expect(flag.code).toBe(2);
    expect(flag.stderr).toContain('unknown option --jsn; did you mean --json?');
    expect(flag.stdout).toBe('');
  });

  it('render -o refuses a missing folder, the sheet itself and any .md file, in one line', async () => {
    const missing = await run(['render', join(dir, 'good.md'), '-o', join(dir, 'no', 'such', 'x.html')]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/^wakesheet render: cannot write .*x\.html: the folder .* does not exist/);
    expect(missing.stderr).not.toContain('    at ');
    const self = await run(['render', join(dir, 'good.md'), '-o', join(dir, 'good.md')]);
    expect([self.code, self.stderr]).toEqual([2, expect.stringContaining('is the sheet itself')]);
    expect(readFileSync(join(dir, 'good.md'), 'utf8')).toMatch(/^# Good/);
    const md = await run(['render', join(dir, 'good.md'), '-o', join(dir, 'notes.md')]);
    expect([md.code, md.stderr]).toEqual([2, expect.stringContaining('would overwrite a Markdown file')]);
  });

  it('prints the fields of records under their name, and its version', async () => {
    writeFileSync(join(dir, 'rec.md'), '```basis\nw = air(T: 15 degC)\n```\n');
    const r = await run(['eval', join(dir, 'rec.md')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^w:\n  rho = 1\.225 kg\/m³\n/);
    const v = await run(['--version']);
    expect([v.code, v.stdout]).toEqual([0, expect.stringMatching(/^wakesheet \d+\.\d+\.\d+\n$/)]);
  });

  it('--set replaces an input for one run, says so, and refuses what it cannot set', async () => {
    const set = await run(['eval', join(dir, 'good.md'), '--set', 'U=9 m/s']);
    expect(set.code).toBe(1); // the check "fast enough" fails at 9 m/s
    expect(set.stdout).toMatch(/^set U = 9 m\/s \(.*good\.md says 12 m\/s\)\nT = 15 °C\n/);
    expect(set.stdout).toContain('U = 9 m/s');
    expect(set.stdout).toContain('FAIL line 7: fast enough');
    const json = JSON.parse((await run(['eval', join(dir, 'good.md'), '--json', '--set', 'U=20m/s', '--set', 'I=10 %'])).stdout);
    expect([json.values.U.si, json.values.I.si]).toEqual([20, 0.1]);
    expect(json.overrides.map((o: { name: string }) => o.name)).toEqual(['I', 'U']); // in the order the sheet defines them
    const form = await run(['eval', join(dir, 'good.md'), '--set', 'U']);
    expect([form.code, form.stderr]).toEqual([2, expect.stringContaining('--set U: write it as NAME=VALUE')]);
    const twice = await run(['eval', join(dir, 'good.md'), '--set', 'U=1 m/s', '--set', 'U=2 m/s']);
    expect([twice.code, twice.stderr]).toEqual([2, expect.stringContaining('--set U is given twice')]);
    const unknown = await run(['eval', join(dir, 'good.md'), '--set', 'V=1 m/s']);
    expect([unknown.code, unknown.stdout]).toEqual([1, expect.stringContaining('--set V: no input `V` in this sheet')]);
  });

  it('check --set sets a name in every sheet that has it, and names one no sheet has', async () => {
    const both = await run(['check', '.', '--set', 'U=25 m/s'], dir);
    // At 25 m/s bad.md's check "fast" holds; its unit error stays.
    expect(both.stdout).not.toContain('check failed fast');
    expect(both.stdout).toContain('with U = 25 m/s set for this run');
    const none = await run(['check', '.', '--set', 'Q=1'], dir);
    expect([none.code, none.stdout]).toEqual([1, expect.stringContaining('--set Q: no sheet under . has an input `Q`')]);
    const one = await run(['check', join(dir, 'good.md'), '--set', 'U=25 m/s']);
    expect([one.code, one.stdout]).toEqual([0, expect.stringContaining('1 sheet, 1 check, it passes')]);
  });

  it('check notes a check that holds at nominal but not over the ±2u range, without failing', async () => {
    writeFileSync(join(dir, 'spread.md'), '```basis\nU = 30 m/s ± 1.5 m/s\ncheck U < 32 m/s "below the tunnel limit"\n```\n');
    const r = await run(['check', join(dir, 'spread.md')]);
    // 30 + 2 × 1.5 = 33 m/s at the upper end of the range, past 32 m/s.
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('spread.md:3: note below the tunnel limit: holds at nominal, fails at U = 33 m/s (1 of the 2 ends of the ±2u range)');
    expect(r.stdout).toContain("1 sheet, 1 check, it passes; 1 check holds at nominal only, not over the inputs' ±2u range");
    // eval prints a value's standard uncertainty beside it, as the page does.
    const e = await run(['eval', join(dir, 'spread.md')]);
    expect(e.stdout).toMatch(/^U = 30 m\/s ± 1\.5 m\/s\n/);
  });
});
