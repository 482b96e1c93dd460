/**
 * The named, sourced critical limits a formula refers to (`rule: KEY`). Limits whose source
 * states them in °F are converted exactly (70 °F = 21.111… °C), never rounded.
 */
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import type { ControlTemplate, CoolingStage, HoldRow } from './control-types.ts';
import { appendixAHoldRows } from './lethality-table.ts';

/** °F as an exact °C decimal string. */
function fahrenheit(degrees: number): string {
  return fahrenheitToCelsius(new Decimal(degrees)).toString();
}

const MINUTE = 60;
const HOUR = 3600;

function stage(
  fromF: number,
  toF: number,
  withinS: number,
  countedFrom: CoolingStage['countedFrom'],
): CoolingStage {
  return { fromC: fahrenheit(fromF), toC: fahrenheit(toF), withinS: String(withinS), countedFrom };
}

function instant(degreesF: number): HoldRow[] {
  return [{ tempC: fahrenheit(degreesF), holdS: '0' }];
}

// source: USDA FSIS, "Compliance Guidelines for Meeting Lethality Performance Standards for
// Certain Meat and Poultry Products" (Appendix A), 1999; kept in the "FSIS Cooking Guideline for
// Meat and Poultry Products (Revised Appendix A)", Dec. 2021
const APPENDIX_A =
  'USDA FSIS, Compliance Guidelines for Meeting Lethality Performance Standards for Certain Meat ' +
  'and Poultry Products (Appendix A, 1999), time-temperature table for cooked beef, roast beef ' +
  'and cooked corned beef; kept in the FSIS Cooking Guideline for Meat and Poultry Products ' +
  '(Revised Appendix A), Dec. 2021';

// source: the same 1999 guideline's poultry figures, as summarised by Michigan State University
// Extension, "Time-Temperature Tables for Cooking Ready-to-Eat Poultry Products" (2020), and Ohio
// State University Meat Science, "Temperature Regulations/Guidelines" (1999)
const APPENDIX_A_POULTRY =
  'USDA FSIS, Compliance Guidelines for Meeting Lethality Performance Standards for Certain Meat ' +
  'and Poultry Products (Appendix A, 1999), poultry, as summarised by Michigan State University ' +
  'Extension, Time-Temperature Tables for Cooking Ready-to-Eat Poultry Products (2020), and Ohio ' +
  'State University Meat Science, Temperature Regulations/Guidelines (1999)';

// source: USDA FSIS, "Compliance Guidelines for Cooling Heat-Treated Meat and Poultry Products
// (Stabilization)" (Appendix B), 1999; revised as "FSIS Stabilization Guideline for Meat and
// Poultry Products (Revised Appendix B)", FSIS-GD-2021-13, Dec. 2021
const APPENDIX_B =
  'USDA FSIS, Compliance Guidelines for Cooling Heat-Treated Meat and Poultry Products ' +
  '(Stabilization) (Appendix B, 1999); FSIS Stabilization Guideline for Meat and Poultry ' +
  'Products (Revised Appendix B), FSIS-GD-2021-13, Dec. 2021';

const FOOD_CODE = 'FDA Food Code 2022';

const KEEP_COOKING =
  'Keep cooking until the limit is met. If the product cannot reach it, hold the batch for review.';
const CHILL_NOW =
  'Move the product to the blast chiller at once and hold the batch for review: it may need ' +
  'testing, re-cooking or throwing away.';

