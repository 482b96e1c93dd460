import path from 'node:path';
import type { NewPerson } from './people/people-repository.ts';
import type { ServerConfig } from './config.ts';

/** What the start banner tells, beyond the settings. */
export interface BannerFacts {
  readonly config: Pick<
    ServerConfig,
    'mode' | 'dataDir' | 'databaseFile' | 'formulasDir' | 'kitchenName'
  >;
  /** The address the server listens at, with its port. */
  readonly url: string;
  /** The checkout's own formula folder (formulas/), which the demo copies. */
  readonly shippedFormulas: string;
  /** The demo's sign-ins (empty in production). */
  readonly demoPeople: readonly NewPerson[];
  /** Whether nobody can sign in yet (production with no people). */
  readonly nobodyYet: boolean;
  /** How mail goes out, and how often reminders run. */
  readonly mail: string;
}

/**
 * The lines the server prints once it listens, in the order a person starting it needs them:
 * how mail goes, where the data lives, then the address and the sign-ins last, where the eye
 * lands when the output stops.
 */
export function startBanner(facts: BannerFacts): string[] {
  const { config } = facts;
  const demo = config.mode === 'demo';
  const sameAsShipped = path.resolve(config.formulasDir) === path.resolve(facts.shippedFormulas);
  const formulas =
    demo && !sameAsShipped
      ? `${config.formulasDir}, a copy of the checkout's formulas/ made on the first start; the console edits this copy, never formulas/ itself`
      : `${config.formulasDir}; the console edits these files`;
  const lines = [
    `Mail:      ${facts.mail}`,
    `Records:   ${config.databaseFile} (batches, people, process records)`,
    `Formulas:  ${formulas}`,
  ];
  if (demo)
    lines.push(
      `           To start the demo afresh: stop it, delete ${config.dataDir}, npm start.`,
    );
  lines.push('');
  lines.push(
    demo
      ? `Larderbook demo of the invented ${config.kitchenName} is running. Open the console at ${facts.url}`
      : `Larderbook is running. Open the console at ${facts.url}`,
  );
  if (demo && facts.demoPeople.length > 0) {
    lines.push('Sign in as one of:');
    const width = Math.max(...facts.demoPeople.map((p) => p.username.length));
    const pwWidth = Math.max(...facts.demoPeople.map((p) => p.password.length));
    for (const person of facts.demoPeople)
      lines.push(
        `  ${person.username.padEnd(width)}  password ${person.password.padEnd(pwWidth)}  ${person.displayName}, ${person.role}`,
      );
  } else if (facts.nobodyYet) {
    lines.push(
      'Nobody can sign in yet: create the first admin with  larder users add USERNAME --role admin',
    );
  }
  lines.push('Stop with Ctrl+C.');
  return lines;
}
