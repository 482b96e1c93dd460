import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { describe, it } from 'node:test';
import { readFormula } from '../../../../shared/formula/read-formula.ts';
import type { Formula } from '../../../../shared/formula/formula-types.ts';
import { holdWords, recipeOf } from './recipe-words.ts';

function demo(id: string): Formula {
  const file = `formulas/${id}.yaml`;
  const formula = readFormula(readFileSync(file, 'utf8'), file).formula;
  assert.ok(formula, `${file} reads`);
  return formula;
}

describe('recipeOf', () => {
  it('should give a cure its ingredients as shares of the green meat, its hold and its controls in words', () => {
    const recipe = recipeOf(demo('quillmoor-belly'));
    const cure = recipe.groups[0];
    assert.equal(cure.basis, 'of the green meat weight');
    // source: formulas/quillmoor-belly.yaml (fine sea salt 2.25 %, curing salt 0.25 %)
    assert.deepEqual(
      cure.lines.slice(0, 2).map((l) => [l.name, l.amount]),
      [
        ['fine sea salt', '2.25 %'],
        ['curing salt no. 1 (6.25 % nitrite)', '0.25 %'],
      ],
    );
    assert.equal(
      recipe.timing[0],
      'Cure 2 days per cm of thickness, at least 7 days in all; turn the pieces every 2 days.',
    );
    const room = recipe.controls.find((c) => c.title === 'Curing cooler');
    // The curing room: 36–40 °F. source: USDA, "Pork: Slaughtering, Cutting, Preserving, and
    // Cooking on the Farm" (Farmers' Bulletin, 1978 revision), "Dry Curing"
    assert.match(room?.limit ?? '', /36 °F/);
    assert.equal(room?.how, 'check every 12 h');
    const smoker = recipe.controls.find((c) => c.step === 'cold-smoke');
    assert.match(smoker?.limit ?? '', /^at most 30 °C/);
  });

  it('should give a dough its sponge and baker’s percentages, and a mix its share of the base', () => {
    const bun = recipeOf(demo('pit-bun'));
    assert.match(bun.groups[0].title, /^Preferment: /);
    assert.equal(bun.groups.at(-1)?.basis, 'of the flour (the flour is 100 %)');
    assert.ok(bun.timing.includes('Made 1 day before it is served.'));
    const sauce = recipeOf(demo('house-sauce'));
    assert.equal(sauce.groups[0].basis, 'of the mayonnaise (made with pasteurized egg)');
    // source: formulas/house-sauce.yaml (Worcestershire sauce brings anchovy)
    const worcestershire = sauce.groups[0].lines.find((l) => l.name === 'Worcestershire sauce');
    assert.equal(worcestershire?.allergens, 'fish (anchovy)');
    assert.equal(sauce.cautions.length, 1);
  });

  it('should name an assembly’s parts by their titles, never by their ids', () => {
    const titles = new Map([['chuck-grind', 'Smokehouse burger grind 80/20']]);
    const burger = recipeOf(demo('smokehouse-burger'), (id) => titles.get(id) ?? id);
    // source: formulas/smokehouse-burger.yaml (2 portions of the grind per burger)
    const grind = burger.groups[0].lines.find((l) => l.name === 'Smokehouse burger grind 80/20');
    assert.equal(grind?.amount, '2 × portion');
  });

  it('should say a control it cannot read instead of failing', () => {
    const broken = {
      ...demo('house-sauce'),
      controls: [{ id: 'x', title: 'Odd', step: 'hold', measure: 'internal-temperature' as const }],
    } as Formula;
    assert.match(recipeOf(broken).controls[0].limit, /cannot be read/);
  });
});

describe('holdWords', () => {
  it('should read a per-weight rule with extra days', () => {
    assert.equal(
      holdWords({ days_per_kg: 3, plus_days: 2 }),
      'Cure 3 days per kg of the heaviest piece, plus 2 days.',
    );
  });
});
