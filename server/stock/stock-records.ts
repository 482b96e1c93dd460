import type {
  Receipt,
  ReceiptPage,
  ReceiptRequest,
  ReceivingItem,
  StockView,
} from '../../shared/api/receipt.ts';
import { RECEIVED_UNITS, baseMeasureOf } from '../../shared/stock/base-measure.ts';
import { receivingLimit } from '../../shared/stock/receiving-limit.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import type { ProcessDeps } from '../process/judge-and-open.ts';
import { CatalogueItems } from './catalogue-items.ts';
import {
  listReceipts,
  receiptLotOf,
  showReceipt,
  stockOnHand,
  type ReceiptQuery,
} from './receipt-reads.ts';
import { discardReceipt, receive, receiveAll, type StockDeps } from './receipt-writes.ts';
import { itemWords } from '../../shared/catalogue/item-words.ts';

/** Receiving and stock by lot, as record keeping offers them to the API and the command. */
export interface StockUseCases {
  receive(request: ReceiptRequest, by: ChangeOptions): Promise<Receipt>;
  /** Several deliveries in one write, all or nothing; their lot codes. */
  receiveAll(
    deliveries: readonly { readonly request: ReceiptRequest; readonly by: ChangeOptions }[],
  ): Promise<string[]>;
  /** A page of deliveries; with a site, that site's only. */
  list(query: ReceiptQuery, site?: SiteScope): Promise<ReceiptPage>;
  show(lot: string): Promise<Receipt>;
  /** What is on hand; with a site, that site's lots only. */
  stock(today: string, site?: SiteScope): Promise<StockView>;
  discard(lot: string, reason: string, by: ChangeOptions): Promise<Receipt>;
  items(): Promise<ReceivingItem[]>;
}

/** The use cases over the process records and the catalogue in the formulas folder. */
export function stockUseCases(process: ProcessDeps, formulasFolder: string): StockUseCases {
  const deps: StockDeps = { ...process, catalogue: new CatalogueItems(formulasFolder) };
  return {
    receive: async (request, by) => showReceipt(deps, await receive(deps, request, by)),
    receiveAll: (deliveries) => receiveAll(deps, deliveries),
    list: (query, site) => listReceipts(deps, query, site),
    show: (lot) => showReceipt(deps, lot),
    stock: (today, site) => stockOnHand(deps, today, site),
    items: async () =>
      [...(await deps.catalogue.items()).values()]
        .filter((item) => item.kind !== 'water')
        .map((item) => {
          const limit = receivingLimit(item.kind, false, item.shelf_stable);
          const frozen = receivingLimit(item.kind, true, item.shelf_stable);
          return {
            key: item.key,
            name: itemWords(item),
            kind: item.kind,
            unit: item.unit,
            units: RECEIVED_UNITS.filter((u) => baseMeasureOf(u) === baseMeasureOf(item.unit)),
            establishment: item.kind === 'meat' || item.kind === 'poultry',
            temperature: limit.maxC !== undefined,
            limit: { words: limit.words, source: limit.source },
            frozenLimit: { words: frozen.words, source: frozen.source },
          };
        })
        .sort((a, b) => a.name.localeCompare(b.name)),
    discard: async (lot, reason, by) => {
      const code = receiptLotOf(lot);
      await discardReceipt(deps, code, reason, by);
      return showReceipt(deps, code);
    },
  };
}
