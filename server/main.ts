import type { AddressInfo } from 'node:net';
import { createApp } from './app.ts';
import { ConfigError, loadConfig } from './config.ts';
import { DEMO_PEOPLE } from './demo/demo-people.ts';
import { SHIPPED_FORMULAS, ensureDemoFormulas } from './demo/demo-formulas.ts';
import { EquipmentDueScheduler } from './equipment/equipment-due-scheduler.ts';
import { seedDemo } from './demo/seed-demo.ts';
import { openContext } from './main-context.ts';
import { DeadlineScan } from './process/deadline-scan.ts';
import { ProcessAlertScheduler } from './process/process-alert-scheduler.ts';
import { ReminderScheduler } from './reminders/reminder-scheduler.ts';
import { startBanner } from './start-banner.ts';
import { startWarmUp, warmPdf } from './pdf/warm-pdf.ts';

/* eslint-disable no-console -- the server talks to whoever started it */

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
  if (config.mode === 'demo') ensureDemoFormulas(config.formulasDir);
  const context = await openContext(config);
  if (config.mode === 'demo') await seedDemo(context);
  // Everything awaited before listen(): 'listening' fires during any await after it, before its
  // handler below is attached, and the server would never say where it is or start its jobs.
  const processRecords = await context.records.processRecords();
  const reminders = new ReminderScheduler(context);
  // Cooling deadlines that pass with no reading open their deviations once a minute.
  const deadlines = new DeadlineScan(processRecords, context);
  // Readings overdue, cooling deadlines near, deviations opened: mailed once each.
  const alerts = new ProcessAlertScheduler(context, processRecords);
  const equipmentDue = new EquipmentDueScheduler(context);
  const server = createApp(context).listen(config.port, config.host);
  server.on('listening', async () => {
    const { port } = server.address() as AddressInfo;
    // Links in messages need the port; reminders start once it is known.
    context.mail.links.listeningOn(port);
    reminders.start();
    deadlines.start();
    alerts.start();
    equipmentDue.start();
    const banner = startBanner({
      config,
      url: `http://${config.host}:${port}/`,
      shippedFormulas: SHIPPED_FORMULAS,
      demoPeople: config.mode === 'demo' ? DEMO_PEOPLE : [],
      nobodyYet: config.mode !== 'demo' && (await context.people.count()) === 0,
      mail: `${context.mail.mailer.description}; links to ${context.mail.links.base()}; reminders every ${config.reminderMinutes} min`,
    });
    for (const line of banner) console.log(line);
    // Soon after listening: the first recall PDF should not wait for the PDF code and fonts.
    void startWarmUp(warmPdf, (message) => console.error(`larderbook: ${message}`));
  });
  server.on('error', (error) => {
    console.error(`larderbook: cannot listen on ${config.host}:${config.port}: ${error.message}`);
    process.exit(1);
  });
  const stop = (): void => {
    server.close(
      () =>
        void Promise.all([reminders.stop(), deadlines.stop(), alerts.stop(), equipmentDue.stop()])
          .then(() => context.formulas.close())
          .then(() => context.mail.close())
          .then(() => context.db.close())
          .then(() => process.exit(0)),
    );
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

await main();
