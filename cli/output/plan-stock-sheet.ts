import type { PlanStock, PresentedAmount, PresentedWeight } from '../../shared/index.ts';
import { dayWords, shortDayWords } from '../../shared/presentation/date-words.ts';
import { textTable } from './text-table.ts';

/** An amount as printed, "none" for nothing. */
function amount(figure: PresentedWeight | PresentedAmount): string {
  return ('exact' in figure ? figure.exact : figure.grams) === '0' ? 'none' : figure.amount;
}

/**
 * A plan's pull list against the lots on hand, for `larder plan`: every item with what is
 * needed, on hand, usable and short, the day more must arrive by and whom to ask, short items
 * marked and first; the lots that will be out of date; what is not compared, and why.
 */
export function renderPlanStock(stock: PlanStock): string {
  const out = ['', 'PULL LIST AGAINST STOCK'];
  if (!stock.compared) return [...out, `  ${stock.reason}`].join('\n') + '\n';
  out.push(
    `  Lots on hand on ${dayWords(stock.asOf)}.`,
    ...textTable(
      [
        ['', '', 'needed', 'on hand', 'usable', 'short', 'arrive by', 'ask'],
        ...stock.lines.map((line) => [
          line.status === 'short' ? 'SHORT' : 'ok',
          line.name,
          amount(line.needed),
          amount(line.onHand),
          amount(line.usable),
          line.status === 'short' ? amount(line.short) : '',
          line.arriveBy ? `${shortDayWords(line.arriveBy)} morning` : '',
          line.lastFrom
            ? `${line.lastFrom.supplier} (last ${dayWords(line.lastFrom.receivedOn)})`
            : line.status === 'short'
              ? 'never received'
              : '',
        ]),
      ],
      ['left', 'left', 'right', 'right', 'right', 'right', 'left', 'left'],
    ),
    ...stock.lines.flatMap((line) =>
      line.conversion ? [`  ${line.name}: ${line.conversion}`] : [],
    ),
    ...stock.lines.flatMap((line) => line.outOfDate.map((words) => `  ! ${line.name}: ${words}`)),
  );
  if (stock.apart.length) {
    out.push(
      '',
      'NOT COMPARED WITH STOCK',
      ...textTable(
        stock.apart.map((line) => [line.name, amount(line.needed), line.why]),
        ['left', 'right', 'left'],
      ),
    );
  }
  out.push('', stock.note);
  return out.join('\n') + '\n';
}
