import { Router, type Request } from 'express';
import type { ReceiptRequest } from '../../shared/api/receipt.ts';
import { RECEIVED_UNITS } from '../../shared/stock/base-measure.ts';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import { serverToday } from '../server-today.ts';
import type { ReceiptQuery } from './receipt-reads.ts';

const TEXT = { type: 'string', minLength: 1, maxLength: 120, pattern: '\\S' } as const;
const LONG = { type: 'string', minLength: 1, maxLength: 500, pattern: '\\S' } as const;
const DAY = { type: 'string', maxLength: 10 } as const;
const NUMBER = { type: 'string', minLength: 1, maxLength: 20 } as const;

const ACTION = {
  type: 'object',
  additionalProperties: false,
  required: ['cause', 'restored', 'prevention', 'disposition'],
  properties: {
    cause: LONG,
    restored: LONG,
    prevention: LONG,
    disposition: { enum: ['rechilled', 'reworked', 'diverted', 'discarded', 'recooked'] },
    grams: { type: 'string', maxLength: 40 },
  },
} as const;

const RECEIPT_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['item', 'supplier', 'supplierLot', 'quantity', 'unit'],
  properties: {
    item: { type: 'string', minLength: 1, maxLength: 40 },
    supplier: TEXT,
    supplierLot: TEXT,
    establishment: { type: 'string', maxLength: 40 },
    packedOn: DAY,
    useBy: DAY,
    quantity: NUMBER,
    unit: { enum: RECEIVED_UNITS },
    unitCost: { type: 'string', maxLength: 20 },
    temperature: { type: 'string', maxLength: 40 },
    shippedFrozen: { type: 'boolean' },
    frozenSolid: { type: 'boolean' },
    decision: { enum: ['refuse', 'accept'] },
    action: ACTION,
    note: { type: 'string', maxLength: 500 },
  },
} as const;

const DISCARD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['reason'],
  properties: { reason: { type: 'string', maxLength: 500 } },
} as const;

/**
 * /api/receipts: deliveries received at the door. Everyone signed in reads; cooks and admins
 * receive and discard (reviewers read only).
 */
export function receiptsRouter(context: AppContext): Router {
  const { records } = context;
  const router = Router();
  const receivers = requireRole('admin', 'cook');
  const lotOf = (req: Request) => String(req.params['lot']);

  router.get(
    '/',
    allowQuery('item', 'supplier', 'supplierLot', 'from', 'to', 'page', 'pageSize'),
    async (req, res) => {
      res.json(await records.listReceipts(req.query as ReceiptQuery, siteOf(req)));
    },
  );

  router.post('/', receivers, validateBody(RECEIPT_BODY), async (req, res) => {
    const receipt = await records.receive(req.body as ReceiptRequest, changeBy(req, context));
    res.status(201).json({ receipt });
  });

  router.get('/:lot', allowQuery(), async (req, res) => {
    res.json({ receipt: await records.showReceipt(lotOf(req)) });
  });

  router.post('/:lot/discard', receivers, validateBody(DISCARD_BODY), async (req, res) => {
    const { reason } = req.body as { reason: string };
    res.json({
      receipt: await records.discardReceipt(lotOf(req), reason, changeBy(req, context)),
    });
  });

  return router;
}

/**
 * GET /api/stock: what is on hand by item, first to expire first; GET /api/stock/items: the
 * catalogue's items with their receiving limits, for the receiving form. Everyone signed in.
 */
export function stockRouter(context: AppContext): Router {
  const router = Router();
  router.get('/items', allowQuery(), async (_req, res) => {
    res.json({ items: await context.records.receivingItems() });
  });
  router.get('/', allowQuery(), async (req, res) => {
    res.json(await context.records.stockOnHand(serverToday(context), siteOf(req)));
  });
  return router;
}
