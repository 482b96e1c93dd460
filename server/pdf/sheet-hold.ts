import { addDays, type PresentedResult } from '../../shared/index.ts';
import { INK, SMALL, TICK, type SheetLayout } from './sheet-layout.ts';
import { dayInWords, shortDayInWords } from './sheet-words.ts';

/**
 * Hold: days, start and ready, with the rule that gave the days beside them when there is room,
 * and a box for each turn with its date, on the line that asks for the turns.
 */
export function hold(
  layout: SheetLayout,
  schedule: NonNullable<PresentedResult['schedule']>,
): void {
  layout.ensure(40);
  const days = `${schedule.days} ${schedule.days === 1 ? 'day' : 'days'}`;
  layout.draw(days, { size: 15, weight: 'semibold' }, layout.left, layout.y, 90);
  const start = `Start ${dayInWords(schedule.start)}`;
  const ready = `ready ${dayInWords(schedule.ready)}`;
  const x = layout.left + 70;
  layout.draw(start, { size: 11 }, x, layout.y + 3, 200);
  const arrowX = x + layout.doc.widthOfString(start) + 8;
  const arrowY = layout.y + 10;
  if (!layout.counting)
    layout.doc
      .moveTo(arrowX, arrowY)
      .lineTo(arrowX + 18, arrowY)
      .moveTo(arrowX + 14, arrowY - 3.5)
      .lineTo(arrowX + 18, arrowY)
      .lineTo(arrowX + 14, arrowY + 3.5)
      .lineWidth(1)
      .strokeColor(INK.text)
      .stroke();
  layout.draw(ready, { size: 11, weight: 'semibold' }, arrowX + 26, layout.y + 3, 200);
  const ruleX = arrowX + 26 + layout.doc.widthOfString(ready) + 16;
  const rule = { color: INK.muted, size: SMALL } as const;
  if (layout.right - ruleX >= 150) {
    const height = layout.draw(schedule.rule, rule, ruleX, layout.y + 4, layout.right - ruleX);
    layout.gap(Math.max(22, height + 8));
  } else {
    layout.gap(22);
    layout.paragraph(schedule.rule, rule);
  }
  const every = schedule.flipEveryDays;
  if (!every) return;
  const turns: number[] = [];
  for (let day = every; day < schedule.days; day += every) turns.push(day);
  const ask = `Turn every ${every} ${every === 1 ? 'day' : 'days'}:`;
  layout.ensure(16);
  layout.draw(ask, {}, layout.left, layout.y, layout.width);
  const from = layout.left + layout.widthOf(ask, {}) + 12;
  // The year is in the start and ready days just above.
  const labels = turns.map((day) => `day ${day}, ${shortDayInWords(addDays(schedule.start, day))}`);
  const small = { size: SMALL } as const;
  const step = Math.max(...labels.map((label) => layout.widthOf(label, small))) + TICK + 14;
  const perRow = Math.max(1, Math.floor((layout.right - from) / step));
  labels.forEach((label, i) => {
    if (i && i % perRow === 0) {
      layout.gap(16);
      layout.ensure(16);
    }
    const x = from + (i % perRow) * step;
    layout.tickBox(x, layout.y + 1);
    layout.draw(label, small, x + TICK + 5, layout.y + 1, step - TICK - 8);
  });
  layout.gap(18);
}
