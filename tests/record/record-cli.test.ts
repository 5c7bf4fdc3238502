// The record from the command line: verify passes on a fresh record and fails
// when a value or a data file changes; export round-trips; a render killed
// while it writes never leaves a half-written record.
import { execFile, spawn } from 'node:child_process';
import { existsSync, mkdtempSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readRecord } from '../../server/pipeline/record.js';

const BIN = join(process.cwd(), 'bin', 'wakesheet.js');

function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile('node', [BIN, ...args], { env: { ...process.env, NO_COLOR: '1' }, maxBuffer: 64 * 1024 * 1024 }, (err, stdout, stderr) => {
      resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr });
    });
  });
}

function project() {
  const dir = mkdtempSync(join(tmpdir(), 'ws-record-cli-'));
  mkdirSync(join(dir, 'data'));
  writeFileSync(join(dir, 'data', 'run.csv'), 'face,yplus,area\na,0.8,1\nb,1.2,1\nc,2,1\n');
  const sheet = join(dir, 'pod.md');
  writeFileSync(sheet, '# Pod\n\n```basis\nU = 45 m/s\nD = 0.12 m\nRe = U * D / (1.5e-5 m^2/s)\nrep = yplus_report("data/run.csv")\ncheck Re > 2e5 "past the drag crisis"\n```\n');
  return { dir, sheet, record: join(dir, 'pod-record.html') };
}

/** `verify` run on a copy of the record whose embedded data is replaced, as a tampered copy would be. */
function verifyAltered(dir: string, html: string, data: unknown) {
  const altered = join(dir, 'altered-record.html');
  writeFileSync(altered, html.replace(/(<script type="application\/json" id="wakesheet-record">)[\s\S]*?(<\/script>)/, (_, a: string, b: string) => a + JSON.stringify(data).replace(/</g, '\\u003c') + b));
  return run(['verify', altered]);
}

describe('wakesheet verify', () => {
  it('passes on a fresh record, and fails naming the data file that changed', async () => {
    const p = project();
    expect((await run(['render', p.sheet, '-o', p.record])).code).toBe(0);
    const ok = await run(['verify', p.record]);
    expect([ok.code, ok.stdout]).toEqual([0, expect.stringMatching(/^matches: \d+ values, 1 check and 1 data file as recorded/)]);
    writeFileSync(join(p.dir, 'data', 'run.csv'), 'face,yplus,area\na,0.8,1\nb,1.2,1\nc,9,1\n');
    const changed = await run(['verify', p.record]);
    expect(changed.code).toBe(1);
    expect(changed.stdout).toContain('differs: the data file data/run.csv has changed');
    expect(changed.stdout).toMatch(/differs: rep\.max was 2 and is 9 now/);
  });

  it('fails on a value that no longer comes out as recorded, and on an altered source', async () => {
    const p = project();
    await run(['render', p.sheet, '-o', p.record]);
    const html = readFileSync(p.record, 'utf8');
    const data = readRecord(html)!;
    const tampered = structuredClone(data);
    tampered.values.Re!.display = '9.9×10⁵';
    const value = await verifyAltered(p.dir, html, tampered);
    expect(value.code).toBe(1);
    expect(value.stdout).toContain('differs: Re was 9.9×10⁵ and is 3.6×10⁵ now');
    tampered.values.Re!.display = data.values.Re!.display;
    tampered.sources[0]!.text = tampered.sources[0]!.text.replace('45 m/s', '46 m/s');
    const source = await verifyAltered(p.dir, html, tampered);
    expect(source.code).toBe(1);
    expect(source.stdout).toContain('does not match its recorded SHA-256: the record was altered');
  });

  it('compares each value’s uncertainty as shown, and exports it in SI', async () => {
    const p = project();
    writeFileSync(p.sheet, '# Pod\n\n```basis\nU = 45 m/s ± 2 m/s\nq = U * 2 s\n```\n');
    await run(['render', p.sheet, '-o', p.record]);
    const html = readFileSync(p.record, 'utf8');
    const data = readRecord(html)!;
    // q = 2 s · U: u(q) = 2 s × 2 m/s = 4 m (GUM eq. 10, c = 2 s).
    expect(data.values.q).toMatchObject({ u: 4, uDisplay: '± 4 m' });
    const tampered = structuredClone(data);
    tampered.values.q!.uDisplay = '± 5 m';
    const verified = await verifyAltered(p.dir, html, tampered);
    expect(verified.code).toBe(1);
    expect(verified.stdout).toContain('differs: the uncertainty of q was ± 5 m and is ± 4 m now');
    const csv = (await run(['export', p.sheet, '--csv'])).stdout.trim().split('\n');
    expect(csv).toContain('q,90,m,90 m,,4');
  });

  it('refuses a file that is not a record', async () => {
    const p = project();
    const r = await run(['verify', p.sheet]);
    expect([r.code, r.stderr]).toEqual([2, expect.stringContaining('is not a Wakesheet set-up record')]);
  });
});

