import type { RecallReport, TraceNode, TracedReceipt } from '../../shared/api/trace-record.ts';
import { recallReport } from '../trace/recall-report.ts';

/** An invented delivery of the demo kitchen, recalled in the warm-up report. */
const LOT: TracedReceipt = {
  kind: 'receipt',
  lotCode: 'R261201-01',
  item: 'pork-belly',
  itemName: 'Pork belly',
  supplier: 'Hollin Vale Farm',
  supplierLot: 'HV-0001',
  establishment: 'EST. 38214',
  packedOn: '2026-11-28',
  useBy: '2026-12-08',
  receivedOn: '2026-12-01',
  amount: '10000',
  remaining: '2000',
  measure: 'g',
  emptiedOn: null,
  decision: 'accepted',
};

/** How many batches the warm-up report names: enough for its table to run onto a second page. */
const WARM_UP_BATCHES = 40;

/**
 * A recall report that draws what a real one draws: a head, a lot, the table of batches over
 * more than one page, totals, the tree, and a name in the Latin Extended font as well as Latin.
 */
export function warmUpReport(): RecallReport {
  const use = { item: 'pork-belly', amount: '250', measure: 'g' as const, usedOn: '2026-12-01' };
  const batch = (lotCode: string, title: string, level: number): TraceNode => ({
    lot: {
      kind: 'batch',
      lotCode,
      formula: { id: 'warm-up', title },
      status: 'curing',
      startedOn: '2026-12-01',
      readyOn: '2026-12-08',
      serviceDay: null,
    },
    level,
    use,
    children: [],
  });
  const two = (n: number) => String(n).padStart(2, '0');
  const root: TraceNode = {
    lot: LOT,
    level: 0,
    children: Array.from({ length: WARM_UP_BATCHES / 2 }, (_, i) => ({
      ...batch(`261201-QB-${two(i + 1)}`, i % 2 ? 'Quillmoor belly' : 'Kiełbasa', 1),
      children: [batch(`261208-SL-${two(i + 1)}`, 'Sliced bacon', 2)],
    })),
  };
  return recallReport(
    {
      direction: 'forward',
      searched: { supplierLot: LOT.supplierLot },
      roots: [root],
      batches: WARM_UP_BATCHES,
      incomplete: false,
    },
    {
      kitchen: 'Quillmoor Smokehouse',
      producedBy: 'Larderbook',
      producedAt: '2026-12-03T10:00:00.000Z',
      today: '2026-12-03',
    },
  );
}

/**
 * Produces one recall report as a PDF and throws it away: the PDF code is loaded (its own chunk
 * of the bundle), the fonts unwrapped and the layout code compiled, which the first real PDF of
 * a server would otherwise wait for (over a second on a busy machine).
 */
export async function warmPdf(): Promise<void> {
  const { renderRecallReportPdf } = await import('./recall-report-pdf.ts');
  await renderRecallReportPdf(warmUpReport());
}

/**
 * How long after the server listens the warm-up waits: its jobs' first runs at start (deadlines,
 * reminders, alerts) go first, as they did before there was a warm-up.
 */
export const WARM_UP_AFTER_MS = 2000;

/**
 * Starts the warm-up a little later, so it never delays whatever called it (the server's start)
 * nor the jobs that run at start, and never fails it: a failure is only logged, and the first
 * real PDF then loads what it needs itself.
 * @param afterMs how long to wait first
 * @returns the warm-up's end, which never rejects
 */
export function startWarmUp(
  warm: () => Promise<void>,
  log: (message: string) => void,
  afterMs = WARM_UP_AFTER_MS,
): Promise<void> {
  return new Promise<void>((resolve) => setTimeout(resolve, afterMs))
    .then(warm)
    .catch((error: unknown) => {
      const reason = error instanceof Error ? error.message : String(error);
      log(`the PDF code was not prepared ahead (the first PDF will take longer): ${reason}`);
    });
}
