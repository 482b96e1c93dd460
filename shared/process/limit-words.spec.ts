import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { controlTemplate } from './control-templates.ts';
import { limitWords } from './limit-words.ts';

function wordsOf(key: string): string {
  const template = controlTemplate(key);
  assert.ok(template, key);
  return limitWords(template.limit, '°C');
}

describe('a critical limit in words for the records', () => {
  it('should give both stages of FSIS cooling option 1, each timed from its own start', () => {
    // source: USDA FSIS, Appendix B, Compliance Guidelines for Cooling Heat-Treated Meat and
    // Poultry Products (Stabilization), 1999, option 1: 130 °F to 80 °F within 1.5 hours, then
    // 80 °F to 40 °F within 5 hours. 130 °F = 54.4 °C, 80 °F = 26.7 °C, 40 °F = 4.4 °C.
    assert.equal(
      wordsOf('fsis-cooling-option-1'),
      'from 54.4 °C (130 °F) to 26.7 °C (80 °F) within 1 h 30 min; then to 4.4 °C (40 °F) within 5 h of reaching 26.7 °C (80 °F)',
    );
  });

  it('should count the Food Code cooling second stage from the start of cooling', () => {
    // source: FDA Food Code 2022, §3-501.14(A): 135 °F to 70 °F within 2 hours, and to 41 °F
    // within a total of 6 hours. 135 °F = 57.2 °C, 70 °F = 21.1 °C, 41 °F = 5 °C.
    assert.equal(
      wordsOf('food-code-cooling'),
      'from 57.2 °C (135 °F) to 21.1 °C (70 °F) within 2 h; then to 5 °C (41 °F) within 6 h of the start of cooling',
    );
  });

  it('should say a cold holding limit as an upper bound', () => {
    // source: FDA Food Code 2022, §3-501.16(A)(2): 5 °C (41 °F) or less
    assert.equal(wordsOf('cold-holding'), 'at most 5 °C (41 °F)');
  });

  it('should give a cooking limit as a temperature held for a time', () => {
    // source: FDA Food Code 2022, §3-401.11(A)(1)(b): 63 °C (145 °F) for 15 seconds
    assert.match(wordsOf('food-code-cook-whole-muscle'), /^62\.8 °C \(145 °F\) for 15 s/);
  });
});
