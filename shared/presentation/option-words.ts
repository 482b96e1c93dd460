/**
 * The core names a batch input in its messages the way the command line takes it ("give
 * --thickness to get a ready date"); the CLI prints that as it is. The console has boxes, not
 * flags: this puts a field's words in place of each option ("give the thickness of the thickest
 * piece to get a ready date"), so no flag reaches a cook's screen.
 */

/** Each batch option (as the CLI spells it) in a cook's words, as a box would name it. */
export const OPTION_WORDS: Readonly<Record<string, string>> = {
  start: 'the start date',
  want: 'the finished weight wanted',
  meat: 'the green meat weight',
  thickness: 'the thickness of the thickest piece',
  'largest-piece': 'the weight of the heaviest piece',
  water: 'the water',
  pump: 'the pump',
  'pumped-weight': 'the weight after injecting',
  pieces: 'the number of pieces',
  piece: 'the piece weight',
  loss: 'the loss allowance',
  flour: 'the total flour',
  ddt: 'the desired dough temperature',
  room: 'the room temperature',
  'flour-temp': 'the flour temperature',
  'preferment-temp': 'the preferment temperature',
  tap: 'the tap water temperature',
  friction: 'the friction factor',
  yeast: 'the yeast',
  total: 'the total weight',
  'target-fat': 'the target fat',
  'on-hand': 'the trimmings on hand',
  'fat-test': 'the fat test',
  portion: 'the portion weight',
  base: 'the base ingredient weight',
  count: 'the number of units',
  for: 'the service date',
};

// An option with the example of its value the CLI's words carry: "--on-hand KEY=WEIGHT".
const OPTION = /--([a-z]+(?:-[a-z]+)*)(?: [A-Z]+=[A-Z]+)?/g;
// A whole command to type: `larder plan ham --count N --for YYYY-MM-DD`.
const PLAN_COMMAND = /with `larder plan [^`]*`/g;

/**
 * A core message with each batch option in a field's words, and a sentence that began with an
 * option begun with a capital. Unknown options stay as they are, to be noticed.
 */
export function optionsInWords(message: string): string {
  return message
    .replace(PLAN_COMMAND, 'on the Plans page')
    .replace(OPTION, (whole, option: string, at: number, text: string) => {
      const words = OPTION_WORDS[option];
      if (words === undefined) return whole;
      const startsSentence = at === 0 || /[.!?:]\s$/.test(text.slice(Math.max(0, at - 2), at));
      return startsSentence ? words.charAt(0).toUpperCase() + words.slice(1) : words;
    });
}
