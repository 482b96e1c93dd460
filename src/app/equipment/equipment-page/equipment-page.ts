import { ChangeDetectionStrategy, Component, OnInit, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { temperatureWords } from '../../../../shared/process/control-words.ts';
import { SessionStore } from '../../core/auth/session-store';
import { EquipmentStore } from '../equipment-store';
import type { Equipment } from '../equipment-types';
import { KIND_WORDS, standingOf } from '../equipment-words';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { LoadState } from '../../ui/load-state/load-state';
import { PageHead } from '../../ui/page-head/page-head';

/** The width every dialog of this page opens at, narrowed to the screen on a phone. */
const DIALOG = { width: '560px', maxWidth: '96vw', autoFocus: 'first-tabbable' } as const;

/**
 * Equipment: every cooler, freezer, smoker, hot-holding unit and thermometer with its last
 * reading (or ice-point check), where it stands in words and colour, and when the next is due,
 * soonest first. A big button records a reading at the unit; admins add, change and retire.
 */
@Component({
  selector: 'app-equipment-page',
  imports: [IsoDayPipe, LoadState, MatButton, MatIcon, PageHead],
  templateUrl: './equipment-page.html',
  styleUrl: './equipment-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class EquipmentPage implements OnInit {
  protected readonly store = inject(EquipmentStore);
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(SessionStore);
  protected readonly admin = computed(() => this.session.person()?.role === 'admin');
  /** In use (next due first), then retired: each a list with its label. */
  protected readonly groups = computed(() =>
    [
      { label: 'Equipment in use, next due first', retired: false, items: this.store.active() },
      { label: 'Retired equipment', retired: true, items: this.store.retired() },
    ].filter((group) => group.items.length > 0),
  );
  protected readonly kindWords = KIND_WORDS;
  protected readonly standingOf = standingOf;
  protected readonly degrees = temperatureWords;

  ngOnInit(): void {
    void this.store.load();
  }

  protected async recordReading(equipment: Equipment): Promise<void> {
    const { ReadingDialog } = await import('../reading-dialog/reading-dialog');
    this.dialog.open(ReadingDialog, { ...DIALOG, data: equipment });
  }

  protected async checkThermometer(equipment: Equipment): Promise<void> {
    const { CalibrationDialog } = await import('../calibration-dialog/calibration-dialog');
    this.dialog.open(CalibrationDialog, { ...DIALOG, data: equipment });
  }

  protected async showLog(equipment: Equipment): Promise<void> {
    const { EquipmentLogDialog } = await import('../equipment-log-dialog/equipment-log-dialog');
    this.dialog.open(EquipmentLogDialog, { ...DIALOG, width: '760px', data: equipment });
  }

  protected async edit(equipment: Equipment | null): Promise<void> {
    const { EquipmentEditDialog } = await import('../equipment-edit-dialog/equipment-edit-dialog');
    this.dialog.open(EquipmentEditDialog, { ...DIALOG, data: equipment });
  }
}
