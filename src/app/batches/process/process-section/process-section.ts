import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { firstValueFrom } from 'rxjs';
import { SessionStore } from '../../../core/auth/session-store';
import type { Batch } from '../../batch-types';
import { ControlCard } from '../control-card/control-card';
import { DeviationList } from '../deviation-list/deviation-list';
import { ProcessStore } from '../process-store';
import { clockWords, controlsByDue } from '../process-words';
import { ReleasePanel } from '../release-panel/release-panel';
import {
  StartBatchDialog,
  type StartBatchData,
  type Started,
} from '../start-batch/start-batch-dialog';
import { WeightsPanel } from '../weights-panel/weights-panel';

/** How often "due in" is counted again, and how often the record is read again. */
const TICK_MS = 30_000;
const REFRESH_EVERY_TICKS = 2;

/**
 * The batch's process record (HACCP) on its page: starting a planned batch, each control as a
 * card (the one due soonest first), the weights as weighed, the deviations with their corrective
 * actions, and verification and release. Read again every minute, so a deadline the server finds
 * passed shows without a reload.
 */
@Component({
  selector: 'app-process-section',
  imports: [MatButton, MatIcon, ControlCard, WeightsPanel, DeviationList, ReleasePanel],
  templateUrl: './process-section.html',
  styleUrl: './process-section.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProcessSection {
  private readonly session = inject(SessionStore);
  private readonly dialog = inject(MatDialog);
  protected readonly store = inject(ProcessStore);

  /** The batch shown. */
  readonly batch = input.required<Batch>();
  /** Emitted when the batch itself changed (started, released): the page reads it again. */
  readonly changed = output<void>();

  protected readonly now = signal(new Date());
  protected readonly canWrite = computed(() => this.session.hasRole('admin', 'cook', 'reviewer'));
  protected readonly canVerify = computed(() => this.session.hasRole('admin', 'reviewer'));
  protected readonly planned = computed(() => this.batch().status === 'planned');
  /** A released batch's record is verified and closed: nothing more is entered on it. */
  protected readonly released = computed(() => !!this.store.record()?.verification);
  protected readonly writable = computed(() => this.canWrite() && !this.released());
  protected readonly controls = computed(() => controlsByDue(this.store.record()?.controls ?? []));
  protected readonly startWarnings = signal<readonly string[]>([]);

  constructor() {
    let ticks = 0;
    const timer = setInterval(() => {
      this.now.set(new Date());
      if (++ticks % REFRESH_EVERY_TICKS === 0 && !this.store.writing())
        void this.store.load(this.batch().lotCode);
    }, TICK_MS);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  protected when(iso: string): string {
    return clockWords(iso, this.now());
  }

  protected async start(): Promise<void> {
    const dialog = this.dialog.open<StartBatchDialog, StartBatchData, Started>(StartBatchDialog, {
      data: { batch: this.batch(), store: this.store },
      width: '960px',
      maxWidth: '96vw',
      autoFocus: 'first-tabbable',
    });
    const started = await firstValueFrom(dialog.afterClosed());
    if (!started) return;
    this.startWarnings.set(started.warnings);
    this.changed.emit();
  }
}
