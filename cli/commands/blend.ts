import { Command, Option } from 'commander';
import type { LeastCostAnswer } from '../../shared/api/cost-record.ts';
import { leastCostAnswer } from '../../shared/costing/least-cost-answer.ts';
import { type TrimOnHand, leastCostBlend } from '../../shared/costing/least-cost-blend.ts';
import { Decimal } from '../../shared/decimal.ts';
import { FAT_STANDARDS, type FatStandardKey } from '../../shared/reference/fat-standards.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { textTable } from '../output/text-table.ts';

interface BlendOptions {
  target: string;
  batch: string;
  trim: string[];
  standard?: FatStandardKey;
  json?: boolean;
}

const NUMBER = /^\d+(\.\d+)?$/;

/** A weight from the command line, or a usage error naming the option. */
function weight(text: string, what: string): Decimal {
  try {
    return parseMass(text);
  } catch (error) {
    throw new CliError(`${what}: ${(error as Error).message}`, EXIT.usage);
  }
}

/** --trim "NAME:FAT:PRICE:ON HAND[:added]", e.g. "90/10 lean:10:6.00:60 kg". */
function trimOf(text: string): TrimOnHand {
  const parts = text.split(':').map((part) => part.trim());
  const [name, fat, price, onHand, added] = parts;
  const well =
    parts.length >= 4 &&
    parts.length <= 5 &&
    name !== '' &&
    NUMBER.test(fat) &&
    NUMBER.test(price) &&
    (added === undefined || added === 'added');
  if (!well) {
    throw new CliError(
      `--trim "${text}" is not NAME:FAT:PRICE:ON HAND, e.g. "90/10 lean:10:6.00:60 kg" (add ":added" for fat added as such)`,
      EXIT.usage,
    );
  }
  const fatPercent = new Decimal(fat);
  if (fatPercent.greaterThan(100))
    throw new CliError(`--trim "${text}": fat is a percent from 0 to 100`, EXIT.usage);
  return {
    name,
    fatPercent,
    pricePerKg: new Decimal(price),
    availableGrams: weight(onHand, `--trim "${text}"`),
    ...(added ? { fatAsSuch: true } : {}),
  };
}

/** The answer as text: one row a trim, the batch, the cost per kg. */
function answerText(answer: LeastCostAnswer): string {
  const rows = [
    ['trim', 'fat', 'weight', 'cost'],
    ...answer.shares.map((s) => [s.name, `${s.fat} %`, s.weightText, s.costText]),
    ['batch', `${answer.fat} %`, answer.batchText, answer.costText],
  ];
  const lines = [
    `Least-cost blend: ${answer.batchText} at ${answer.fat} % fat${answer.standard ? ` (${answer.standard})` : ''}`,
    ...textTable(rows, ['left', 'right', 'right', 'right']),
    `Cost per kg: ${answer.costPerKgText} (to the cent, half-up)`,
  ];
  if (answer.leftOut.length)
    lines.push(`Left out, as fat added as such: ${answer.leftOut.join(', ')}`);
  return `${lines.join('\n')}\n`;
}

/** `larder blend`: the least-cost blend of trims to a target fat. */
export function blendCommand(io: Io): Command {
  return new Command('blend')
    .description('the cheapest mix of trims that makes a batch at its target fat')
    .requiredOption('--target <percent>', 'fat wanted, % by weight')
    .requiredOption('--batch <weight>', 'the batch, e.g. 50kg or 110lb')
    .requiredOption(
      '--trim <trim>',
      'a trim as NAME:FAT:PRICE PER KG:ON HAND[:added], once per trim',
      (value: string, previous: string[] = []) => [...previous, value],
    )
    .addOption(
      new Option('--standard <standard>', 'the standard it is sold under').choices(
        Object.keys(FAT_STANDARDS),
      ),
    )
    .option('--json', 'print the answer as JSON')
    .addHelpText(
      'after',
      `
Examples:
  larder blend --target 20 --batch 10kg --trim "90/10 lean:10:8.00:20 kg" --trim "50/50 trim:50:2.50:10 kg"
  larder blend --target 25 --batch 100kg --standard ground-beef --trim "lean:10:6:60kg" --trim "chuck:20:4.5:50kg" --trim "fat:50:2:40kg"
A blend that cannot be made is refused with the reason (exit code 2).
${EXIT_CODES_HELP}`,
    )
    .action((options: BlendOptions) => runBlend(options, io));
}

function runBlend(options: BlendOptions, io: Io): void {
  if (!NUMBER.test(options.target) || new Decimal(options.target).greaterThan(100))
    throw new CliError(`--target "${options.target}" is a fat % from 0 to 100`, EXIT.usage);
  const batchGrams = weight(options.batch, '--batch');
  if (!batchGrams.greaterThan(0))
    throw new CliError('--batch must weigh more than 0 g', EXIT.usage);
  const ask = {
    trims: options.trim.map(trimOf),
    targetFatPercent: new Decimal(options.target),
    batchGrams,
    ...(options.standard ? { standard: options.standard } : {}),
  };
  const blend = leastCostBlend(ask);
  if (!blend.ok) throw new CliError(`no blend: ${blend.message}`, EXIT.usage, []);
  const answer = leastCostAnswer(blend, ask);
  io.out(options.json ? `${JSON.stringify(answer, null, 2)}\n` : answerText(answer));
}
