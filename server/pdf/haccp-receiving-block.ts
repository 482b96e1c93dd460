import type { ReportReceipt } from '../../shared/api/haccp-report.ts';
import { byWords, deviationsBlock, header, valueWords } from './haccp-report-blocks.ts';
import { INK, SMALL, type SheetLayout } from './sheet-layout.ts';
import { heading } from './sheet-sections.ts';

const DECISION_WORDS: Readonly<Record<string, string>> = {
  accepted: 'taken in',
  'accepted-with-action': 'taken in with a corrective action',
  refused: 'refused',
};

/** The period's deliveries at the door: temperature against limit, what was done, deviations. */
export function receivingBlock(layout: SheetLayout, receiving: readonly ReportReceipt[]): void {
  heading(layout, 'Receiving');
  if (!receiving.length) return layout.paragraph('None in the period.', { size: SMALL });
  layout.table(
    [{ width: 2.6 }, { width: 3.6 }, { width: 1.8, align: 'right' }, { width: 5 }],
    header('Received', 'Delivery', 'Temperature', 'Found against the limit, and done'),
    receiving.map((r) => ({
      cells: [
        byWords(r.by, r.receivedAt),
        `${r.lotCode}: ${r.itemName}, ${r.supplier} lot ${r.supplierLot}${r.establishment ? `, ${r.establishment}` : ''}`,
        r.temperatureC === null ? '–' : valueWords(r.temperatureC, '°C'),
        `${r.found}; ${DECISION_WORDS[r.decision] ?? r.decision}${r.note ? `. ${r.note}` : ''}${r.limitSource ? ` (${r.limitSource})` : ''}`,
      ],
      ...(r.decision === 'accepted' ? {} : { fill: INK.failTint }),
    })),
  );
  deviationsBlock(
    layout,
    receiving.flatMap((r) => r.deviations),
  );
}
