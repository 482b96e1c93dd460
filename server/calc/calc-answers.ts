/** The most bytes of finished answers one process keeps: about 1,700 answers of a cure's size. */
const MAX_BYTES = 8 * 1024 * 1024;

/** What a calculation answer depends on: every input of calculateBatch, by value. */
export interface CalcAnswerKey {
  /** The formula file's name (its text names its id). */
  readonly file: string;
  /** The formula file's revision (sha-256 of its text). */
  readonly revision: string;
  /** For an assembly, the revision of every formula its parts may come from; '' otherwise. */
  readonly libraryRevision: string;
  readonly units: string;
  /** The server's today (the default start day and the span a start may lie in). */
  readonly today: string;
  /** The batch options as sent, every value a string (the route's schema holds them so). */
  readonly batch: Readonly<Partial<Record<string, string>>>;
}

/** The key's text: the batch's options in a fixed order, so the same batch always gives it. */
export function calcAnswerKeyText(key: CalcAnswerKey): string {
  const options = Object.keys(key.batch)
    .sort()
    .map((name) => [name, key.batch[name]]);
  return JSON.stringify([
    key.file,
    key.revision,
    key.libraryRevision,
    key.units,
    key.today,
    options,
  ]);
}

/**
 * Finished calculation answers (the JSON bytes), by everything the answer depends on
 * (calcAnswerKeyText). A calculation is a pure function of the formula's text, the batch, the
 * units and today, so an answer found under the same key is the answer the calculation would
 * give: a saved or edited formula has a new revision and so a new key, and nothing is ever
 * removed for being stale, only for room (the least recently used first). Only answers that
 * were sent with 200 are kept; refusals with a status (400, 404, 422) are worked out each time.
 */
export class CalcAnswers {
  private readonly answers = new Map<string, Buffer>();
  private bytes = 0;
  private found = 0;
  private asked = 0;

  /** @param maxEntries how many answers at most; 0 keeps none (LARDER_CALC_CACHE=0) */
  constructor(
    private readonly maxEntries: number,
    private readonly maxBytes = MAX_BYTES,
  ) {}

  /** The answer kept under this key, now the most recently used; undefined when none is. */
  get(key: string): Buffer | undefined {
    if (this.maxEntries === 0) return undefined;
    this.asked++;
    const answer = this.answers.get(key);
    if (answer === undefined) return undefined;
    this.found++;
    // A Map keeps insertion order: taking it out and back in makes it the newest.
    this.answers.delete(key);
    this.answers.set(key, answer);
    return answer;
  }

  /** Keeps an answer, making room by dropping the least recently used. */
  set(key: string, answer: Buffer): void {
    if (this.maxEntries === 0 || answer.length > this.maxBytes) return;
    const old = this.answers.get(key);
    if (old) {
      this.answers.delete(key);
      this.bytes -= old.length;
    }
    this.answers.set(key, answer);
    this.bytes += answer.length;
    for (const [oldest, kept] of this.answers) {
      if (this.answers.size <= this.maxEntries && this.bytes <= this.maxBytes) break;
      this.answers.delete(oldest);
      this.bytes -= kept.length;
    }
  }

  /** How many answers are kept, their bytes, and how many asks found one since start. */
  stats(): { entries: number; bytes: number; asked: number; found: number } {
    return { entries: this.answers.size, bytes: this.bytes, asked: this.asked, found: this.found };
  }
}
