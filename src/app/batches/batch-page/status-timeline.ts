import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { statusInWords } from '../../../../shared/workflow/batch-status.ts';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { BatchEvent } from '../batch-types';

/** An event as the timeline says it. */
interface TimelineEntry {
  readonly type: BatchEvent['type'];
  readonly icon: string;
  readonly what: string;
  readonly by: string;
  readonly at: string;
  readonly reasonLabel: string;
  readonly reason: string | null;
}

const ICONS: Readonly<Record<BatchEvent['type'], string>> = {
  recorded: 'edit_note',
  status: 'arrow_forward',
  'sign-off': 'verified',
  note: 'sticky_note_2',
};

/**
 * What happened to a batch, oldest first: who recorded it, each status move (from → to, with the
 * reason for a discard), the sign-off and notes. Nothing about a batch changes without an event.
 */
@Component({
  selector: 'app-status-timeline',
  imports: [MatIcon, IsoDayPipe],
  templateUrl: './status-timeline.html',
  styleUrl: './status-timeline.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusTimeline {
  /** The batch's events, oldest first. */
  readonly events = input.required<readonly BatchEvent[]>();

  protected readonly entries = computed(() => this.events().map(entryOf));
}

function entryOf(event: BatchEvent): TimelineEntry {
  const words = (status: BatchEvent['to']): string => (status ? statusInWords(status) : '—');
  const what =
    event.type === 'recorded'
      ? `Recorded as ${words(event.to)}`
      : event.type === 'status'
        ? `${words(event.from)} → ${words(event.to)}`
        : event.type === 'sign-off'
          ? 'Signed off'
          : 'Note';
  return {
    type: event.type,
    icon: event.type === 'status' && event.to === 'discarded' ? 'delete' : ICONS[event.type],
    what,
    by: event.by?.displayName ?? 'the system',
    at: event.at,
    reasonLabel: event.type === 'status' ? 'Reason' : 'Note',
    reason: event.reason,
  };
}
