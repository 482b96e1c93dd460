import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { BatchStatus } from '../../batches/batch-types';

const STATUS_WORDS: Readonly<Record<BatchStatus, string>> = {
  planned: 'Planned',
  'in-progress': 'In progress',
  curing: 'Curing',
  proofing: 'Proofing',
  done: 'Done',
  discarded: 'Discarded',
};

/** A batch status in words, as people read it: "in-progress" → "In progress". */
export function statusWords(status: BatchStatus): string {
  return STATUS_WORDS[status];
}

/** A batch's status as a small labelled chip; the colour repeats what the word says. */
@Component({
  selector: 'app-batch-status-chip',
  template: '{{ words() }}',
  styleUrl: './batch-status-chip.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[attr.data-status]': 'status()' },
})
export class BatchStatusChip {
  /** The status to show. */
  readonly status = input.required<BatchStatus>();

  protected readonly words = computed(() => statusWords(this.status()));
}
