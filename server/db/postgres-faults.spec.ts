import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { isWriteConflict, postgresFault } from './postgres-faults.ts';

/** A failed query as Sequelize hands it over: PostgreSQL's error under `parent`. */
const failed = (code: string, constraint?: string) => ({
  name: 'SequelizeDatabaseError',
  parent: { code, ...(constraint ? { constraint } : {}) },
});

// source: PostgreSQL 15 documentation, Appendix A "PostgreSQL Error Codes"
describe('PostgreSQL failures that are about the database', () => {
  it('should run a write again after a serialization failure, a deadlock or a lot code taken meanwhile', () => {
    assert.equal(isWriteConflict(failed('40001')), true);
    assert.equal(isWriteConflict(failed('40P01')), true);
    assert.equal(isWriteConflict(failed('23505', 'batches_lot_code_key')), true);
  });

  it('should not run a write again for any other failure, a duplicate username among them', () => {
    assert.equal(isWriteConflict(failed('23505', 'people_username_key')), false);
    assert.equal(isWriteConflict(failed('42601')), false);
    assert.equal(isWriteConflict(new Error('a bug')), false);
  });

  it('should answer a lost connection or a server shutting down or starting as unavailable', () => {
    for (const code of ['57P01', '57P03', '08006', 'ECONNREFUSED', 'ECONNRESET'])
      assert.equal(postgresFault(failed(code)), 'unavailable', code);
    assert.equal(postgresFault({ name: 'SequelizeConnectionRefusedError' }), 'unavailable');
  });

  it('should answer a connection ended under a query, which pg reports without a code, as unavailable', () => {
    // source: pg's own messages for a connection lost under a query, node_modules/pg/lib/client.js
    for (const message of [
      'Connection terminated unexpectedly',
      'Client has encountered a connection error and is not queryable',
    ])
      assert.equal(
        postgresFault({ name: 'SequelizeDatabaseError', parent: new Error(message) }),
        'unavailable',
        message,
      );
    assert.equal(postgresFault(new Error('a bug')), undefined);
  });

  it('should answer conflicts that outlasted their tries as busy and a read-only server as read-only', () => {
    assert.equal(postgresFault(failed('40001')), 'busy');
    assert.equal(postgresFault(failed('25006')), 'read-only');
    assert.equal(postgresFault(failed('23505', 'people_username_key')), undefined);
  });
});
