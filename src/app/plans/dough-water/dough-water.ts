import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { withUnit } from '../../batches/record-batch/batch-fields';
import { messageOf } from '../../core/api/message-of';
import { PlanApi } from '../plan-api';
import type { PlanUnits, PresentedPlanBatch, PresentedResult } from '../plan-types';
import { hasPreferment, waterFigures } from './dough-water-need';

/** A temperature as typed: a number, with a decimal point or comma, maybe below zero. */
const TEMPERATURE = /^\s*-?\d+(?:[.,]\d+)?\s*$/;

/**
 * A dough's water temperature, right where the plan says it could not be worked out: the room,
 * flour (and preferment) temperatures to type, and the water temperature they give. The batch
 * is worked out again by the server (POST /api/calc); nothing is recorded.
 */
@Component({
  selector: 'app-dough-water',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatError, MatSuffix, MatInput, MatButton],
  templateUrl: './dough-water.html',
  styleUrl: './dough-water.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DoughWater {
  private readonly api = inject(PlanApi);

  /** The dough batch of the plan. */
  readonly batch = input.required<PresentedPlanBatch>();
  /** The plan's units: the boxes take °C or °F. */
  readonly units = input.required<PlanUnits>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    room: ['', [Validators.required, Validators.pattern(TEMPERATURE)]],
    flour: ['', [Validators.required, Validators.pattern(TEMPERATURE)]],
    preferment: ['', Validators.pattern(TEMPERATURE)],
  });
  protected readonly preferment = computed(() => hasPreferment(this.batch()));
  protected readonly degrees = computed(() => (this.units() === 'us' ? '°F' : '°C'));
  /** The boxes: room and flour, and the preferment's when the dough has one. */
  protected readonly fields = computed(() => {
    const us = this.units() === 'us';
    const fields = [
      { key: 'room', label: 'Room temperature', example: us ? '72' : '22' },
      { key: 'flour', label: 'Flour temperature', example: us ? '68' : '20' },
    ] as const;
    const preferment = {
      key: 'preferment',
      label: 'Preferment temperature',
      example: us ? '75' : '24',
    } as const;
    return this.preferment() ? [...fields, preferment] : fields;
  });
  private readonly answer = signal<PresentedResult | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly busy = signal(false);
  /** The water temperature and what goes with it, once worked out. */
  protected readonly figures = computed(() => {
    const result = this.answer();
    return result ? waterFigures(result.figures) : null;
  });
  /** What the server still warns of for this batch (a temperature left out). */
  protected readonly warnings = computed(() => this.answer()?.warnings ?? []);

  /** Works the batch out again with the temperatures typed. */
  protected async workOut(): Promise<void> {
    const preferment = this.form.controls.preferment;
    if (this.preferment() && preferment.value.trim() === '') {
      preferment.setErrors({ required: true });
    }
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { room, flour } = this.form.getRawValue();
    const units = this.units();
    const batch = {
      ...this.batch().batch,
      room: withUnit(room, 'temperature', units),
      flourTemp: withUnit(flour, 'temperature', units),
      ...(this.preferment()
        ? { prefermentTemp: withUnit(preferment.value, 'temperature', units) }
        : {}),
    };
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.answer.set(await this.api.calc(this.batch().formula.id, batch, units));
    } catch (error) {
      this.answer.set(null);
      this.failure.set(messageOf(error, undefined, 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }
}
