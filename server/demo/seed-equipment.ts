import { QueryTypes, type Transaction } from 'sequelize';
import type { EquipmentControl, EquipmentKind } from '../../shared/api/equipment.ts';
import type { AppContext } from '../app-context.ts';
import { insertNew } from '../db/insert-row.ts';

/** One piece of the invented kitchen's equipment and its recent readings, °C, oldest first. */
interface DemoEquipment {
  readonly name: string;
  readonly kind: EquipmentKind;
  readonly control: EquipmentControl;
  /** Hours between the demo's readings (a thermometer's: how long ago it was checked). */
  readonly everyHours: number;
  readonly values: readonly string[];
}

const HOUR_MS = 3_600_000;

/** The Quillmoor Smokehouse's equipment (invented), with a few days of in-range readings. */
const DEMO_EQUIPMENT: readonly DemoEquipment[] = [
  {
    name: 'Walk-in cooler',
    kind: 'cooler',
    control: { rule: 'cold-holding', every: '4 h' },
    everyHours: 4,
    values: ['3.1', '3.4', '2.8', '3.9', '3.3', '4.2', '3.6', '2.9', '3.5', '3.0', '3.8', '3.2'],
  },
  {
    name: 'Chest freezer',
    kind: 'freezer',
    control: {
      // source: USDA FSIS fact sheet "Freezing and Food Safety", "Is Frozen Food Safe?": food
      // stored constantly at 0 °F or below will always be safe (the limit kept in °F, exactly)
      limit: { max: '0 °F' },
      source:
        'USDA FSIS, “Freezing and Food Safety”, Is Frozen Food Safe?: food stored constantly at 0 °F or below will always be safe',
      every: '12 h',
    },
    everyHours: 12,
    values: ['-20.5', '-19.8', '-21.2', '-20.1', '-19.5', '-20.8'],
  },
  {
    name: 'Smoker',
    kind: 'smoker',
    control: {
      limit: { min: '60 °C', max: '80 °C' },
      source: 'Quillmoor smoker validation, 2026',
      every: '2 h',
    },
    everyHours: 2,
    values: ['66.5', '71.0', '74.5', '72.0', '69.5'],
  },
  {
    name: 'Hot-holding cabinet',
    kind: 'hot-holding',
    control: { rule: 'hot-holding', every: '2 h' },
    everyHours: 2,
    values: ['63.0', '65.5', '61.5', '64.0', '66.0', '62.5'],
  },
  {
    name: 'Probe thermometer 1',
    kind: 'thermometer',
    control: { every: '168 h' },
    everyHours: 72,
    values: ['0.3'],
  },
  {
    name: 'Probe thermometer 2',
    kind: 'thermometer',
    control: { every: '168 h' },
    everyHours: 120,
    values: ['-0.4'],
  },
];

/**
 * The demo kitchen's walk-in cooler, freezer, smoker, hot-holding cabinet and two thermometers,
 * with a few days of readings up to shortly before now and one ice-point check each. One write
 * of plain rows, no audit entries (they are history): fast, and the same for the same clock.
 */
export async function seedEquipment(context: AppContext): Promise<void> {
  const { db } = context;
  // The latest reading was taken 40 minutes before the last whole ten minutes.
  const tenMinutes = 10 * 60_000;
  const latest = Math.floor(context.now().getTime() / tenMinutes) * tenMinutes - 4 * tenMinutes;
  await db.write(async (t) => {
    const [cook] = await db.sequelize.query<{ id: number }>(
      "SELECT id FROM people WHERE username = 'tobin'",
      { type: QueryTypes.SELECT, transaction: t },
    );
    const by = cook?.id ?? null;
    for (const item of DEMO_EQUIPMENT) {
      const first =
        item.kind === 'thermometer'
          ? latest - item.everyHours * HOUR_MS
          : latest - (item.values.length - 1) * item.everyHours * HOUR_MS;
      const created = new Date(first - item.everyHours * HOUR_MS).toISOString();
      const id = await insertEquipment(context, t, item, created);
      const at = (index: number) =>
        new Date(first + index * item.everyHours * HOUR_MS).toISOString();
      if (item.kind === 'thermometer') {
        await db.sequelize.query(
          `INSERT INTO calibrations (equipment_id, checked_at, reading, outcome, note, recorded_by, recorded_at)
           VALUES (?, ?, ?, 'ok', 'Crushed ice and water, stirred; read after a minute.', ?, ?)`,
          { replacements: [id, at(0), item.values[0], by, at(0)], transaction: t },
        );
        continue;
      }
      const rows = item.values.map((value, index) => [id, at(index), value, by, at(index)]);
      await db.sequelize.query(
        `INSERT INTO readings (equipment_id, control, taken_at, value, source, recorded_by, recorded_at)
         VALUES ${rows.map(() => "(?, 'log', ?, ?, 'console', ?, ?)").join(', ')}`,
        { replacements: rows.flat(), transaction: t },
      );
    }
  });
}

async function insertEquipment(
  { db }: AppContext,
  t: Transaction,
  item: DemoEquipment,
  createdAt: string,
): Promise<number> {
  const rowId = await insertNew(
    db,
    'INSERT INTO equipment (name, kind, control, active, created_at) VALUES (?, ?, ?, 1, ?)',
    [item.name, item.kind, JSON.stringify(item.control), createdAt],
    t,
  );
  return rowId;
}
