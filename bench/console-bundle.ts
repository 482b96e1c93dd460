// Benchmark: the console's initial bundle — the styles and scripts the browser must load before
// the first screen: index.html's stylesheet and main script and every chunk they import
// statically (lazy routes excluded) — raw and gzip-compressed, against the initial budget in
// angular.json. Reuses dist/console when it is newer than every source of the console.
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';

const BROWSER = 'dist/console/browser';
const SOURCES = ['src', 'public', 'angular.json', 'tsconfig.app.json', 'package-lock.json'];

function newest(target: string): number {
  if (!existsSync(target)) return 0;
  const info = statSync(target);
  if (!info.isDirectory()) return info.mtimeMs;
  return readdirSync(target).reduce(
    (latest, name) => Math.max(latest, newest(path.join(target, name))),
    info.mtimeMs,
  );
}

/** Whether dist/console was built after the last change to the console's sources. */
function isFresh(): boolean {
  const index = path.join(BROWSER, 'index.html');
  return (
    existsSync(index) &&
    statSync(index).mtimeMs > Math.max(...SOURCES.map((source) => newest(source)))
  );
}

/** The initial files: what index.html loads, and the static imports of its scripts, transitively. */
function initialFiles(): string[] {
  const index = readFileSync(path.join(BROWSER, 'index.html'), 'utf8');
  const styles = [...index.matchAll(/<link rel="stylesheet" href="([^"]+\.css)"/g)].map(
    (match) => match[1],
  );
  const scripts = [...index.matchAll(/<script src="([^"]+\.js)"/g)].map((match) => match[1]);
  const seen = new Set<string>();
  const visit = (file: string): void => {
    if (seen.has(file)) return;
    seen.add(file);
    const code = readFileSync(path.join(BROWSER, file), 'utf8');
    // esbuild writes static imports as `import…from"./x.js"` or `import"./x.js"`; a lazy route
    // is `import("./x.js")`, which this leaves out.
    for (const match of code.matchAll(/(?:from|import)\s*"\.\/([\w.-]+\.js)"/g)) visit(match[1]);
  };
  scripts.forEach(visit);
  return [...styles, ...seen];
}

function budgetKb(): string {
  const config = readFileSync('angular.json', 'utf8');
  const initial = /"type":\s*"initial"[^}]*"maximumError":\s*"([^"]+)"/.exec(config);
  return initial?.[1] ?? 'unknown';
}

/** Builds the console when stale and prints the size of its initial bundle. */
export function benchConsoleBundle(): { rawKb: number; gzipKb: number; brotliKb: number } {
  const fresh = isFresh();
  if (!fresh) {
    process.stdout.write('Building the console (ng build, production)…\n');
    execFileSync(process.execPath, ['node_modules/@angular/cli/bin/ng.js', 'build'], {
      stdio: ['ignore', 'ignore', 'inherit'],
      env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
    });
  }
  const files = initialFiles();
  let raw = 0;
  let gzip = 0;
  let brotli = 0;
  for (const file of files) {
    const bytes = readFileSync(path.join(BROWSER, file));
    raw += bytes.length;
    gzip += gzipSync(bytes, { level: 9 }).length;
    brotli += brotliCompressSync(bytes).length;
  }
  const rawKb = raw / 1000;
  const gzipKb = gzip / 1000;
  const brotliKb = brotli / 1000;
  process.stdout.write(
    `Console initial bundle (${files.length} files, ${fresh ? 'reused dist/console' : 'fresh build'}): ` +
      `${rawKb.toFixed(1)} kB raw (budget ≤ ${budgetKb()}, ${((rawKb / parseFloat(budgetKb())) * 100).toFixed(0)} % of it); ` +
      `transfer ${gzipKb.toFixed(1)} kB gzip -9, ${brotliKb.toFixed(1)} kB brotli\n`,
  );
  return { rawKb, gzipKb, brotliKb };
}
