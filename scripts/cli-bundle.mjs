// Builds the larder command into one bundle and tells whether the bundle is older than its sources.
// bin/larder.js uses it so that a fresh clone (or a pull) never runs a missing or stale command,
// without an install script on the package (which `npx larder` would refuse under strict-allow-scripts).
import { readFileSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
export const BUNDLE = `${root}dist/cli/larder.js`;
const SOURCES = `${root}dist/cli/sources.json`;
/** Files outside the import graph that still change the bundle. */
const ALWAYS = ['package.json', 'package-lock.json', 'scripts/cli-bundle.mjs'];

function modifiedMs(file) {
  try {
    return statSync(file).mtimeMs;
  } catch {
    return undefined;
  }
}

/** Whether the bundle is missing, or any source it was built from changed since. */
export function isStale() {
  const built = modifiedMs(BUNDLE);
  if (built === undefined) return true;
  let sources;
  try {
    sources = JSON.parse(readFileSync(SOURCES, 'utf8'));
  } catch {
    return true;
  }
  return sources.some((file) => (modifiedMs(root + file) ?? Infinity) > built);
}

/** Bundles cli/main.ts and everything it imports into dist/cli/larder.js. */
export async function buildCli() {
  const { build } = await import('esbuild');
  const result = await build({
    absWorkingDir: root,
    entryPoints: ['cli/main.ts'],
    outfile: BUNDLE,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    sourcemap: true,
    metafile: true,
    legalComments: 'none',
    logLevel: 'warning',
    // Bundled CommonJS packages (ajv) call require(); give the ES module bundle one.
    banner: {
      js: "import { createRequire as __larderRequire } from 'node:module'; const require = __larderRequire(import.meta.url);",
    },
  });
  const ours = Object.keys(result.metafile.inputs).filter(
    (file) => !file.startsWith('node_modules/'),
  );
  writeFileSync(SOURCES, `${JSON.stringify([...ALWAYS, ...ours], null, 1)}\n`);
}
