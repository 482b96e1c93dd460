import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { SessionStore } from '../../core/auth/session-store';
import { BatchSheet } from '../../ui/batch-sheet/batch-sheet';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe, isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { signOffConcern } from '../../../../shared/workflow/workflow-rules.ts';
import { BatchLog } from '../batch-log/batch-log';
import { offeredMoves, signOffBlocked, type OfferedMove } from '../batch-status';
import { HoldBanner } from '../process/hold-banner/hold-banner';
import { ProcessSection } from '../process/process-section/process-section';
import { BatchCost } from '../../costing/batch-cost/batch-cost';
import { ProcessStore } from '../process/process-store';
import { BatchStore } from './batch-store';
import { ConfirmDialog, type ConfirmDialogData } from './confirm-dialog';
import { revisionWords } from './revision-words';
import { ReasonDialog, type ReasonDialogData } from './reason-dialog';
import { SignOffDialog, type SignOff, type SignOffDialogData } from './sign-off-dialog';
import { StatusTimeline } from './status-timeline';
import { FORMULA_KIND_WORDS as KIND_WORDS } from '../formula-kind-words';
import { TurnList } from './turn-list';
import { FormulaOptions } from '../formula-options';
import { notesInWords } from './notes-words';
import { LabelPreview } from '../label-preview/label-preview';
import { MadeFrom } from '../made-from/made-from';

/**
 * One batch: its lot code, formula and revision, status and the history of every change, the
 * batch sheet it was recorded with, and what the signed-in role may do next (move it along, sign
 * it off). Prints as a clean batch sheet with lines to sign.
 */
