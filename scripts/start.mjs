// `npm start`: build what is missing or stale (server bundle, console), then run the server.
import { spawn, spawnSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BUNDLES, ensureBundle } from './bundles.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const CONSOLE_INDEX = path.join(root, 'dist/console/browser/index.html');

function newestIn(folder) {
  let newest = 0;
  for (const entry of readdirSync(folder, { withFileTypes: true })) {
    const full = path.join(folder, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestIn(full) : statSync(full).mtimeMs);
  }
  return newest;
}

function consoleIsStale() {
  let built;
  try {
    built = statSync(CONSOLE_INDEX).mtimeMs;
  } catch {
    return true;
  }
  const sources = ['angular.json', 'tsconfig.app.json', 'package-lock.json'].map(
    (file) => statSync(path.join(root, file)).mtimeMs,
  );
  return (
    Math.max(newestIn(path.join(root, 'src')), newestIn(path.join(root, 'public')), ...sources) >
    built
  );
}

await ensureBundle('server');
if (consoleIsStale()) {
  process.stdout.write('Building the console (about 20 seconds)…\n');
  const ng = path.join(root, 'node_modules/@angular/cli/bin/ng.js');
  const build = spawnSync(process.execPath, [ng, 'build'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
  if (build.status !== 0) process.exit(build.status ?? 1);
}
const server = spawn(process.execPath, [...BUNDLES.server.nodeOptions, BUNDLES.server.outfile], {
  stdio: 'inherit',
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
