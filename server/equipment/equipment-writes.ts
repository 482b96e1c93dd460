import { QueryTypes, type Transaction } from 'sequelize';
import { siteIdOf } from '../sites/site-scope.ts';
import type {
  EquipmentAddRequest,
  EquipmentChangeRequest,
  EquipmentControl,
  EquipmentKind,
} from '../../shared/api/equipment.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { AppError, conflict, notFound } from '../http/app-error.ts';
import { checkEquipmentControl } from '../../shared/process/check-equipment-control.ts';
import type { EquipmentRow, EquipmentRows } from './equipment-rows.ts';
import { insertNew } from '../db/insert-row.ts';

/** What the equipment writes need. */
export interface EquipmentDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly rows: EquipmentRows;
}

const auditIp = (by: ChangeOptions) => (by.ip === undefined ? {} : { ip: by.ip });

/** The equipment with this id inside a write, or 404. */
export async function equipmentIn(
  rows: EquipmentRows,
  id: number,
  t: Transaction,
): Promise<EquipmentRow> {
  const [row] = await rows.equipment(id, t);
  if (!row) throw notFound(`there is no equipment ${id}`);
  return row;
}

/** 422 naming the field, when the control does not pass the formula checks. */
function refuseBadControl(name: string, kind: EquipmentKind, control: EquipmentControl): void {
  const problems = checkEquipmentControl(name, kind, control);
  if (problems.length > 0)
    throw new AppError(
      422,
      'bad-control',
      `The control cannot be used: ${problems.join('; ')}.`,
      problems.map((message) => ({ field: 'control', message })),
    );
}

/**
 * Whether another piece of equipment at the same site has the name (names are unique within a
 * site, migration 022): the site of the piece being renamed, else the site it is added at.
 */
async function nameTaken(
  db: Database,
  t: Transaction,
  name: string,
  site: number,
  id = 0,
): Promise<boolean> {
  const [row] = await db.sequelize.query<{ id: number }>(
    `SELECT id FROM equipment WHERE name = ? AND id <> ?
       AND site_id = COALESCE((SELECT site_id FROM equipment WHERE id = ?), ?)`,
    { replacements: [name, id, id, site], type: QueryTypes.SELECT, transaction: t },
  );
  return row !== undefined;
}

const taken = (name: string): AppError =>
  conflict('name-taken', `There is already equipment called “${name}”: choose another name.`, [
    { field: 'name' },
  ]);

/** Adds a piece of equipment, audited 'equipment-add'. */
export async function addEquipment(
  { db, audit, rows }: EquipmentDeps,
  request: EquipmentAddRequest,
  by: ChangeOptions & { at: string },
): Promise<EquipmentRow> {
  const name = request.name.trim();
  refuseBadControl(name, request.kind, request.control);
  return db.write(async (t) => {
    if (await nameTaken(db, t, name, siteIdOf(by.site))) throw taken(name);
    const insertedId = await insertNew(
      db,
      `INSERT INTO equipment (name, kind, control, active, created_at, site_id)
       VALUES (?, ?, ?, 1, ?, ?)`,
      [name, request.kind, JSON.stringify(request.control), by.at, siteIdOf(by.site)],
      t,
    );
    if (by.audit !== false)
      await audit.append(
        {
          actor: by.actor,
          action: 'equipment-add',
          subject: name,
          detail: { equipment: insertedId, kind: request.kind, control: request.control },
          ...auditIp(by),
        },
        t,
      );
    return equipmentIn(rows, insertedId, t);
  });
}

/**
 * Renames, changes the control of, retires or brings back a piece of equipment, audited
 * 'equipment-change' with each field's old and new value. A change of the limit needs a reason.
 * Readings already taken keep the judgement they got: their deviations stay as opened.
 */
export async function changeEquipment(
  { db, audit, rows }: EquipmentDeps,
  id: number,
  request: EquipmentChangeRequest,
  by: ChangeOptions,
): Promise<EquipmentRow> {
  return db.write(async (t) => {
    const before = await equipmentIn(rows, id, t);
    const name = request.name?.trim() ?? before.name;
    const control = request.control ?? before.control;
    const active = request.active ?? before.active;
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    if (name !== before.name) changed['name'] = { from: before.name, to: name };
    if (JSON.stringify(control) !== JSON.stringify(before.control))
      changed['control'] = { from: before.control, to: control };
    if (active !== before.active) changed['active'] = { from: before.active, to: active };
    if (Object.keys(changed).length === 0) return before;
    if (changed['control']) {
      refuseBadControl(name, before.kind, control);
      if (!request.reason?.trim())
        throw new AppError(
          422,
          'reason-needed',
          'Say why the limit or its schedule changes: the HACCP records keep the reason.',
          [{ field: 'reason' }],
        );
    }
    if (changed['name'] && (await nameTaken(db, t, name, siteIdOf(by.site), id))) throw taken(name);
    await db.sequelize.query(
      'UPDATE equipment SET name = ?, control = ?, active = ? WHERE id = ?',
      {
        replacements: [name, JSON.stringify(control), active ? 1 : 0, id],
        transaction: t,
      },
    );
    await audit.append(
      {
        actor: by.actor,
        action: 'equipment-change',
        subject: name,
        detail: {
          equipment: id,
          ...changed,
          ...(request.reason?.trim() ? { reason: request.reason.trim() } : {}),
        },
        ...auditIp(by),
      },
      t,
    );
    return equipmentIn(rows, id, t);
  });
}
