import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { TraceNode, TracedBatch } from '../../shared/api/trace-record.ts';
import { pdfText } from '../../tests/helpers/pdf-text.ts';
import { recallReport } from '../trace/recall-report.ts';
import { renderRecallReportPdf } from './recall-report-pdf.ts';

const batch = (lotCode: string): TracedBatch => ({
  kind: 'batch',
  lotCode,
  formula: { id: 'quillmoor-belly', title: 'Quillmoor belly' },
  status: 'done',
  startedOn: '2026-12-01',
  readyOn: '2026-12-08',
  serviceDay: null,
});
const use = { item: 'pork-belly', amount: '3500', measure: 'g' as const, usedOn: '2026-12-01' };

describe('the recall report as a PDF', () => {
  it('should list every batch in its table but stop the tree at 300 lines, saying how many more', async () => {
    // One received lot into 160 batches, each made into one more: 321 lines of tree.
    const children: TraceNode[] = Array.from({ length: 160 }, (_, i) => ({
      lot: batch(`261201-QB-${100 + i}`),
      level: 1,
      use,
      children: [{ lot: batch(`261202-SL-${100 + i}`), level: 2, use, children: [] }],
    }));
    const root: TraceNode = {
      lot: {
        kind: 'receipt',
        lotCode: 'R261201-91',
        item: 'pork-belly',
        itemName: 'Pork belly',
        supplier: 'Hollin Farm',
        supplierLot: 'HF-4471',
        establishment: null,
        packedOn: null,
        useBy: null,
        receivedOn: '2026-12-01',
        amount: '700000',
        remaining: '0',
        measure: 'g',
        emptiedOn: '2026-12-02',
        decision: 'accepted',
      },
      level: 0,
      children,
    };
    const report = recallReport(
      {
        direction: 'forward',
        searched: { supplierLot: 'HF-4471' },
        roots: [root],
        batches: 400,
        incomplete: false,
      },
      {
        kitchen: 'Quillmoor Smokehouse',
        producedBy: 'Imke',
        producedAt: '2026-12-03T10:00:00.000Z',
        today: '2026-12-03',
      },
    );
    assert.equal(report.batches.length, 320);
    const { all } = await pdfText(await renderRecallReportPdf(report));
    assert.ok(all.includes('261202-SL-259'), 'the last batch is in the table');
    assert.ok(all.includes('The tree goes on for 21 more line(s)'), all.slice(-600));
  });
});
