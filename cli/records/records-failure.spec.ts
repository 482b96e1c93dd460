import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { EXIT } from '../cli-error.ts';
import { cliErrorOf, personNeeded, type RecordsFailureFacts } from './records-failure.ts';

function failure(facts: Partial<RecordsFailureFacts>): RecordsFailureFacts {
  return { kind: 'bad-input', code: 'bad-request', message: 'no', details: [], ...facts };
}

describe('record keeping failures as the command says them', () => {
  it('should exit 4 for a refused batch, without repeating its checks under the message', () => {
    const refused = cliErrorOf(
      failure({
        kind: 'refused',
        code: 'critical-limit',
        details: [{ check: 'nitrite-max', sentence: 'over the ceiling' }],
      }),
      'record',
    );
    assert.deepEqual([refused.exitCode, refused.details], [EXIT.critical, []]);
  });

  it('should exit 3 when a formula is at fault: missing while recording, or invalid', () => {
    assert.equal(cliErrorOf(failure({ kind: 'not-found' }), 'record').exitCode, EXIT.formula);
    const invalid = failure({ kind: 'refused', code: 'invalid-formula' });
    assert.equal(cliErrorOf(invalid, 'record').exitCode, EXIT.formula);
    const planOverFormula = failure({
      kind: 'refused',
      code: 'plan-refused',
      details: [{ reason: 'missing-formula', formula: 'brisket', formulaProblem: true }],
    });
    assert.equal(cliErrorOf(planOverFormula, 'record').exitCode, EXIT.formula);
  });

  it('should exit 2 for a lot or a person that is not there: the command line is at fault', () => {
    for (const verb of ['show', 'users'] as const)
      assert.equal(cliErrorOf(failure({ kind: 'not-found' }), verb).exitCode, EXIT.usage);
  });

  it('should exit 2, not 3, for a site that is not there or not theirs, even while recording', () => {
    const site = failure({ kind: 'not-found', code: 'no-such-site' });
    assert.equal(cliErrorOf(site, 'record').exitCode, EXIT.usage);
  });

  it('should exit 2 for bad input, a taken name or a role that may not, with each detail a line', () => {
    for (const kind of ['bad-input', 'conflict', 'forbidden'] as const)
      assert.equal(cliErrorOf(failure({ kind }), 'list').exitCode, EXIT.usage);
    const bad = cliErrorOf(
      failure({ details: [{ sentence: 'the start is too early' }, { option: 'start' }] }),
      'record',
    );
    assert.deepEqual(bad.details, ['the start is too early', '{"option":"start"}']);
  });

  it('should ask for the person in words that fit the verb', () => {
    assert.match(personNeeded('record').message, /^say who is recording: set LARDER_USER/);
    assert.match(
      personNeeded('list', 'http://kitchen:4310').message,
      /^say who is reading: .* to sign in to the server at http:\/\/kitchen:4310$/,
    );
  });
});
