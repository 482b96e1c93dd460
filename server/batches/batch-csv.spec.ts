import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { csvCell, csvLine } from './batch-csv.ts';

describe('CSV cells', () => {
  it('should leave plain text as it is', () => {
    assert.equal(csvCell('261202-QB-01'), '261202-QB-01');
    assert.equal(csvCell(null), '');
    assert.equal(csvCell('156.25'), '156.25');
  });

  it('should quote commas, quotes and line breaks and double the quotes (RFC 4180)', () => {
    assert.equal(csvCell('belly, dry cure'), '"belly, dry cure"');
    assert.equal(csvCell('the "house" belly'), '"the ""house"" belly"');
    assert.equal(csvCell('line one\nline two'), '"line one\nline two"');
  });

  it('should defuse cells a spreadsheet would read as a formula', () => {
    assert.equal(csvCell('=1+1'), "'=1+1");
    assert.equal(csvCell('+1'), "'+1");
    assert.equal(csvCell('-2'), "'-2");
    assert.equal(csvCell('@SUM(A1)'), "'@SUM(A1)");
    assert.equal(csvCell('\tx'), "'\tx");
    assert.equal(csvCell('=HYPERLINK("x","y")'), `"'=HYPERLINK(""x"",""y"")"`);
  });

  it('should end every record with CRLF', () => {
    assert.equal(csvLine(['a', 'b,c', null]), 'a,"b,c",\r\n');
  });
});
