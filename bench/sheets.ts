// Sheets for the live benchmark: a demo sheet from worksheets/ and a generated
// one with 2,000 statements, each with one input the benchmark changes.
import { readFileSync } from 'node:fs';
import path from 'node:path';

export interface BenchSheet {
  name: string;
  /** The sheet's text with the changing input set to `value`. */
  text(value: number): string;
  /** Name of the input that changes, and its SI value for a given `value`. */
  input: string;
  si(value: number): number;
  base: number;
}

/** 400 blocks of five statements: inputs, a derived Reynolds number and a check. */
export function generatedSheet(blocks = 400): BenchSheet {
  const changed = Math.floor(blocks / 2);
  const text = (value: number) => {
    const out = ['---', 'title: Generated sheet, 2,000 statements', '---', '# Generated sheet', ''];
    for (let k = 0; k < blocks; k++) {
      const speed = k === changed ? value : 12 + (k % 7);
      out.push(`## Station ${k}`, '', `Chord and speed at station ${k}.`, '', '```basis');
      out.push(`L_${k} = ${(1 + (k % 5) * 0.4).toFixed(1)} m   # chord`);
      out.push(`U_${k} = ${speed} m/s   # local speed`);
      out.push(`nu_${k} = 1.5e-5 m^2/s`);
      out.push(`Re_${k} = U_${k} * L_${k} / nu_${k}`);
      out.push(`check Re_${k} > 1000 "turbulent at station ${k}"`);
      out.push('```', '');
    }
    return out.join('\n');
  };
  return { name: 'generated 2,000 statements', text, input: `U_${changed}`, si: (v) => v, base: 12 };
}

/** The van demo sheet, with its first speed input (in km/h) varied. */
export function demoSheet(root: string): BenchSheet {
  const file = path.join(root, 'worksheets', 'van-and-towed-body.md');
  const original = readFileSync(file, 'utf8');
  const match = /^(\w+) = ([\d.]+) km\/h/m.exec(original);
  if (!match) throw new Error(`no "NAME = N km/h" input found in ${file}`);
  const [line, input, base] = match as unknown as [string, string, string];
  return {
    name: 'demo (van-and-towed-body.md)',
    text: (value) => original.replace(line, `${input} = ${value} km/h`),
    input,
    si: (value) => value / 3.6,
    base: Number(base),
  };
}
