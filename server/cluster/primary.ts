import cluster, { type Worker } from 'node:cluster';
import type { ServerConfig } from '../config.ts';
import { ensureDemoFormulas } from '../demo/demo-formulas.ts';
import { seedDemo } from '../demo/seed-demo.ts';
import { openContext } from '../main-context.ts';
import { printStartBanner } from './print-banner.ts';
import { WORKER_INDEX } from './process-role.ts';

/* eslint-disable no-console -- the server talks to whoever started it */

/**
 * The primary of N server processes (node:cluster): opens the database (its migrations) and seeds
 * the demo before any worker serves, forks the workers, prints the banner once all of them
 * listen, and starts a worker again in the same place when one ends on its own. On SIGTERM or
 * SIGINT it passes the signal on and waits until every worker has finished its requests and
 * closed its database, then exits.
 */
export async function runPrimary(config: ServerConfig): Promise<void> {
  if (config.mode === 'demo') ensureDemoFormulas(config.formulasDir);
  const context = await openContext(config);
  if (config.mode === 'demo') await seedDemo(context);
  const workers = new Map<Worker, number>();
  let stopping = false;
  let listening = 0;
  const fork = (index: number): void => {
    workers.set(cluster.fork({ [WORKER_INDEX]: String(index) }), index);
  };
  const closeContext = async (): Promise<void> => {
    context.formulas.close();
    await context.mail.close();
    await context.db.close();
  };
  // Workers open the database themselves; the primary keeps its own only until the banner is out.
  let contextClosed: Promise<void> | undefined;
  cluster.on('listening', (_worker, address) => {
    listening += 1;
    if (listening !== config.processes) return;
    contextClosed = printStartBanner(context, address.port, config.processes).finally(closeContext);
  });
  cluster.on('exit', (worker, code, signal) => {
    const index = workers.get(worker) ?? 0;
    workers.delete(worker);
    if (stopping) {
      if (workers.size === 0) void Promise.resolve(contextClosed).then(() => process.exit());
      return;
    }
    if (listening < config.processes) {
      // A worker that cannot start (the port taken, the database unreadable) said why itself;
      // starting it again would only say it again, forever.
      console.error(`larderbook: server process ${index} ended before listening; stopping`);
      stop(1);
      return;
    }
    console.error(
      `larderbook: server process ${index} ended (${signal ?? `exit ${code}`}); starting it again`,
    );
    fork(index);
  });
  const stop = (exitCode = 0): void => {
    if (stopping) return;
    stopping = true;
    if (workers.size === 0) process.exit(exitCode);
    for (const worker of workers.keys()) worker.process.kill('SIGTERM');
    if (exitCode !== 0) process.exitCode = exitCode;
  };
  process.on('SIGTERM', () => stop());
  process.on('SIGINT', () => stop());
  for (let index = 1; index <= config.processes; index++) fork(index);
}
