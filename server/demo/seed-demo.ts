import type { AppContext } from '../app-context.ts';
import { DEMO_PEOPLE } from './demo-people.ts';
import { seedAssemblies } from './seed-assemblies.ts';
import { seedBatches } from './seed-batches.ts';
import { seedDeliveries } from './seed-deliveries.ts';
import { seedDemoLotUses } from './demo-lot-uses.ts';
import { seedEquipment } from './seed-equipment.ts';
import { seedProcess } from './seed-process.ts';
import { seedShop } from './seed-shop.ts';

/**
 * Fills an empty demo database with the invented kitchen's people, a few weeks of their batches
 * and of the deliveries they could be made from, the packs and burgers made from those batches,
 * the process records of a few of them and a few days of their equipment logs, then (unless
 * LARDER_DEMO_SITES is 1) the group's second shop. Runs only in demo mode and only when there is nobody yet, so
 * restarting the demo keeps what was done in it.
 */
export async function seedDemo(context: AppContext): Promise<{ seeded: boolean }> {
  if ((await context.people.count()) > 0) return { seeded: false };
  await context.db.write(async (transaction) => {
    for (const person of DEMO_PEOPLE) await context.people.add(person, transaction);
  });
  await seedBatches(context);
  await seedDeliveries(context);
  await seedProcess(context);
  // After the deliveries and the weights as weighed: the batches draw on the lots first to expire.
  await seedDemoLotUses(context);
  // The packs and burgers made from those batches, drawing on the batches named for them.
  await seedAssemblies(context);
  await seedEquipment(context);
  // Last, so the smokehouse's records and lot codes are those of a demo of one site.
  if (context.config.demoSites === 2) await seedShop(context);
  return { seeded: true };
}
