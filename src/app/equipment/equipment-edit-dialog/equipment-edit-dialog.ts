import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatOption, MatSelect } from '@angular/material/select';
import { CONTROL_TEMPLATES } from '../../../../shared/process/control-templates.ts';
import { messageOf } from '../../core/api/message-of';
import { EquipmentStore } from '../equipment-store';
import type { Equipment, EquipmentControl, EquipmentKind } from '../equipment-types';
import { KIND_WORDS } from '../equipment-words';

/** The templates a piece of equipment can be held to: temperatures judged reading by reading. */
const TEMPLATES = CONTROL_TEMPLATES.filter(
  (t) =>
    t.measure.endsWith('temperature') &&
    (t.limit.type === 'at-most' || t.limit.type === 'at-least' || t.limit.type === 'between'),
);

const HOURS_PER_DAY = 24;

/** "4 h", "30 min" as a number and a unit for the form; a thermometer's in days. */
function everyParts(every: string | undefined, kind: EquipmentKind): { n: string; unit: string } {
  const match = /^(\d+(?:\.\d+)?)\s*(min|h)$/.exec(every ?? '');
  if (!match) return kind === 'thermometer' ? { n: '7', unit: 'd' } : { n: '4', unit: 'h' };
  if (kind === 'thermometer' && match[2] === 'h' && Number(match[1]) % HOURS_PER_DAY === 0)
    return { n: String(Number(match[1]) / HOURS_PER_DAY), unit: 'd' };
  return { n: match[1], unit: match[2] };
}

/**
 * Adds a piece of equipment, or changes one (admins): its name, its control — a template or a
 * limit of the kitchen's own with its source — and how often it is read; retires or brings it
 * back. A change of the limit asks for the reason, kept in the audit log.
 */
@Component({
  selector: 'app-equipment-edit-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatSelect,
    MatOption,
    MatRadioGroup,
    MatRadioButton,
    MatButton,
    MatProgressBar,
  ],
  templateUrl: './equipment-edit-dialog.html',
  styleUrl: '../equipment-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquipmentEditDialog {
  protected readonly editing = inject<Equipment | null>(MAT_DIALOG_DATA);
  private readonly store = inject(EquipmentStore);
  private readonly dialogRef = inject(MatDialogRef<EquipmentEditDialog>);
  protected readonly templates = TEMPLATES;
  protected readonly kinds = Object.entries(KIND_WORDS) as [EquipmentKind, string][];
  private readonly start = this.editing?.control;
  private readonly every = everyParts(this.start?.every, this.editing?.kind ?? 'cooler');
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.editing?.name ?? '', [Validators.required, Validators.maxLength(80)]],
    kind: [this.editing?.kind ?? ('cooler' as EquipmentKind)],
    mode: [this.start?.limit ? 'own' : 'rule'],
    rule: [this.start?.rule ?? 'cold-holding'],
    min: [this.start?.limit?.min ?? ''],
    max: [this.start?.limit?.max ?? ''],
    source: [this.start?.source ?? ''],
    everyN: [this.every.n, [Validators.required, Validators.pattern(/^\d+(\.\d+)?$/)]],
    everyUnit: [this.every.unit],
    reason: [''],
  });
  protected readonly values = toSignal(this.form.valueChanges, {
    initialValue: this.form.getRawValue(),
  });
  /** The kind chosen (the form's value leaves it out once fixed, on a change). */
  protected readonly kind = computed(() => {
    this.values();
    return this.form.getRawValue().kind;
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    if (this.editing) this.form.controls.kind.disable();
  }

  /** The control the form says, in the formula's syntax. */
  private control(): EquipmentControl {
    const v = this.form.getRawValue();
    const every =
      v.everyUnit === 'd' ? `${Number(v.everyN) * HOURS_PER_DAY} h` : `${v.everyN} ${v.everyUnit}`;
    if (v.kind === 'thermometer') return { every };
    if (v.mode === 'rule') return { rule: v.rule, every };
    const limit = {
      ...(v.min.trim() ? { min: v.min.trim() } : {}),
      ...(v.max.trim() ? { max: v.max.trim() } : {}),
    };
    return { limit, source: v.source.trim(), every };
  }

  protected async save(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, kind, reason } = this.form.getRawValue();
    const control = this.control();
    this.busy.set(true);
    this.failure.set(null);
    try {
      if (this.editing) {
        const changed = JSON.stringify(control) !== JSON.stringify(this.editing.control);
        await this.store.change(this.editing.id, {
          ...(name.trim() !== this.editing.name ? { name: name.trim() } : {}),
          ...(changed ? { control } : {}),
          ...(changed && reason.trim() ? { reason: reason.trim() } : {}),
        });
      } else {
        await this.store.add({ name: name.trim(), kind, control });
      }
      this.dialogRef.close(true);
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  protected async setActive(active: boolean): Promise<void> {
    if (!this.editing || this.busy()) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      await this.store.change(this.editing.id, { active });
      this.dialogRef.close(true);
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
