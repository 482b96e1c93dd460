import type { AddressInfo } from 'node:net';
import { createApp } from './app.ts';
import { appServer } from './http/app-server.ts';
import { runPrimary } from './cluster/primary.ts';
import { closeGracefully, trackRequests } from './cluster/graceful-close.ts';
import { printStartBanner } from './cluster/print-banner.ts';
import { processRole, type ProcessRole } from './cluster/process-role.ts';
import { ConfigError, loadConfig, type ServerConfig } from './config.ts';
import { ensureDemoFormulas } from './demo/demo-formulas.ts';
import { EquipmentDueScheduler } from './equipment/equipment-due-scheduler.ts';
import { seedDemo } from './demo/seed-demo.ts';
import { openContext } from './main-context.ts';
import { DeadlineScan } from './process/deadline-scan.ts';
import { ProcessAlertScheduler } from './process/process-alert-scheduler.ts';
import { ReminderScheduler } from './reminders/reminder-scheduler.ts';
import { startWarmUp, warmPdf } from './pdf/warm-pdf.ts';

/* eslint-disable no-console -- the server talks to whoever started it */

/** Serves the API in this process: the only one, or one worker of several (see processRole). */
async function serve(config: ServerConfig, role: ProcessRole): Promise<void> {
  if (role.seeds && config.mode === 'demo') ensureDemoFormulas(config.formulasDir);
  const context = await openContext(config);
  if (role.seeds && config.mode === 'demo') await seedDemo(context);
  // Everything awaited before listen(): 'listening' fires during any await after it, before its
  // handler below is attached, and the server would never say where it is or start its jobs.
  const processRecords = await context.records.processRecords();
  const jobs = role.runsJobs
    ? [
        new ReminderScheduler(context),
        // Cooling deadlines that pass with no reading open their deviations once a minute.
        new DeadlineScan(processRecords, context),
        // Readings overdue, cooling deadlines near, deviations opened: mailed once each.
        new ProcessAlertScheduler(context, processRecords),
        new EquipmentDueScheduler(context),
      ]
    : [];
  const server = appServer(createApp(context)).listen(config.port, config.host);
  trackRequests(server);
  server.on('listening', async () => {
    const { port } = server.address() as AddressInfo;
    // Links in messages need the port; reminders start once it is known.
    context.mail.links.listeningOn(port);
    for (const job of jobs) job.start();
    if (role.printsBanner) await printStartBanner(context, port);
    // Soon after listening: the first recall PDF should not wait for the PDF code and fonts.
    // Every process warms its own: the code and fonts it loads live in that process's memory.
    void startWarmUp(warmPdf, (message) => console.error(`larderbook: ${message}`));
  });
  server.on('error', (error) => {
    console.error(`larderbook: cannot listen on ${config.host}:${config.port}: ${error.message}`);
    process.exit(1);
  });
  let stopping = false;
  const stop = (): void => {
    if (stopping) return;
    stopping = true;
    // How often a calculation was answered from the kept answers: the benchmark reads this line.
    const { asked, found } = context.calcAnswers.stats();
    if (asked > 0)
      console.log(
        `larderbook: calculations answered from the kept answers: ${found} of ${asked} (${((100 * found) / asked).toFixed(1)} %)`,
      );
    // Requests in flight finish and their writes commit before the jobs and the database close:
    // nothing answered is lost, and nothing queries a database already closed.
    void closeGracefully(server)
      .then(() => Promise.all(jobs.map((job) => job.stop())))
      .then(() => context.formulas.close())
      .then(() => context.mail.close())
      .then(() => context.db.close())
      .then(() => process.exit(0));
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(`larderbook: ${error.message}`);
      process.exit(2);
    }
    throw error;
  }
  const role = processRole(config.processes);
  if (role === 'primary') await runPrimary(config);
  else await serve(config, role);
}

await main();