@Component({
  selector: 'app-batch-page',
  imports: [
    RouterLink,
    BatchCost,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    BatchSheet,
    BatchStatusChip,
    IsoDayPipe,
    StatusTimeline,
    TurnList,
    HoldBanner,
    ProcessSection,
    LabelPreview,
    MadeFrom,
  ],
  providers: [BatchStore, ProcessStore],
  templateUrl: './batch-page.html',
  styleUrls: ['../../ui/verdict.css', './batch-page.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class BatchPage {
  private readonly session = inject(SessionStore);
  private readonly dialog = inject(MatDialog);
  private readonly log = inject(BatchLog);
  protected readonly store = inject(BatchStore);
  protected readonly process = inject(ProcessStore);
  private readonly formulas = inject(FormulaOptions);

  /** The lot code from the address. */
  readonly lot = input.required<string>();

  protected readonly batch = this.store.batch;
  /** How many times Made from was recorded on this page: the label reads again each time. */
  protected readonly lotsRecorded = signal(0);
  protected readonly kindWords = KIND_WORDS;
  protected readonly moves = computed<OfferedMove[]>(() => {
    const batch = this.batch();
    const person = this.session.person();
    if (!batch || !person || !this.session.hasRole('admin', 'cook')) return [];
    // A planned batch starts through "Start this batch", on what is really there.
    return offeredMoves(batch, person, this.store.rules()).filter(
      (move) => !(batch.status === 'planned' && move.to === 'in-progress'),
    );
  });
  /** Why moves are held back, each reason once (a signed-off batch holds back every move). */
  protected readonly heldBack = computed(() => [
    ...new Set(this.moves().flatMap((move) => (move.blocked ? [move.blocked] : []))),
  ]);
  /** Whether the signed-in person records corrective actions. */
  protected readonly canAct = computed(() => this.session.hasRole('admin', 'cook', 'reviewer'));
  protected readonly canSignOff = computed(() => {
    const batch = this.batch();
    return (
      !!batch &&
      !batch.signedOff &&
      batch.status !== 'planned' &&
      batch.status !== 'discarded' &&
      this.session.hasRole('admin', 'reviewer')
    );
  });
  /** Why the rules keep this person from signing the batch off (they recorded it), or null. */
  protected readonly signOffHeld = computed(() => {
    const batch = this.batch();
    const person = this.session.person();
    return batch && person && this.canSignOff()
      ? signOffBlocked(batch, person, this.store.rules())
      : null;
  });
  /** Why a reviewer cannot sign off yet, when they could later. */
  protected readonly signOffWaits = computed(() => {
    const batch = this.batch();
    return (
      !!batch &&
      !batch.signedOff &&
      batch.status === 'planned' &&
      this.session.hasRole('admin', 'reviewer')
    );
  });
  /** The reviewer's note, kept on the sign-off event. */
  protected readonly signOffNote = computed(
    () => this.batch()?.events?.findLast((e) => e.type === 'sign-off')?.reason ?? null,
  );
  /** The checks that failed, named in the summary. */
  protected readonly failedChecks = computed(
    () => this.batch()?.result.checks.filter((check) => check.status === 'fail') ?? [],
  );
  /** What a sign-off would be signing beyond a plain good batch, in words; null for nothing. */
  protected readonly signOffConcern = computed(() => {
    const batch = this.batch();
    return batch
      ? signOffConcern({
          status: batch.status,
          failedChecks: this.failedChecks().map((check) => check.label),
        })
      : null;
  });
  /** The formula revision in words; its hash only in an admin's tooltip. */
  protected readonly revisionText = computed(() => {
    const facts = this.store.revision();
    if (facts === undefined) return 'the formula as it was when the batch was recorded';
    const days = new IsoDayPipe();
    return revisionWords(facts, (iso) => days.transform(iso));
  });
  /** The notes in words: a plan's note names its menu item by title and its day as we write days. */
  protected readonly notesText = computed(() => {
    const notes = this.batch()?.notes;
    if (!notes) return '';
    const titles = new Map(this.formulas.formulas().map((f) => [f.id, f.title]));
    return notesInWords(notes, (id) => titles.get(id));
  });
  protected readonly isAdmin = computed(() => this.session.hasRole('admin'));
  /** The batch sheet as a PDF, made by the server (GET /api/batches/:lot/sheet.pdf). */
  protected readonly pdfLink = computed(() => {
    const lot = this.batch()?.lotCode;
    return lot ? `/api/batches/${encodeURIComponent(lot)}/sheet.pdf` : null;
  });

  constructor() {
    effect(() => {
      const lot = this.lot();
      // Only the lot code starts a read; what the read itself touches must not start another.
      untracked(() => {
        void this.store.load(lot);
        void this.formulas.load();
        void this.process.load(lot);
      });
    });
  }

  protected async moveTo(move: OfferedMove): Promise<void> {
    const batch = this.batch();
    if (!batch || move.blocked) return;
    let reason: string | undefined;
    if (!move.needsReason && move.to === 'done' && !(await this.confirmEarlyDone())) return;
    if (move.needsReason) {
      const dialog = this.dialog.open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, {
        data: { lotCode: batch.lotCode, to: move.to, action: move.action },
        width: '520px',
      });
      reason = await firstValueFrom(dialog.afterClosed());
      if (!reason) return;
    }
    if (await this.store.move(move.to, reason)) this.log.invalidate();
    // A move the server refuses while on hold says so; the record shows the hold itself.
    void this.process.load(batch.lotCode);
  }

  /** Asks before marking a batch done ahead of its ready date; true when there is no need. */
  private async confirmEarlyDone(): Promise<boolean> {
    const batch = this.batch();
    const today = isoDateOf(new Date());
    if (!batch?.readyOn || !today || batch.readyOn <= today) return true;
    const ready = new IsoDayPipe().transform(batch.readyOn);
    const cure = batch.kind === 'cure';
    const dialog = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data: {
        title: `Mark batch ${batch.lotCode} done before it is ready?`,
        lines: [
          `It is not ready until ${ready}. ${
            cure
              ? 'A cure taken out early may not have cured through: the cure needs its full time to be safe.'
              : 'Marking it done ends its time in this step.'
          }`,
          'Once it is done it cannot go back to an earlier step.',
        ],
        confirm: 'Mark done now',
        keep: cure ? 'Keep it curing' : 'Not yet',
      },
      width: '520px',
    });
    return (await firstValueFrom(dialog.afterClosed())) === true;
  }

  protected async signOff(): Promise<void> {
    const batch = this.batch();
    if (!batch || this.signOffHeld()) return;
    const final = batch.status === 'done' || batch.status === 'discarded';
    const dialog = this.dialog.open<SignOffDialog, SignOffDialogData, SignOff>(SignOffDialog, {
      data: {
        lotCode: batch.lotCode,
        locks: this.store.rules().lockSignedOff && !final,
        concern: this.signOffConcern(),
      },
      width: '520px',
    });
    const answer = await firstValueFrom(dialog.afterClosed());
    if (!answer) return;
    if (await this.store.signOff(answer.note || undefined)) this.log.invalidate();
  }

  /** The batch was started or released: read it again, and the log with it. */
  protected async batchChanged(): Promise<void> {
    this.log.invalidate();
    await this.store.load(this.lot());
  }

  protected print(): void {
    window.print();
  }
}
