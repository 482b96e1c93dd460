import { Command, Option } from 'commander';
import type { Receipt, ReceiptRequest, ReceivingAction } from '../../shared/api/receipt.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { RECEIVED_UNITS, type ReceivedUnit } from '../../shared/stock/base-measure.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface ReceiveOptions {
  supplier: string;
  supplierLot: string;
  establishment?: string;
  packed?: string;
  useBy?: string;
  quantity: string;
  cost?: string;
  temperature?: string;
  frozen?: 'solid' | 'thawed';
  refuse?: boolean;
  accept?: boolean;
  cause?: string;
  restored?: string;
  prevention?: string;
  disposition?: ReceivingAction['disposition'];
  amount?: string;
  note?: string;
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  json?: boolean;
}

/** "40 lb" → ["40", "lb"]: a number and one of the units a delivery is given in. */
export function quantityOf(text: string): { quantity: string; unit: ReceivedUnit } {
  const match = /^\s*(\d+(?:\.\d+)?)\s*([a-zA-Z]+)\s*$/.exec(text);
  const unit = match?.[2].toLowerCase() as ReceivedUnit | undefined;
  if (!match || !unit || !RECEIVED_UNITS.includes(unit))
    throw new CliError(
      `--quantity ${text}: give a number and a unit, e.g. "40 lb", "12.5 kg", "180 each" (${RECEIVED_UNITS.join(', ')})`,
      EXIT.usage,
    );
  return { quantity: match[1], unit };
}

/** The corrective action from its options, when any of them is given. */
function actionOf(options: ReceiveOptions): ReceivingAction | undefined {
  const { cause, restored, prevention, disposition, amount } = options;
  if (!cause && !restored && !prevention && !disposition) return undefined;
  return {
    cause: cause ?? '',
    restored: restored ?? '',
    prevention: prevention ?? '',
    disposition: disposition ?? ('' as ReceivingAction['disposition']),
    ...(amount ? { grams: amount } : {}),
  };
}

/** The request the options make. */
export function receiptRequest(item: string, options: ReceiveOptions): ReceiptRequest {
  if (options.refuse && options.accept)
    throw new CliError('give --refuse or --accept, not both', EXIT.usage);
  const action = actionOf(options);
  return {
    item,
    supplier: options.supplier,
    supplierLot: options.supplierLot,
    ...quantityOf(options.quantity),
    ...(options.establishment ? { establishment: options.establishment } : {}),
    ...(options.packed ? { packedOn: options.packed } : {}),
    ...(options.useBy ? { useBy: options.useBy } : {}),
    ...(options.cost ? { unitCost: options.cost } : {}),
    ...(options.temperature ? { temperature: options.temperature } : {}),
    ...(options.frozen ? { shippedFrozen: true, frozenSolid: options.frozen === 'solid' } : {}),
    ...(options.refuse ? { decision: 'refuse' as const } : {}),
    ...(options.accept || (action && !options.refuse) ? { decision: 'accept' as const } : {}),
    ...(action && !options.refuse ? { action } : {}),
    ...(options.note ? { note: options.note } : {}),
  };
}

/** A delivery in words: what came, from whom, what the door found and what was done. */
export function receiptWords(receipt: Receipt): string {
  const verb = receipt.decision === 'refused' ? 'Refused' : 'Received';
  const lines = [
    `${verb} ${receipt.lotCode}: ${receipt.quantity} ${receipt.unit} ${receipt.itemName} from ${receipt.supplier}, lot ${receipt.supplierLot}${receipt.establishment ? ` (${receipt.establishment})` : ''}`,
  ];
  const dates = [
    receipt.packedOn ? `packed or killed ${dayWords(receipt.packedOn)}` : '',
    receipt.useBy ? `use by ${dayWords(receipt.useBy)}` : '',
  ].filter(Boolean);
  if (dates.length) lines.push(`  ${dates.join(', ')}`);
  lines.push(`  At the door: ${receipt.found}`);
  if (receipt.limit.source) lines.push(`  Limit: ${receipt.limit.words} (${receipt.limit.source})`);
  if (receipt.decision === 'refused')
    lines.push('  Recorded as refused: nothing of it is on hand.');
  if (receipt.deviation?.action)
    lines.push(
      `  Taken in with a corrective action: ${receipt.deviation.action.disposition}; the deviation is recorded and closed.`,
    );
  if (receipt.note) lines.push(`  Note: ${receipt.note}`);
  return `${lines.join('\n')}\n`;
}

