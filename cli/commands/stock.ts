import { Command } from 'commander';
import type { StockView } from '../../shared/api/receipt.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { textTable } from '../output/text-table.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface StockOptions {
  server?: string;
  site?: string;
  json?: boolean;
}

/** "in 3 days", "today", "EXPIRED 2 days ago", "" when the lot carries no use-by. */
function daysWords(daysLeft: number | null, expired: boolean): string {
  if (daysLeft === null) return '';
  if (expired) return `EXPIRED ${-daysLeft} day${daysLeft === -1 ? '' : 's'} ago`;
  if (daysLeft === 0) return 'today';
  return `in ${daysLeft} day${daysLeft === 1 ? '' : 's'}`;
}

/** Stock on hand as a table: each item's lots in the order to use them, expired lots last. */
export function stockTable(stock: StockView): string {
  if (!stock.items.length) return 'Nothing on hand.\n';
  const header = ['item', 'lot', 'supplier', 'supplier lot', 'left', 'use by', ''];
  const rows = stock.items.flatMap((item) =>
    item.lots.map((lot) => [
      item.name,
      lot.lotCode,
      lot.supplier,
      lot.supplierLot,
      `${lot.remainingInUnit} ${lot.unit}`,
      lot.useBy ? dayWords(lot.useBy) : '',
      daysWords(lot.daysLeft, lot.expired),
    ]),
  );
  const expired = stock.items.flatMap((i) => i.lots).filter((lot) => lot.expired).length;
  return `${textTable([header, ...rows], ['left', 'left', 'left', 'left', 'right', 'left', 'left']).join('\n')}\n${
    expired ? `${expired} lot(s) past their use-by: discard them.\n` : ''
  }`;
}

/** `larder stock`: what is on hand, by item, first to expire first. */
export function stockCommand(io: Io): Command {
  return new Command('stock')
    .description('what is on hand by item and lot, first to expire first')
    .addOption(serverOption('read from this server'))
    .addOption(siteOption())
    .option('--json', 'print the stock as JSON')
    .addHelpText(
      'after',
      `\nOn a server, signs in as $LARDER_USER with $LARDER_PASSWORD.\n\nExamples:\n  larder stock\n  larder stock --json\n${EXIT_CODES_HELP}`,
    )
    .action(async (options: StockOptions) => {
      const stock = await (await recordKeeper(options.server, options.site)).stock();
      io.out(options.json ? `${JSON.stringify(stock, null, 2)}\n` : stockTable(stock));
    });
}
