// Builds the larder command and the server into single JavaScript bundles with esbuild, and
// tells whether a bundle is older than its sources. bin/larder.js and scripts/start.mjs use it
// so that a fresh clone (or a pull) never runs a missing or stale build, without an install
// script on the package (which `npx larder` would refuse under strict-allow-scripts).
import { readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
/** Files outside the import graph that still change a bundle. */
const ALWAYS = ['package.json', 'package-lock.json', 'scripts/bundles.mjs'];

/**
 * The bundles. The CLI carries its packages (fast start) except the database stack, which only
 * the record-keeping verbs load, from a separate chunk, and the PDF stack, which only --pdf loads
 * (pdfkit finds its own data files beside itself, so it cannot be bundled); the server loads its
 * packages from node_modules. `more` names further entry points written beside `outfile` and
 * sharing its chunks: the worker threads of `larder check`.
 */
export const BUNDLES = {
  cli: {
    entry: 'cli/main.ts',
    outfile: `${root}dist/cli/larder.js`,
    more: { 'check-worker': 'cli/check-worker.ts' },
    packages: 'bundle',
    external: [
      'sequelize',
      'sqlite3',
      'pg',
      'umzug',
      'connect-session-sequelize',
      'express-session',
      'pdfkit',
      'qrcode',
    ],
    splitting: true,
  },
  // Split too, so that the PDF routes' dynamic imports stay chunks of their own and pdfkit and
  // qrcode load with the first sheet asked for, not at start.
  server: {
    entry: 'server/main.ts',
    outfile: `${root}dist/server/main.js`,
    packages: 'external',
    splitting: true,
    // How node runs it (npm start, the benchmarks). Its live heap is about 30 MB; without a cap
    // V8 lets garbage grow the process past 250 MB under load before collecting it.
    nodeOptions: ['--enable-source-maps', '--max-old-space-size=160'],
  },
};

function modifiedMs(file) {
  try {
    return statSync(file).mtimeMs;
  } catch {
    return undefined;
  }
}

/** Every file a bundle's entry points are written to, `outfile` first. */
function outfiles(name) {
  const { outfile, more = {} } = BUNDLES[name];
  return [
    outfile,
    ...Object.keys(more).map((key) => path.join(path.dirname(outfile), `${key}.js`)),
  ];
}

/** Whether a bundle is missing, or any source it was built from changed since. */
export function isStale(name) {
  const { outfile } = BUNDLES[name];
  const times = outfiles(name).map(modifiedMs);
  if (times.includes(undefined)) return true;
  const built = Math.min(...times);
  let sources;
  try {
    sources = JSON.parse(readFileSync(`${outfile}.sources.json`, 'utf8'));
  } catch {
    return true;
  }
  return sources.some((file) => (modifiedMs(root + file) ?? Infinity) > built);
}

/** Bundles the entry points of a bundle and everything of ours they import. */
export async function buildBundle(name) {
  const { entry, outfile, more = {}, packages, external = [], splitting = false } = BUNDLES[name];
  const { build } = await import('esbuild');
  const result = await build({
    absWorkingDir: root,
    entryPoints: { [path.basename(outfile, '.js')]: entry, ...more },
    // Splitting writes chunks beside the entry; it needs an output folder rather than a file.
    outdir: path.dirname(outfile),
    chunkNames: 'chunks/[name]-[hash]',
    splitting,
    bundle: true,
    packages,
    external,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    sourcemap: true,
    metafile: true,
    legalComments: 'none',
    logLevel: 'warning',
    // Bundled CommonJS packages (ajv's runtime) call require(); give the ES module bundle one.
    banner: {
      js: "import { createRequire as __larderRequire } from 'node:module'; const require = __larderRequire(import.meta.url);",
    },
  });
  removeOldChunks(path.join(path.dirname(outfile), 'chunks'), Object.keys(result.metafile.outputs));
  const ours = Object.keys(result.metafile.inputs).filter(
    (file) => !file.startsWith('node_modules/'),
  );
  writeFileSync(`${outfile}.sources.json`, `${JSON.stringify([...ALWAYS, ...ours], null, 1)}\n`);
}

/**
 * Chunks have hashed names that no later build overwrites: those this build did not write are
 * removed after it succeeded (a failed build leaves the last good bundle whole).
 */
function removeOldChunks(folder, outputs) {
  const written = new Set(outputs.map((file) => path.resolve(root, file)));
  let names;
  try {
    names = readdirSync(folder);
  } catch {
    return; // no chunks folder
  }
  for (const name of names) {
    const file = path.join(folder, name);
    if (!written.has(file)) rmSync(file, { force: true });
  }
}

/** Builds a bundle when it is missing or stale. */
export async function ensureBundle(name) {
  if (isStale(name)) await buildBundle(name);
}
