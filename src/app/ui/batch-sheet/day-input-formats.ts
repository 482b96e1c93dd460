import { MAT_NATIVE_DATE_FORMATS, type MatDateFormats } from '@angular/material/core';

/**
 * Date boxes show the day with the month in words ("Dec 2, 2026"), so a day and a month are never
 * read the wrong way round; typing a date the same way, or as YYYY-MM-DD, is read back.
 */
export const DAY_INPUT_FORMATS: MatDateFormats = {
  ...MAT_NATIVE_DATE_FORMATS,
  display: {
    ...MAT_NATIVE_DATE_FORMATS.display,
    dateInput: { year: 'numeric', month: 'short', day: 'numeric' },
  },
};
