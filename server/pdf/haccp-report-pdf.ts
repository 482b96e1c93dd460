import type { Readable } from 'node:stream';
import type {
  ReportBatch,
  ReportEquipment,
  ReportHead,
  ReportReceipt,
  ReportRefusal,
} from '../../shared/api/haccp-report.ts';
import { batchBlock, equipmentBlock, periodWords, refusalsBlock } from './haccp-report-blocks.ts';
import { receivingBlock } from './haccp-receiving-block.ts';
import {
  countedPages,
  countingSheet,
  endStreamedSheet,
  openStreamedSheet,
  type SheetSetup,
} from './sheet-document.ts';
import { INK, SMALL, type SheetLayout } from './sheet-layout.ts';
import { momentInWords } from './sheet-words.ts';

/** What the PDF is made from: the head, the batches as they are read, and the period's other records. */
export interface HaccpReportParts {
  readonly head: ReportHead;
  readonly batches: AsyncIterable<ReportBatch>;
  readonly refusals: () => Promise<readonly ReportRefusal[]>;
  readonly equipment: () => Promise<readonly ReportEquipment[]>;
  readonly receiving: () => Promise<readonly ReportReceipt[]>;
}

/** The report's records, all read before the first page is laid out. */
interface ReportContent {
  readonly head: ReportHead;
  readonly batches: readonly ReportBatch[];
  readonly refusals: readonly ReportRefusal[];
  readonly equipment: readonly ReportEquipment[];
  readonly receiving: readonly ReportReceipt[];
}

/** The report's sheet: its title, and the period in every running header and footer. */
function reportSetup(head: ReportHead): SheetSetup {
  return {
    title: `HACCP records, ${head.kitchen}`,
    subject: `HACCP records from ${head.from} to ${head.to}`,
    units: 'metric',
    created: head.producedAt.slice(0, 10),
    lot: `HACCP records ${periodWords(head)}`,
    running: periodWords(head),
  };
}

/** Lays the report out; `pause` is awaited after each batch, to let the pages written go out. */
async function layReport(
  layout: SheetLayout,
  { head, batches, refusals, equipment, receiving }: ReportContent,
  pause: () => Promise<void> = async () => undefined,
): Promise<void> {
  layout.draw(
    'LARDERBOOK · HACCP RECORDS',
    { size: 7.5, weight: 'semibold', color: INK.rust },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.gap(13);
  layout.y += layout.draw(
    head.kitchen,
    { size: 18, weight: 'semibold' },
    layout.left,
    layout.y,
    layout.width,
  );
  layout.paragraph(
    `${periodWords(head)} (times in ${head.timeZone}) · produced by ${head.producedBy}, ${momentInWords(head.producedAt)} · ${batches.length} batch(es)`,
    { size: SMALL, color: INK.muted },
    { after: 8 },
  );
  layout.paragraph(
    "Every batch started in the period, or with a process record written in it, is shown whole. A data logger's readings are summed up per control, with every one that missed the limit listed; every reading entered by hand is listed. Nothing recorded is ever changed: a correction is listed beside what it corrects.",
    { size: SMALL, color: INK.muted },
  );
  layout.rule(INK.text, 0.8);
  layout.gap(6);
  for (const batch of batches) {
    batchBlock(layout, batch);
    await pause();
  }
  if (!batches.length) layout.paragraph('No batches in the period.');
  refusalsBlock(layout, refusals);
  equipmentBlock(layout, equipment);
  receivingBlock(layout, receiving);
}

/** Batches laid out between turns of the event loop, when the pages written go out. */
const BATCHES_A_TURN = 25;
/** Bytes laid out but not yet taken by the reader, above which laying out waits. */
const UNREAD_MOST = 4 * 1024 * 1024;

/** The report as a PDF: its page count, and its bytes as they are written. */
export interface HaccpReportPdf {
  readonly pages: number;
  readonly body: Readable;
}

/**
 * The HACCP records of a period as a PDF: a head naming the kitchen, the period and who
 * produced it when; every batch whole; the refused calculations; the equipment logs. Every page
 * carries the period in its running header and "page N of M" in its footer. The report is laid
 * out twice: first only measured, to count the pages, then drawn and streamed page by page, so
 * a month of a busy kitchen (about 4,000 pages) never sits in memory as pages. The records are
 * read once, before the first pass.
 */
export async function renderHaccpReportPdf(parts: HaccpReportParts): Promise<HaccpReportPdf> {
  const batches: ReportBatch[] = [];
  for await (const batch of parts.batches) batches.push(batch);
  const content: ReportContent = {
    head: parts.head,
    batches,
    refusals: await parts.refusals(),
    equipment: await parts.equipment(),
    receiving: await parts.receiving(),
  };
  const counting = countingSheet(reportSetup(parts.head));
  await layReport(counting, content);
  const pages = countedPages(counting);
  const layout = openStreamedSheet(reportSetup(parts.head), pages);
  const { doc } = layout;
  let laid = 0;
  const pause = async (): Promise<void> => {
    if (++laid % BATCHES_A_TURN) return;
    await new Promise(setImmediate);
    while (doc.readableLength > UNREAD_MOST && !doc.destroyed)
      await new Promise((resolve) => setTimeout(resolve, 10));
    if (doc.destroyed) throw new Error('the reader went away');
  };
  layReport(layout, content, pause).then(
    () => endStreamedSheet(layout, pages),
    (error: Error) => doc.destroy(error),
  );
  return { pages, body: doc };
}
