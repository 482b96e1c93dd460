import type { AppContext } from '../app-context.ts';
import { demoPeople } from '../demo/demo-people.ts';
import { SHIPPED_FORMULAS } from '../demo/demo-formulas.ts';
import { startBanner } from '../start-banner.ts';

/**
 * Prints the start banner for a server listening on `port`: once per start, by the one process
 * or by the primary of several (`processes` > 1 adds a line saying how many serve the port).
 */
export async function printStartBanner(
  context: AppContext,
  port: number,
  processes = 1,
): Promise<void> {
  const { config } = context;
  // Links in messages need the port.
  context.mail.links.listeningOn(port);
  const banner = startBanner({
    config,
    url: `http://${config.host}:${port}/`,
    shippedFormulas: SHIPPED_FORMULAS,
    demoPeople: config.mode === 'demo' ? demoPeople(config.demoSites) : [],
    nobodyYet: config.mode !== 'demo' && (await context.people.count()) === 0,
    mail: `${context.mail.mailer.description}; links to ${context.mail.links.base()}; reminders every ${config.reminderMinutes} min`,
  });
  /* eslint-disable no-console -- the server talks to whoever started it */
  if (processes > 1)
    console.log(
      `Processes: ${processes} sharing the port (LARDER_PROCESSES); jobs run in the first`,
    );
  for (const line of banner) console.log(line);
  /* eslint-enable no-console */
}
