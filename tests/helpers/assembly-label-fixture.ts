/**
 * Assemblies for the label tests: an assembly formula of the test's own written beside the demo
 * formulas, batches of its parts, and what an assembly batch was made from (the assembly batch
 * itself is recorded by recordAssembly in lot-use-fixture.ts).
 */
import assert from 'node:assert/strict';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import type { TestServer } from './test-server.ts';

/** Writes an assembly formula into the server's formulas folder and has the server read it. */
export function writeAssembly(
  server: TestServer,
  formula: { id: string; title: string },
  lines: readonly string[],
): void {
  writeFileSync(
    path.join(server.formulasDir, `${formula.id}.yaml`),
    [
      'formula: 1',
      `id: ${formula.id}`,
      `title: ${formula.title}`,
      'kind: assembly',
      ...lines,
      '',
    ].join('\n'),
  );
  server.context.formulas.changed();
}

/** A batch of a demo formula, recorded by the cook; its lot code. */
export async function madeBatch(
  server: TestServer,
  formula: string,
  batch: object,
): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', { formula, batch });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

/** Records what an assembly batch was made from: [part, the part's batch, amount] each. */
export async function madeFrom(
  server: TestServer,
  lot: string,
  picks: readonly (readonly [string, string, string])[],
): Promise<void> {
  const response = await server.as('tobin').post(`/api/batches/${lot}/lots`, {
    picks: picks.map(([part, batch, amount]) => ({ part, batch, amount })),
  });
  assert.equal(response.status, 201, response.text);
}

/** A pack of our own: 12 slices of 25 g of the cold-smoked belly, kept cold, not ready to eat. */
export const BACON_PACK = {
  formula: { id: 'test-bacon-pack', title: 'Sliced bacon, 12 slices' },
  lines: [
    'components:',
    '  - { formula: quillmoor-belly, slices: 12, slice: 25 g, thickness: 4 cm }',
    'label: { storage: refrigerated, ready_to_eat: false }',
  ],
} as const;
