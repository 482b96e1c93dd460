import type { AppContext } from '../app-context.ts';
import { DEFAULT_SITE_NAME, MAIN_SITE_KEY } from '../sites/main-site.ts';
import { SiteRepository } from '../sites/site-repository.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import { DEMO_SHOP, DEMO_SHOP_COOK } from './demo-people.ts';
import { seedBatchPlan, type DemoBatch } from './seed-batches.ts';
import { dayOfProcess, readings, seedingOf } from './seed-process.ts';

/**
 * The second shop's last ten days: hot links and burger grind for its counter, sauce and buns.
 * Fewer and smaller than the smokehouse's, so its batch log is plainly another kitchen's.
 */
const SHOP_BATCHES: readonly DemoBatch[] = [
  { formula: 'hot-link-cure', day: -9, batch: { meat: '6200 g' } },
  { formula: 'chuck-grind', day: -5, batch: { total: '9000 g' } },
  { formula: 'house-sauce', day: -4, batch: { total: '1500 g' } },
  {
    formula: 'pit-bun',
    day: -3,
    batch: { pieces: '36', room: '22C', flourTemp: '20C', prefermentTemp: '19C', tap: '16C' },
  },
  { formula: 'hot-link-cure', day: -2, batch: { meat: '5800 g' } },
  { formula: 'chuck-grind', day: -1, batch: { total: '8400 g' } },
];

/**
 * Adds the demo group's second shop (after the smokehouse's own records, so those and their lot
 * codes are the same as in a demo of one site): the site, its cook (a cook there and nowhere
 * else), its batches and the smoker readings of its first hot links. Imke, the group's reviewer,
 * signs off there as at the smokehouse.
 * @returns the shop's lot codes, in the order they were recorded
 */
export async function seedShop(context: AppContext, now = new Date()): Promise<string[]> {
  const imke = await context.people.findByUsername('imke');
  if (!imke) return [];
  const sites = new SiteRepository(context.db);
  const { site, maren } = await context.db.write(async (transaction) => {
    // The smokehouse is named as the demo names its kitchen, beside its shop (the first site
    // takes LARDER_KITCHEN's name when set, else a name that says nothing of the demo).
    const main = await sites.byKey(MAIN_SITE_KEY, transaction);
    if (main?.name === DEFAULT_SITE_NAME)
      await sites.rename(main.id, context.config.kitchenName, transaction);
    const added = await sites.add(DEMO_SHOP.key, DEMO_SHOP.name, transaction);
    const cook = await context.people.add(DEMO_SHOP_COOK, transaction);
    await context.people.update(cook.id, { roleEverywhere: false }, transaction);
    await sites.setRoles(cook.id, [{ siteId: added.id, role: 'cook' }], transaction);
    return { site: added, maren: cook };
  });
  const scope: SiteScope = { id: site.id, key: site.key, name: site.name, filters: true };
  const crew = { tobin: maren, rosa: maren, imke };
  const lots = await seedBatchPlan(context, SHOP_BATCHES, crew, { now, site: scope });
  // The first hot links' smoke, the day after they were stuffed: the chamber kept to its band.
  const links = lots[0];
  if (links) {
    const seeding = seedingOf(context, { tobin: maren, imke }, now);
    const controls = await seeding.deps.process.controlsOf(await seeding.deps.process.batch(links));
    const smoker = controls.filter((control) => control.measure === 'chamber-temperature');
    const smoke = new Date(Date.parse(`${seeding.today}T09:00:00Z`) - 8 * 86_400_000);
    const points = dayOfProcess(smoker, { smoke: smoke.toISOString() });
    if (points.length) await readings(seeding, links, points, points.at(-1)!.point.at);
  }
  return lots;
}
