// The recall PDF a server produces first in its life: the built server started as its own process
// on the seeded recall log, one GET /api/trace/recall.pdf over HTTP. Asked at once (the moment it
// says where it listens) and, on a second fresh server, after it has had a few seconds to itself.
import { setTimeout as sleep } from 'node:timers/promises';
import { basicAuth, startBenchServer } from './server-process.ts';

/** How long the second server is left alone before it is asked, ms. */
const SETTLE_MS = 5000;

/** A supplier lot the recall is asked for. */
export interface RecallSample {
  readonly supplier_lot: string;
  readonly supplier: string;
}

/** One fresh server, one recall PDF: the time to the last byte, its size, the server's memory. */
async function firstPdf(
  dataDir: string,
  sample: RecallSample,
  waitMs: number,
): Promise<{ ms: number; kb: number; status: number; rssBefore: number; rssAfter: number }> {
  // The seeded folder holds the demo people, so the demo server seeds nothing into it; kept.
  const server = await startBenchServer({ LARDER_DATA: dataDir }, { keepData: true });
  try {
    if (waitMs) await sleep(waitMs);
    const rssBefore = server.rssMb();
    const query = new URLSearchParams({
      supplierLot: sample.supplier_lot,
      supplier: sample.supplier,
    });
    const start = performance.now();
    const response = await fetch(`${server.url}/api/trace/recall.pdf?${query}`, {
      headers: basicAuth('imke', 'quillmoor-review'),
    });
    const body = await response.arrayBuffer();
    const ms = performance.now() - start;
    return {
      ms,
      kb: Math.round(body.byteLength / 1000),
      status: response.status,
      rssBefore,
      rssAfter: server.rssMb(),
    };
  } finally {
    await server.stop();
  }
}

/**
 * Prints the first recall PDF of a fresh server as a figure of its own: asked the moment the
 * server listens, and asked once it has been left alone for a few seconds.
 */
export async function benchFirstRecallPdf(
  dataDir: string,
  sample: RecallSample,
  targetMs: number,
): Promise<void> {
  process.stdout.write('Recall PDF, the first a fresh server produces (GET over HTTP)\n');
  for (const [label, wait] of [
    ['asked the moment it listens', 0],
    [`asked ${SETTLE_MS / 1000} s after it listens`, SETTLE_MS],
  ] as const) {
    const t = await firstPdf(dataDir, sample, wait);
    process.stdout.write(
      `  first PDF, ${label}: ${t.ms.toFixed(0)} ms (target < ${targetMs} ms), ` +
        `${t.status === 200 ? `${t.kb} kB` : `status ${t.status}`}; ` +
        `server RSS ${t.rssBefore.toFixed(0)} MB before, ${t.rssAfter.toFixed(0)} MB after\n`,
    );
  }
}
