// `npm start`: build what is missing or stale (server bundle, console), then run the server.
// The builds say a line each; their full output is shown only when one fails, so the lines
// that matter (the address, the demo sign-ins, where the data lives) end the output.
import { spawn, spawnSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BUNDLES, buildBundle, isStale } from './bundles.mjs';

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

/** "done in 21 s" after a step that started at `started` (ms). */
const doneIn = (started) => `done in ${Math.round((Date.now() - started) / 1000)} s\n`;

if (isStale('server')) {
  process.stdout.write('Building the server… ');
  const started = Date.now();
  await buildBundle('server'); // esbuild prints its errors itself, in full
  process.stdout.write(doneIn(started));
}
if (consoleIsStale()) {
  process.stdout.write('Building the console (about a minute the first time)… ');
  const started = Date.now();
  const ng = path.join(root, 'node_modules/@angular/cli/bin/ng.js');
  const build = spawnSync(process.execPath, [ng, 'build'], {
    cwd: root,
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false', NO_COLOR: '1' },
  });
  if (build.status !== 0) {
    process.stdout.write('failed:\n');
    process.stderr.write(`${build.stdout ?? ''}${build.stderr ?? ''}${build.error ?? ''}\n`);
    process.exit(build.status ?? 1);
  }
  process.stdout.write(doneIn(started));
}
const server = spawn(process.execPath, [...BUNDLES.server.nodeOptions, BUNDLES.server.outfile], {
  stdio: 'inherit',
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