/** `larder receive ITEM …`: a delivery at the door, judged against its receiving limit. */
export function receiveCommand(io: Io): Command {
  return new Command('receive')
    .description('record a delivery at the door: its lot, temperature and what was done with it')
    .argument('<item>', 'the catalogue item, e.g. pork-belly')
    .requiredOption('--supplier <name>', 'who delivered it')
    .requiredOption('--supplier-lot <lot>', "the supplier's lot code")
    .requiredOption(
      '--quantity <amount>',
      'how much, with its unit: "40 lb", "12.5 kg", "180 each"',
    )
    .option(
      '--establishment <number>',
      'the establishment number in the mark of inspection (meat and poultry): "EST. 4821", "P-4821"',
    )
    .option('--packed <date>', 'pack or kill day, YYYY-MM-DD')
    .option('--use-by <date>', 'use-by, YYYY-MM-DD')
    .option('--cost <price>', 'price per unit of the quantity, e.g. 3.10')
    .option('--temperature <reading>', 'the temperature read at the door: "3C", "38 F"')
    .addOption(
      new Option('--frozen <state>', 'shipped frozen: arrived "solid" or "thawed"').choices([
        'solid',
        'thawed',
      ]),
    )
    .option('--refuse', 'refuse the delivery (over its limit, or with --note saying why)')
    .option('--accept', 'take in a delivery over its limit, with the corrective action below')
    .option('--cause <text>', 'corrective action: the cause of the deviation')
    .option('--restored <text>', 'corrective action: how it is under control again')
    .option('--prevention <text>', 'corrective action: what keeps it from happening again')
    .addOption(
      new Option(
        '--disposition <what>',
        'corrective action: what was done with the product',
      ).choices(['rechilled', 'reworked', 'diverted', 'discarded', 'recooked']),
    )
    .option(
      '--amount <weight>',
      'corrective action: how much was diverted or discarded, e.g. "4 kg"',
    )
    .option('--note <text>', 'anything else about the delivery')
    .addOption(serverOption('record on this server'))
    .addOption(siteOption())
    .option('--json', 'print the delivery as recorded, as JSON')
    .addHelpText(
      'after',
      `\nSigns in as $LARDER_USER with $LARDER_PASSWORD (admin or cook). Chilled meat, poultry, seafood\nand dairy must arrive at 5 °C (41 °F) or colder, shell eggs at 7.2 °C (45 °F), anything shipped\nfrozen frozen solid (FDA Food Code 2022, 3-202.11). Over its limit, a delivery is refused\n(--refuse) or taken in with a corrective action (--accept --cause … --restored … --prevention …\n--disposition …); without either it is not recorded and larder exits 2.\n\nExamples:\n  larder receive pork-belly --supplier "Fenwick Hollow Pork" --supplier-lot FH-4471 \\\n    --establishment "EST. 38214" --use-by 2026-12-14 --quantity "40 lb" --cost 3.10 --temperature 3C\n  larder receive kosher-salt --supplier "Tallis & Crane Provisions" --supplier-lot TC-88 --quantity "25 kg"\n${EXIT_CODES_HELP}`,
    )
    .action(async (item: string, options: ReceiveOptions) => {
      const receipt = await (
        await recordKeeper(options.server, options.site)
      ).receive(receiptRequest(item, options));
      io.out(options.json ? `${JSON.stringify(receipt, null, 2)}\n` : receiptWords(receipt));
    });
}
