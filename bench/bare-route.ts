// The baseline of the calc-api benchmark: a bare Express route that parses the JSON body and
// answers a fixed JSON body (read from stdin), in a process of its own like the real server; with
// BARE_PROCESSES=N, N worker processes share the port through node:cluster as the server's do
// (LARDER_PROCESSES), so the comparison stays like for like.
// Usage: node --import tsx bench/bare-route.ts < body.json  (prints "listening on PORT")
import cluster from 'node:cluster';
import express from 'express';
import type { AddressInfo } from 'node:net';

const processes = Number(process.env.BARE_PROCESSES ?? 1);

if (cluster.isPrimary && processes > 1) {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  let listening = 0;
  // The body goes to each worker in its environment: a message sent at fork could arrive before
  // the worker listens for it.
  for (let i = 0; i < processes; i++)
    cluster.fork({ BARE_BODY: Buffer.concat(chunks).toString('utf8') });
  cluster.on('listening', (_worker, address) => {
    if (++listening === processes) process.stdout.write(`listening on ${address.port}\n`);
  });
  process.on('SIGTERM', () => {
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
    cluster.on('exit', () => {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
    });
  });
} else {
  const body = cluster.isPrimary
    ? await (async () => {
        const chunks: Buffer[] = [];
        for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
        return Buffer.concat(chunks).toString('utf8');
      })()
    : (process.env.BARE_BODY ?? '');
  const app = express();
  app.use(express.json());
  app.post('/calc', (_req, res) => void res.type('json').send(body));
  const listener = app.listen(0, '127.0.0.1', () => {
    if (cluster.isPrimary)
      process.stdout.write(`listening on ${(listener.address() as AddressInfo).port}\n`);
  });
  process.on('SIGTERM', () => listener.close(() => process.exit(0)));
}
