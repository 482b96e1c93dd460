import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import type { PresentedResult } from '../../shared/index.ts';
import { assertExit, runLarder, showRun, stdoutJson } from '../helpers/run-larder.ts';

const HAM = ['calc', 'ham-pump', '--meat', '10kg', '--start', today()];

// The demo ham by hand. Curing salt at 0.25 % of green weight (6.25 % nitrite), the trade's
// usual level for a pumped ham (common practice, no source), injected at 12 %: 0.25 % × 6.25 %
// × 10⁶ = 156.25 ppm by the pumped-product formula; the cover (25 %, salt and sugar only) adds
// no nitrite, and by method two the same nitrite over meat and all pickle is 156.25 ÷ 1.37 =
// 114.05 ppm; the larger, 156.25, is within 200 ppm and above the usual 120 ppm minimum.
// source: USDA FSIS Directive 7620.3, ch. 3 (pumped formula, immersion method two); 9 CFR 424.21(c)
describe('larder calc on the demo pumped ham (ham-pump, 10 kg)', () => {
  it('checks 156.25 ppm, says by which formula, and weighs the cover brine on its own', async () => {
    const run = await runLarder(HAM);
    assertExit(run, 0);
    assert.match(
      run.stdout,
      /PASS\s+Ingoing sodium nitrite \(injected brine, FSIS pumped-product formula\): 156\.3 ppm is within the 200 ppm limit/,
      showRun(run),
    );
    assert.match(run.stdout, /counting the cover brine\s+114\.1 ppm\s+\(meat and all pickle/);
    assert.match(run.stdout, /WEIGH: COVER BRINE MAKE-UP/);
    // Cover 25 % of 10 kg = 2500 g: kosher salt 3 % = 75.0 g, sugar 2 % = 50.0 g, water 2375 g.
    assert.match(run.stdout, /kosher salt\s+3\.00 %\s+75\.0 g/);
    assert.match(run.stdout, /water\s+95\.00 %\s+2375 g/);
  });

  it('gives the exact figure in JSON', async () => {
    const run = await runLarder([...HAM, '--json']);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    const max = result.checks.find((c) => c.id === 'nitrite-max');
    assert.equal(max?.exact, '156.25', JSON.stringify(max));
  });
});
