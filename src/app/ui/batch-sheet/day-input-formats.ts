import { Injectable, type Provider } from '@angular/core';
import {
  MatDatepicker,
  MatDatepickerInput,
  MatDatepickerToggle,
} from '@angular/material/datepicker';
import {
  DateAdapter,
  MAT_DATE_FORMATS,
  MAT_NATIVE_DATE_FORMATS,
  NativeDateAdapter,
  type MatDateFormats,
} from '@angular/material/core';
import { dayWords } from '../../../../shared/presentation/date-words.ts';
import { isoDateOf } from './iso-day-pipe';

/**
 * Date boxes show the day as every other date on the console, with the month in words
 * ("3 Dec 2026"), so a day and a month are never read the wrong way round; typing a date the
 * same way, or as YYYY-MM-DD, is read back.
 */
export const DAY_INPUT_FORMATS: MatDateFormats = {
  ...MAT_NATIVE_DATE_FORMATS,
  display: {
    ...MAT_NATIVE_DATE_FORMATS.display,
    dateInput: { year: 'numeric', month: 'short', day: 'numeric' },
  },
};

/** The native adapter, writing the date box in the console's one form and reading YYYY-MM-DD as a local day. */
@Injectable()
export class DayInputAdapter extends NativeDateAdapter {
  override format(date: Date, displayFormat: object): string {
    const day = isoDateOf(date);
    return displayFormat === DAY_INPUT_FORMATS.display.dateInput && day
      ? dayWords(day)
      : super.format(date, displayFormat);
  }

  override parse(value: unknown, parseFormat?: unknown): Date | null {
    const match = typeof value === 'string' ? /^\s*(\d{4})-(\d{2})-(\d{2})\s*$/.exec(value) : null;
    if (match) return new Date(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
    return super.parse(value, parseFormat);
  }
}

/** The date boxes' adapter and formats, for a component's providers. */
export function provideDayInputs(): Provider[] {
  return [
    { provide: DateAdapter, useClass: DayInputAdapter },
    { provide: MAT_DATE_FORMATS, useValue: DAY_INPUT_FORMATS },
  ];
}

/** What a component's template needs for a date box with its picker (with provideDayInputs()). */
export const DAY_INPUT_IMPORTS = [MatDatepicker, MatDatepickerInput, MatDatepickerToggle] as const;