/** Every template, in the order a formula writer reads them. */
export const CONTROL_TEMPLATES: readonly ControlTemplate[] = [
  {
    key: 'fsis-lethality-instant',
    title: 'Cooking to 70 °C (158 °F), instant — meat other than poultry',
    measure: 'internal-temperature',
    // source: FSIS Appendix A (1999) time-temperature table, 158 °F row: 0 seconds; kept in the
    // Revised Appendix A (Dec. 2021)
    limit: { type: 'hold', rows: instant(158) },
    source: `${APPENDIX_A}: 158 °F, instant`,
    appliesTo: 'Cooked meat other than poultry (beef, pork, lamb): one reading at 70 °C suffices.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'fsis-lethality-table',
    title: 'Cooking time at temperature, FSIS table (6.5-log), 54.4–70 °C (130–158 °F)',
    measure: 'internal-temperature',
    limit: { type: 'hold', rows: appendixAHoldRows('6.5-log') },
    source: `${APPENDIX_A}, 6.5-log column`,
    appliesTo:
      'Cooked meat other than poultry, 6.5-log reduction of Salmonella: stay at or above one ' +
      'temperature of the table for its time.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'fsis-lethality-table-7log',
    title: 'Cooking time at temperature, FSIS table (7-log), 54.4–70 °C (130–158 °F)',
    measure: 'internal-temperature',
    limit: { type: 'hold', rows: appendixAHoldRows('7-log') },
    source: `${APPENDIX_A}, 7-log column`,
    appliesTo:
      'Cooked meat other than poultry where the plan needs a 7-log reduction of Salmonella: stay ' +
      'at or above one temperature of the table for its time.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'fsis-poultry-uncured',
    title: 'Cooking poultry to 71.1 °C (160 °F), instant — uncured',
    measure: 'internal-temperature',
    // source: FSIS Appendix A (1999), uncured poultry 160 °F, as summarised by MSU Extension (2020)
    // and OSU Meat Science (1999)
    limit: { type: 'hold', rows: instant(160) },
    source: `${APPENDIX_A_POULTRY}: uncured poultry 160 °F`,
    appliesTo: 'Cooked uncured poultry (chicken, turkey): one reading at 71.1 °C suffices.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'fsis-poultry-cured',
    title: 'Cooking poultry to 68.3 °C (155 °F), instant — cured or smoked',
    measure: 'internal-temperature',
    // source: FSIS Appendix A (1999), cured and smoked poultry 155 °F, as summarised by MSU
    // Extension (2020) and OSU Meat Science (1999)
    limit: { type: 'hold', rows: instant(155) },
    source: `${APPENDIX_A_POULTRY}: cured poultry 155 °F`,
    appliesTo: 'Cooked cured poultry: one reading at 68.3 °C suffices.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'fsis-cooling-option-1',
    title: 'Chilling, FSIS option 1: 54.4 → 26.7 °C in 1½ h, then → 4.4 °C in 5 h',
    measure: 'internal-temperature',
    // source: FSIS Appendix B (1999), option 1: 130 °F to 80 °F in 1.5 hours, 80 °F to 40 °F in
    // 5 hours, each stage timed on its own
    limit: {
      type: 'cooling',
      stages: [stage(130, 80, 1.5 * HOUR, 'stage-start'), stage(80, 40, 5 * HOUR, 'stage-start')],
    },
    source: `${APPENDIX_B}, option 1`,
    appliesTo: 'Cooked meat and poultry, cured or uncured.',
    defaultAction: CHILL_NOW,
  },
  {
    key: 'fsis-cooling-option-2',
    title:
      'Chilling, FSIS option 2: 48.9 → 26.7 °C in 1 h, → 12.8 °C within 6 h (begin within ' +
      '90 min of the cook)',
    measure: 'internal-temperature',
    // source: FSIS Appendix B (1999), option 2: chilling begins within 90 minutes of the cook;
    // 120 °F to 80 °F in 1 hour, 120 °F to 55 °F in 6 hours
    limit: {
      type: 'cooling',
      stages: [stage(120, 80, 1 * HOUR, 'stage-start'), stage(80, 55, 6 * HOUR, 'cooling-start')],
    },
    source: `${APPENDIX_B}, option 2`,
    appliesTo:
      'Cooked meat and poultry. Chilling should begin within 90 minutes of the end of the cook; ' +
      'keep that in your own log, it is not judged here.',
    defaultAction: CHILL_NOW,
  },
  {
    key: 'fsis-cooling-cured',
    title: 'Chilling cured product, FSIS: 54.4 → 26.7 °C in 5 h, then → 7.2 °C in 10 h',
    measure: 'internal-temperature',
    // source: from memory — FSIS Appendix B (1999) and the Revised Appendix B (FSIS-GD-2021-13),
    // cured products with at least 100 ppm ingoing sodium nitrite: "from 130 to 80 °F in 5 hours
    // and from 80 to 45 °F in 10 hours (15 hours total cooling time)". The Ohio State University
    // Meat Science summary (1999) reads 80 to 40 °F instead. Check the end point against the
    // current Revised Appendix B before relying on it.
    limit: {
      type: 'cooling',
      stages: [stage(130, 80, 5 * HOUR, 'stage-start'), stage(80, 45, 10 * HOUR, 'stage-start')],
    },
    source:
      `${APPENDIX_B}, cured products (end point 45 °F from memory of the FSIS text; the Ohio ` +
      'State University Meat Science summary of 1999 reads 40 °F)',
    appliesTo: 'Cured product only, with at least 100 ppm ingoing sodium nitrite.',
    // source: FSIS Appendix B (1999), cured-product option: 100 ppm ingoing sodium nitrite
    minNitritePpm: '100',
    defaultAction: CHILL_NOW,
  },
  {
    key: 'food-code-cooling',
    title: 'Cooling, Food Code: 57.2 → 21.1 °C within 2 h, → 5 °C within 6 h in all',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-501.14(A): 135 °F to 70 °F within 2 hours, and to 41 °F or
    // less within a total of 6 hours (time saved in the first stage may be used in the second)
    limit: {
      type: 'cooling',
      stages: [stage(135, 70, 2 * HOUR, 'stage-start'), stage(70, 41, 6 * HOUR, 'cooling-start')],
    },
    source: `${FOOD_CODE}, §3-501.14 Cooling`,
    appliesTo: 'Cooked food cooled in the kitchen (time/temperature control for safety food).',
    defaultAction: CHILL_NOW,
  },
  {
    key: 'food-code-cook-comminuted',
    title: 'Cooking ground meat, Food Code: 68.3 °C (155 °F) for 17 s, or its equivalents',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-401.11(A)(2) and its table: 145 °F 3 minutes, 150 °F
    // 1 minute, 155 °F 17 seconds (15 seconds before the 2017 edition), 158 °F < 1 second
    limit: {
      type: 'hold',
      rows: [
        { tempC: fahrenheit(145), holdS: String(3 * MINUTE) },
        { tempC: fahrenheit(150), holdS: String(1 * MINUTE) },
        { tempC: fahrenheit(155), holdS: '17' },
        { tempC: fahrenheit(158), holdS: '0' },
      ],
    },
    source: `${FOOD_CODE}, §3-401.11(A)(2) Cooking, comminuted meat, and its time-temperature table`,
    appliesTo: 'Ground and comminuted meat: burgers, sausage.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'food-code-cook-whole-muscle',
    title: 'Cooking whole cuts, Food Code: 62.8 °C (145 °F) for 15 s',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-401.11(A)(1): 145 °F for 15 seconds
    limit: { type: 'hold', rows: [{ tempC: fahrenheit(145), holdS: '15' }] },
    source: `${FOOD_CODE}, §3-401.11(A)(1) Cooking, whole-muscle meat`,
    appliesTo: 'Whole cuts of beef, pork and lamb.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'food-code-cook-poultry',
    title: 'Cooking poultry, Food Code: 73.9 °C (165 °F), instant',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-401.11(A)(3): poultry 165 °F for < 1 second
    limit: { type: 'hold', rows: instant(165) },
    source: `${FOOD_CODE}, §3-401.11(A)(3) Cooking, poultry`,
    appliesTo: 'Poultry, and anything stuffed with meat or poultry.',
    defaultAction: KEEP_COOKING,
  },
  {
    key: 'cold-holding',
    title: 'Cold holding: 5 °C (41 °F) or colder',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-501.16(A)(2): 41 °F or less
    limit: { type: 'at-most', max: fahrenheit(41) },
    source: `${FOOD_CODE}, §3-501.16(A)(2) Cold holding`,
    appliesTo: 'Raw and cooked product kept cold: walk-in, reach-in, display.',
    defaultAction:
      'Move the product to a cold unit that works. Hold it for review: how warm, and for how long.',
  },
  {
    key: 'hot-holding',
    title: 'Hot holding: 57.2 °C (135 °F) or hotter',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-501.16(A)(1): 135 °F or above
    limit: { type: 'at-least', min: fahrenheit(135) },
    source: `${FOOD_CODE}, §3-501.16(A)(1) Hot holding`,
    appliesTo: 'Cooked product kept hot for service.',
    defaultAction:
      'Reheat the product or move it to hot holding that works. Hold it for review: how long it ' +
      'was below the limit.',
  },
  {
    key: 'receiving-cold',
    title: 'Receiving chilled goods: 5 °C (41 °F) or colder',
    measure: 'internal-temperature',
    // source: FDA Food Code 2022, §3-202.11(A): refrigerated food received at 41 °F or below
    limit: { type: 'at-most', max: fahrenheit(41) },
    source: `${FOOD_CODE}, §3-202.11(A) Receiving temperature`,
    appliesTo: 'Chilled raw meat and other refrigerated deliveries.',
    defaultAction: 'Refuse the delivery, or set it apart and hold it for review.',
  },
  {
    key: 'curing-room',
    title: 'Curing room: 2.2–4.4 °C (36–40 °F)',
    measure: 'chamber-temperature',
    // source: USDA, "Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm" (Farmers'
    // Bulletin, 1978 revision), "Dry Curing" and "Sweet Pickle Cure": keep meat and pickle at
    // 36–40 °F
    limit: { type: 'between', min: fahrenheit(36), max: fahrenheit(40) },
    source:
      "USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm (Farmers' " +
      'Bulletin, 1978 revision), Dry Curing and Sweet Pickle Cure',
    appliesTo: 'The room or cooler where meat cures, dry or in brine.',
    defaultAction:
      'Bring the room back to temperature. Note how long it was out and hold the batch for review.',
  },
];

/** The template with this key, if there is one. */
export function controlTemplate(key: string): ControlTemplate | undefined {
  return CONTROL_TEMPLATES.find((template) => template.key === key);
}

/** Every template key, for an error that lists them. */
export function controlTemplateKeys(): string[] {
  return CONTROL_TEMPLATES.map((template) => template.key);
}
