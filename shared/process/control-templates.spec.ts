import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { CONTROL_TEMPLATES, controlTemplate } from './control-templates.ts';

/** °C to two places, as the sources' own °C figures are printed. */
function twoPlaces(celsius: string): string {
  return new Decimal(celsius).toFixed(2);
}

describe('the control templates', () => {
  it('hold every key of the formula syntax, once each', () => {
    assert.deepEqual(
      CONTROL_TEMPLATES.map((template) => template.key),
      [
        'fsis-lethality-instant',
        'fsis-lethality-table',
        'fsis-lethality-table-7log',
        'fsis-poultry-uncured',
        'fsis-poultry-cured',
        'fsis-cooling-option-1',
        'fsis-cooling-option-2',
        'fsis-cooling-cured',
        'food-code-cooling',
        'food-code-cook-comminuted',
        'food-code-cook-whole-muscle',
        'food-code-cook-poultry',
        'cold-holding',
        'hot-holding',
        'receiving-cold',
        'curing-room',
      ],
    );
  });

  it('each name a published source, an application and a corrective action', () => {
    for (const template of CONTROL_TEMPLATES) {
      assert.match(template.source, /FSIS|Food Code|USDA/, template.key);
      assert.ok(template.appliesTo.length > 10, template.key);
      assert.ok(template.defaultAction.length > 10, template.key);
    }
  });

  it('convert the °F limits exactly: 70 °F is 21.111… °C, not 21 °C', () => {
    const cooling = controlTemplate('food-code-cooling')?.limit;
    assert.equal(cooling?.type, 'cooling');
    // source: FDA Food Code 2022, §3-501.14: 70 °F; (70 − 32) × 5/9 = 190/9
    assert.equal(cooling.stages[0].toC, new Decimal(190).div(9).toString());
  });

  // source: the Food Code and FSIS figures themselves (145, 155, 158, 160, 165, 135, 41, 40,
  // 130, 80, 120, 55 °F) with t/°C = (t/°F − 32) × 5/9, rounded by hand to two places
  const conversions: [string, (key: string) => string, string][] = [
    ['food-code-cook-whole-muscle', (k) => hold(k, 0), '62.78'],
    ['food-code-cook-comminuted', (k) => hold(k, 2), '68.33'],
    ['fsis-lethality-instant', (k) => hold(k, 0), '70.00'],
    ['fsis-poultry-uncured', (k) => hold(k, 0), '71.11'],
    ['food-code-cook-poultry', (k) => hold(k, 0), '73.89'],
    ['hot-holding', (k) => bound(k, 'min'), '57.22'],
    ['cold-holding', (k) => bound(k, 'max'), '5.00'],
    ['curing-room', (k) => bound(k, 'max'), '4.44'],
    ['fsis-cooling-option-1', (k) => stageEnd(k, 'from', 0), '54.44'],
    ['fsis-cooling-option-1', (k) => stageEnd(k, 'to', 0), '26.67'],
    ['fsis-cooling-option-2', (k) => stageEnd(k, 'from', 0), '48.89'],
    ['fsis-cooling-option-2', (k) => stageEnd(k, 'to', 1), '12.78'],
  ];
  for (const [key, pick, expected] of conversions) {
    it(`${key} reads ${expected} °C`, () => {
      assert.equal(twoPlaces(pick(key)), expected);
    });
  }

  it('time the FSIS option-1 stages 1.5 h and 5 h, each from its own start', () => {
    const limit = controlTemplate('fsis-cooling-option-1')?.limit;
    assert.equal(limit?.type, 'cooling');
    // source: FSIS Appendix B (1999), option 1
    assert.deepEqual(
      limit.stages.map((stage) => [stage.withinS, stage.countedFrom]),
      [
        ['5400', 'stage-start'],
        ['18000', 'stage-start'],
      ],
    );
  });

  it('ask 100 ppm ingoing nitrite of the cured cooling option', () => {
    // source: FSIS Appendix B (1999), cured-product option, ≥ 100 ppm ingoing sodium nitrite
    assert.equal(controlTemplate('fsis-cooling-cured')?.minNitritePpm, '100');
  });
});

function hold(key: string, row: number): string {
  const limit = controlTemplate(key)?.limit;
  if (limit?.type !== 'hold') throw new Error(`${key} is not a hold`);
  return limit.rows[row].tempC;
}

function bound(key: string, side: 'min' | 'max'): string {
  const limit = controlTemplate(key)?.limit;
  if (limit?.type === 'at-most' && side === 'max') return limit.max;
  if (limit?.type === 'at-least' && side === 'min') return limit.min;
  if (limit?.type === 'between') return limit[side];
  throw new Error(`${key} has no ${side}`);
}

function stageEnd(key: string, end: 'from' | 'to', stage: number): string {
  const limit = controlTemplate(key)?.limit;
  if (limit?.type !== 'cooling') throw new Error(`${key} is not a cooling`);
  return end === 'from' ? limit.stages[stage].fromC : limit.stages[stage].toC;
}