describe('wakesheet export', () => {
  it('gives every number with its SI value, unit, display and warnings, in JSON and CSV that agree with eval', async () => {
    const p = project();
    const evaluated = JSON.parse((await run(['eval', p.sheet, '--json'])).stdout);
    const json = JSON.parse((await run(['export', p.sheet, '--json'])).stdout);
    expect(json.values).toEqual(evaluated.values);
    const csv = (await run(['export', p.sheet, '--csv'])).stdout.trim().split('\n');
    expect(csv[0]).toBe('name,si,unit,display,warnings,u');
    const rows = new Map(csv.slice(1).map((l) => [l.split(',')[0], l.split(',')]));
    expect(Number(rows.get('Re')![1])).toBe(evaluated.values.Re.si);
    expect(Number(rows.get('rep.max')![1])).toBe(evaluated.values.rep.fields.max.si);
    expect(rows.get('U')!.slice(2, 4)).toEqual(['m/s', '45 m/s']);
  });
});

describe('writing a record', () => {
  it('never leaves a half-written record: killed while writing, the previous one stays whole', async () => {
    const p = project();
    // A sheet large enough that the write takes a moment.
    const lines = Array.from({ length: 400 }, (_, i) => `x${i} = ${i + 1} m/s * 2`);
    writeFileSync(p.sheet, `# Big\n\n\`\`\`basis\n${lines.join('\n')}\n\`\`\`\n`);
    expect((await run(['render', p.sheet, '-o', p.record])).code).toBe(0);
    const whole = readFileSync(p.record, 'utf8');
    for (let attempt = 0; attempt < 8; attempt++) {
      const child = spawn('node', [BIN, 'render', p.sheet, '-o', p.record], { stdio: 'ignore' });
      const exited = new Promise((r) => child.once('exit', r));
      await new Promise((r) => setTimeout(r, 300 + attempt * 120));
      child.kill('SIGKILL');
      await exited;
      const now = readFileSync(p.record, 'utf8');
      // Either the record as it was, or a complete new one: never a part of one.
      expect(now === whole || (now.endsWith('</html>') && readRecord(now) !== null)).toBe(true);
    }
    expect(existsSync(p.record)).toBe(true);
    expect(readdirSync(p.dir).filter((f) => f.endsWith('.md')).length).toBe(1);
  }, 60_000);

  it('records a run with inputs set and a used sheet, and verify runs it again from the record alone', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'ws-record-use-'));
    writeFileSync(join(dir, 'inputs.md'), '# Inputs\n\n```basis\nU_inf = 30 m/s\nD = 0.12 m\n```\n');
    const sheet = join(dir, 'pod.md');
    writeFileSync(sheet, '# Pod\n\n```basis\nuse "inputs.md"\nRe = U_inf * D / (1.5e-5 m^2/s)\ncheck Re > 2e5 "past the drag crisis"\n```\n');
    const record = join(dir, 'pod-record.html');
    expect((await run(['render', sheet, '-o', record, '--set', 'U_inf=40 m/s'])).code).toBe(0);
    const html = readFileSync(record, 'utf8');
    const data = readRecord(html)!;
    expect(data.sources.map((x) => x.path)).toEqual(['pod.md', 'inputs.md']);
    expect(data.dataFiles).toEqual([]);
    expect(data.overrides).toEqual([{ name: 'U_inf', was: '30 m/s', now: '40 m/s', sheet: 'inputs.md' }]);
    // Re = 40 × 0.12 / 1.5e-5 = 3.2e5
    expect(data.values.Re!.si).toBeCloseTo(3.2e5, 6);
    expect(html).toContain('one input was set for it');
    expect(html).toContain('Overridden for this record');
    // The used sheet changes on disk: the record still verifies, for it holds the text it was run with.
    writeFileSync(join(dir, 'inputs.md'), '# Inputs\n\n```basis\nU_inf = 10 m/s\nD = 0.12 m\n```\n');
    const ok = await run(['verify', record]);
    expect([ok.code, ok.stdout]).toEqual([0, expect.stringMatching(/^matches: /)]);
  }, 30_000);
});
