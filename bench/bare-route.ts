// The baseline of the calc-api benchmark: a bare Express route that parses the JSON body and
// answers a fixed JSON body (read from stdin), in a process of its own like the real server.
// Usage: node --import tsx bench/bare-route.ts < body.json  (prints "listening on PORT")
import express from 'express';
import type { AddressInfo } from 'node:net';

const chunks: Buffer[] = [];
for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
const body = Buffer.concat(chunks).toString('utf8');

const app = express();
app.use(express.json());
app.post('/calc', (_req, res) => void res.type('json').send(body));
const listener = app.listen(0, '127.0.0.1', () => {
  process.stdout.write(`listening on ${(listener.address() as AddressInfo).port}\n`);
});
process.on('SIGTERM', () => listener.close(() => process.exit(0)));
