import { Router, type Request } from 'express';
import type {
  CalibrationRequest,
  EquipmentAddRequest,
  EquipmentChangeRequest,
  EquipmentLog,
  EquipmentReadingRequest,
} from '../../shared/api/equipment.ts';
import { EQUIPMENT_KINDS } from '../../shared/api/equipment.ts';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { badRequest, notFound } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import { recordCalibration, recordEquipmentReading } from './equipment-entries.ts';
import { logPeriod } from './equipment-period.ts';
import { EquipmentRows } from './equipment-rows.ts';
import { byNextDue, viewOf } from './equipment-view.ts';
import { addEquipment, changeEquipment, type EquipmentDeps } from './equipment-writes.ts';

const TEXT = { type: 'string', minLength: 1, maxLength: 200 } as const;
const NAME = { type: 'string', minLength: 1, maxLength: 80, pattern: '\\S' } as const;

/** A control in the formula's syntax; what it says is checked by the formula checks. */
const CONTROL = {
  type: 'object',
  additionalProperties: false,
  required: ['every'],
  properties: {
    every: { type: 'string', minLength: 1, maxLength: 40 },
    measure: { enum: ['chamber-temperature', 'internal-temperature'] },
    rule: { type: 'string', minLength: 1, maxLength: 60 },
    limit: {
      type: 'object',
      additionalProperties: false,
      minProperties: 1,
      properties: {
        max: { type: 'string', maxLength: 40 },
        min: { type: 'string', maxLength: 40 },
      },
    },
    source: { type: 'string', minLength: 1, maxLength: 300 },
    if_missed: { type: 'string', minLength: 1, maxLength: 300 },
  },
} as const;

const ADD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['name', 'kind', 'control'],
  properties: { name: NAME, kind: { enum: EQUIPMENT_KINDS }, control: CONTROL },
} as const;

const CHANGE_BODY = {
  type: 'object',
  additionalProperties: false,
  minProperties: 1,
  properties: { name: NAME, control: CONTROL, active: { type: 'boolean' }, reason: TEXT },
} as const;

const AT = { type: 'string', minLength: 10, maxLength: 40 } as const;

const READING_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['value'],
  properties: { value: { type: 'string', minLength: 1, maxLength: 40 }, at: AT },
} as const;

const CALIBRATION_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['reading', 'outcome'],
  properties: {
    reading: { type: 'string', minLength: 1, maxLength: 40 },
    outcome: { enum: ['ok', 'adjusted', 'retired'] },
    note: { type: 'string', maxLength: 500 },
    at: AT,
  },
} as const;

/** The :id of a route, or 404. */
function idOf(req: Request): number {
  const id = Number(req.params['id']);
  if (!Number.isSafeInteger(id) || id < 1)
    throw notFound(`there is no equipment ${String(req.params['id'])}`);
  return id;
}

/**
 * /api/equipment: equipment logged on a schedule and thermometers checked in ice water. Everyone
 * signed in reads; admins add, rename, change the control of and retire equipment; admins, cooks
 * and reviewers record readings and ice-point checks.
 */
export function equipmentRouter(context: AppContext): Router {
  const { db, audit, now } = context;
  const rows = new EquipmentRows(db);
  const deps: EquipmentDeps = { db, audit, rows };
  const router = Router();
  const admin = requireRole('admin');
  const recorders = requireRole('admin', 'cook', 'reviewer');
  const by = (req: Request) => ({ ...changeBy(req, context), at: now().toISOString() });
  const view = async (id: number, req: Request) => {
    const [row] = await rows.equipment(id, undefined, siteOf(req));
    if (!row) throw notFound(`there is no equipment ${id}`);
    return viewOf(rows, row, now());
  };

  router.get('/', allowQuery(), async (req, res) => {
    const at = now();
    const atSite = await rows.equipment(undefined, undefined, siteOf(req));
    const all = await Promise.all(atSite.map((row) => viewOf(rows, row, at)));
    res.json({ equipment: all.sort(byNextDue) });
  });

  router.post('/', admin, validateBody(ADD_BODY), async (req, res) => {
    const row = await addEquipment(deps, req.body as EquipmentAddRequest, by(req));
    res.status(201).json({ equipment: await viewOf(rows, row, now()) });
  });

  router.patch('/:id', admin, validateBody(CHANGE_BODY), async (req, res) => {
    const row = await changeEquipment(deps, idOf(req), req.body as EquipmentChangeRequest, by(req));
    res.json({ equipment: await viewOf(rows, row, now()) });
  });

  router.post('/:id/readings', recorders, validateBody(READING_BODY), async (req, res) => {
    const id = idOf(req);
    const source = req.authVia === 'session' ? 'console' : 'api';
    const written = await recordEquipmentReading(
      deps,
      id,
      req.body as EquipmentReadingRequest,
      source,
      by(req),
    );
    res.status(201).json({
      reading: await rows.reading(written.readingId),
      equipment: await view(id, req),
      deviation: written.deviationId === null ? null : await rows.deviation(written.deviationId),
    });
  });

  router.post('/:id/calibrations', recorders, validateBody(CALIBRATION_BODY), async (req, res) => {
    const id = idOf(req);
    const written = await recordCalibration(deps, id, req.body as CalibrationRequest, by(req));
    res
      .status(201)
      .json({ calibration: await rows.calibration(written), equipment: await view(id, req) });
  });

  router.get('/:id/log', allowQuery('from', 'to'), async (req, res) => {
    const equipment = await view(idOf(req), req);
    const period = logPeriod(req.query as { from?: string; to?: string }, now());
    if (typeof period === 'string') throw badRequest(period, [{ field: 'from' }]);
    const id = equipment.id;
    const log: EquipmentLog = {
      equipment,
      ...period,
      readings: await rows.readings(id, period),
      deviations: await rows.deviations(id, period),
      calibrations: await rows.calibrations(id, period),
    };
    res.json(log);
  });

  return router;
}
