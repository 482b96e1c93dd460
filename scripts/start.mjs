// `npm start`: build what is missing or stale (server bundle, console), then run the server.
import { spawn } from 'node:child_process';
import { BUNDLES, ensureBundle } from './bundles.mjs';

await ensureBundle('server');
const server = spawn(process.execPath, ['--enable-source-maps', BUNDLES.server.outfile], {
  stdio: 'inherit',
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
