#!/usr/bin/env node
// The larder command: runs the bundle built by `npm run build:cli` (run on npm install).
import { existsSync } from 'node:fs';

const bundle = new URL('../dist/cli/larder.js', import.meta.url);
if (!existsSync(bundle)) {
  process.stderr.write(
    'larder: the command is not built yet; run `npm run build:cli` (npm install does it).\n',
  );
  process.exit(1);
}
await import(bundle.href);
