#!/usr/bin/env node
// The larder command. Runs the bundle in dist/cli/, building it first when it is missing or
// older than its sources (a fresh clone, or after a pull); the build takes well under a second.
import { pathToFileURL } from 'node:url';
import { BUNDLES, ensureBundle } from '../scripts/bundles.mjs';

try {
  await ensureBundle('cli');
} catch (error) {
  process.stderr.write(
    `larder: could not build the command (run npm install first): ${error.message}\n`,
  );
  process.exit(1);
}
await import(pathToFileURL(BUNDLES.cli.outfile).href);
