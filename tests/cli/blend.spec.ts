import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { LeastCostAnswer } from '../../shared/api/cost-record.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';

const TRIMS = [
  '--trim',
  '90/10 lean:10:6.00:60 kg',
  '--trim',
  '80/20 chuck:20:4.50:50 kg',
  '--trim',
  '50/50 trim:50:2.00:40 kg',
];

describe('larder blend', () => {
  // The hand-solved case of shared/costing/least-cost-blend.spec.ts: 100 kg at 25 % fat is 25 kg
  // lean, 50 kg chuck and 25 kg 50/50, 25 × 6 + 50 × 4.5 + 25 × 2 = 425.00, 4.25 a kg. (derived:
  // the mass and fat balances of a linear blend)
  it('should print the cheapest mix with its cost per kilogram', async () => {
    const run = await runLarder([
      'blend',
      '--target',
      '25',
      '--batch',
      '100kg',
      ...TRIMS,
      '--json',
    ]);
    assertExit(run, 0);
    const answer = stdoutJson<LeastCostAnswer>(run);
    assert.deepEqual(
      answer.shares.map((share) => `${share.name} ${share.grams}`),
      ['90/10 lean 25000', '80/20 chuck 50000', '50/50 trim 25000'],
    );
    assert.equal(answer.costText, '425.00');
    assert.equal(answer.costPerKgText, '4.25');
  });

  // source: 9 CFR 319.15(a), ground beef at most 30 % fat (as quoted in
  // shared/reference/fat-standards.ts): 35 % is refused, with the reason, exit 2.
  it('should refuse a target above the standard with the reason', async () => {
    const run = await runLarder([
      'blend',
      '--target',
      '35',
      '--batch',
      '100kg',
      '--standard',
      'ground-beef',
      ...TRIMS,
    ]);
    assertCleanFailure(run, 2, /no blend: 35 % fat is above the 30 % that ground beef may have/, {
      oneLine: true,
    });
  });

  it('should refuse a trim it cannot read, saying how to write one', async () => {
    const run = await runLarder([
      'blend',
      '--target',
      '20',
      '--batch',
      '10kg',
      '--trim',
      'lean:ten:6:60kg',
    ]);
    assertCleanFailure(run, 2, /is not NAME:FAT:PRICE:ON HAND/, { oneLine: true });
  });
});
