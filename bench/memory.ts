// Memory benchmark: heap kept per statement by one sheet's pipeline (its
// parse, evaluation and render caches, KaTeX's cache, the html itself), for
// generated sheets of 2,000 and 6,000 statements, and heap kept per list item.
// Measured after garbage collection in a process of its own.
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const HERE = path.dirname(fileURLToPath(import.meta.url));

export interface MemoryFigures {
  small: { statements: number; full: number; afterEdit: number; htmlChars: number };
  large: { statements: number; full: number; afterEdit: number; htmlChars: number };
  listItem: number;
}

/** One figure, in a process of its own: what one measure leaves behind (compiled code, KaTeX's cache) never counts in another. */
function probe(...args: string[]): unknown {
  const out = execFileSync(process.execPath, ['--expose-gc', '--import', 'tsx', path.join(HERE, 'memory-probe.ts'), ...args], { encoding: 'utf8', maxBuffer: 1 << 20 });
  return JSON.parse(out.trim().split('\n').pop()!);
}

export function benchMemory(): MemoryFigures {
  return {
    small: probe('statements', '2000') as MemoryFigures['small'],
    large: probe('statements', '6000') as MemoryFigures['large'],
    listItem: probe('list') as number,
  };
}

export function printMemory(m: MemoryFigures): void {
  console.log('\nMemory kept after garbage collection (bytes)        full run   after one input   html chars');
  for (const s of [m.small, m.large]) {
    console.log(`  per statement, ${s.statements.toLocaleString('en')}-statement sheet`.padEnd(52) + `${String(s.full).padStart(8)}   ${String(s.afterEdit).padStart(15)}   ${String(s.htmlChars).padStart(10)}`);
  }
  console.log(`  per list item (ten lists of 100,000)`.padEnd(52) + String(m.listItem).padStart(8));
}
