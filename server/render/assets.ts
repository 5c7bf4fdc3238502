// Stylesheets for the standalone record: KaTeX's CSS with its woff2 fonts
// inlined from the installed package (nothing fetched at run time), and
// Wakesheet's own web/style.css.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { katexDistDir, packageRoot } from '../read/paths.js';

let inlined: string | undefined;

export function standaloneCss(): string {
  if (inlined !== undefined) return inlined;
  const dist = katexDistDir();
  const katexCss = readFileSync(join(dist, 'katex.min.css'), 'utf8').replace(
    /url\((fonts\/[^)]+?\.woff2)\)\s*format\("woff2"\)(,[^;}]*)?/g,
    (_, file: string) => `url(data:font/woff2;base64,${readFileSync(join(dist, file)).toString('base64')}) format("woff2")`,
  );
  const own = join(packageRoot(), 'web', 'style.css');
  inlined = katexCss + '\n' + (existsSync(own) ? readFileSync(own, 'utf8') : '');
  return inlined;
}
