import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { statusInWords } from '../../../../shared/workflow/batch-status.ts';
import type { BatchStatus } from '../../batches/batch-types';

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

  protected readonly words = computed(() => statusInWords(this.status()));
}
