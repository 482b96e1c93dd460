import { availableParallelism } from 'node:os';
import path from 'node:path';
import { SAFE_WORKFLOW_RULES, type WorkflowRules } from '../shared/workflow/workflow-rules.ts';

/** How the server runs: a demo with invented data, or production. */
export type ServerMode = 'demo' | 'production';

/** Everything the server reads from its environment, checked once at start. */
export interface ServerConfig {
  readonly mode: ServerMode;
  readonly host: string;
  readonly port: number;
  /** Folder for the database file and other data. */
  readonly dataDir: string;
  /** The SQLite database file (unused when databaseUrl is set). */
  readonly databaseFile: string;
  /**
   * postgres:// URL of a PostgreSQL database (LARDER_DB_URL) for a group of kitchens or several
   * server processes; null keeps the records in the SQLite file.
   */
  readonly databaseUrl: string | null;
  /** The folder of formula YAML files: the source of truth for formulas. */
  readonly formulasDir: string;
  readonly sessionSecret: string;
  /** Folder of the built console, served at /; absent when the console is not built. */
  readonly consoleDir: string;
  /** Failed sign-in attempts allowed per address in a 15-minute window, form and Basic together. */
  readonly signInLimit: number;
  /**
   * Milliseconds a write waits while another program holds the database's write lock, before
   * it is answered 503 database-busy.
   */
  readonly busyTimeoutMs: number;
  /**
   * The address people open the console at, for links in e-mails (no trailing slash); null
   * means http://HOST:PORT of the running server (see server/mail/public-links.ts).
   */
  readonly publicUrl: string | null;
  /** smtp:// or smtps:// URL of the mail server; null keeps every message in the local outbox. */
  readonly smtpUrl: string | null;
  /** The From address of every message. */
  readonly mailFrom: string;
  /** How the messages name the kitchen: "Larderbook at …". */
  readonly kitchenName: string;
  /**
   * How many sites the demo seeds (LARDER_DEMO_SITES): 2, the smokehouse and its second shop
   * (the default), or 1, the smokehouse alone, as a single kitchen sees Larderbook.
   */
  readonly demoSites: 1 | 2;
  /** The kitchen's address as its product labels print it; null when not given. */
  readonly kitchenAddress: string | null;
  /** Minutes between two runs of the reminder scheduler. */
  readonly reminderMinutes: number;
  /**
   * Which proxies in front of the server to believe about the client's address and protocol
   * (Express's "trust proxy"): false for none, a number of hops, or addresses and subnets.
   */
  readonly trustProxy: TrustProxy;
  /**
   * Production behind https: the session cookie is Secure and answers carry HSTS, so a browser
   * never sends the cookie, or opens the console, over plain http.
   */
  readonly httpsOnly: boolean;
  /** The sign-off and curing rules (shared/workflow/workflow-rules.ts); all on by default. */
  readonly workflow: WorkflowRules;
  /**
   * Server processes sharing the port (node:cluster): LARDER_PROCESSES, by default
   * defaultProcesses() of the database in use.
   */
  readonly processes: number;
  /**
   * How many finished calculation answers each process keeps (LARDER_CALC_CACHE, default 500;
   * 0 keeps none): see server/calc/calc-answers.ts.
   */
  readonly calcCacheEntries: number;
}

/** The most server processes LARDER_PROCESSES may ask for. */
const MAX_PROCESSES = 64;

/**
 * How many server processes run when LARDER_PROCESSES is not set. SQLite has one writer at a
 * time, so more processes only queue for its lock: one. PostgreSQL takes writers side by side,
 * so one process per CPU the server may use (never more than MAX_PROCESSES).
 */
export function defaultProcesses(
  env: NodeJS.ProcessEnv,
  cpus: number = availableParallelism(),
): number {
  return env.LARDER_DB_URL ? Math.min(Math.max(cpus, 1), MAX_PROCESSES) : 1;
}

/** Proxies to believe: none (false), the nearest N hops, or a list of addresses and subnets. */
export type TrustProxy = false | number | string;

/** A setting that cannot be used; the server refuses to start with the message. */
export class ConfigError extends Error {
  override readonly name = 'ConfigError';
}

/** The workflow rules' settings, by the rule each turns off. */
const WORKFLOW_SETTINGS: Readonly<Record<keyof WorkflowRules, string>> = {
  separateSignOff: 'LARDER_SEPARATE_SIGN_OFF',
  lockSignedOff: 'LARDER_LOCK_SIGNED_OFF',
  cureBeforeDone: 'LARDER_CURE_BEFORE_DONE',
};

/** The workflow rules from on/off settings; an unset one keeps its safe default (on). */
function workflowRules(env: NodeJS.ProcessEnv): WorkflowRules {
  const rules = { ...SAFE_WORKFLOW_RULES };
  for (const [rule, name] of Object.entries(WORKFLOW_SETTINGS) as [keyof WorkflowRules, string][]) {
    const text = env[name];
    if (text === undefined || text === '') continue;
    if (text !== 'on' && text !== 'off')
      throw new ConfigError(`${name} must be on or off, not "${text}"`);
    rules[rule] = text === 'on';
  }
  return rules;
}

// A fixed secret is fine for the demo's invented data and never accepted in production.
const DEMO_SECRET = 'larderbook-demo-only-session-secret-not-for-production';

function integer(
  env: NodeJS.ProcessEnv,
  name: string,
  fallback: number,
  min: number,
  max: number,
): number {
  const text = env[name];
  if (text === undefined || text === '') return fallback;
  const value = Number(text);
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new ConfigError(`${name} must be a whole number from ${min} to ${max}, not "${text}"`);
  }
  return value;
}

/** A URL setting with one of the allowed protocols, or null when it is not set. */
function url(env: NodeJS.ProcessEnv, name: string, protocols: readonly string[]): string | null {
  const text = env[name];
  if (text === undefined || text === '') return null;
  let parsed: URL;
  try {
    parsed = new URL(text);
  } catch {
    throw new ConfigError(`${name} must be a URL, e.g. ${protocols[0]}//host:port`);
  }
  if (!protocols.includes(parsed.protocol))
    throw new ConfigError(
      `${name} must start with ${protocols.map((p) => `${p}//`).join(' or ')}, not ${parsed.protocol}//`,
    );
  return text;
}

/** Where the records are kept: the PostgreSQL URL when one is set, else the SQLite file. */
export function databaseLocation(
  config: Pick<ServerConfig, 'databaseFile' | 'databaseUrl'>,
): string {
  return config.databaseUrl ?? config.databaseFile;
}

/**
 * Reads and checks the settings. Production refuses to start without a real session secret.
 * @throws ConfigError naming the setting at fault
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const mode = env.LARDER_MODE ?? 'demo';
  if (mode !== 'demo' && mode !== 'production') {
    throw new ConfigError(`LARDER_MODE must be demo or production, not "${mode}"`);
  }
  const secret = env.LARDER_SESSION_SECRET;
  if (mode === 'production' && (!secret || secret.length < 32)) {
    throw new ConfigError(
      'production needs LARDER_SESSION_SECRET: a random secret of at least 32 characters',
    );
  }
  const dataDir = path.resolve(env.LARDER_DATA ?? 'data');
  const smtpUrl = url(env, 'LARDER_SMTP_URL', ['smtp:', 'smtps:']);
  // A made-up sender is refused by most mail servers, silently or not: say so at start instead.
  if (smtpUrl && !env.LARDER_MAIL_FROM)
    throw new ConfigError(
      'LARDER_SMTP_URL needs LARDER_MAIL_FROM: the address messages are sent from, e.g. "Larderbook <larder@example.com>"',
    );
  const publicUrl = url(env, 'LARDER_PUBLIC_URL', ['http:', 'https:']);
  const trustProxy = proxies(env.LARDER_TRUST_PROXY);
  const httpsOnly = mode === 'production' && publicUrl?.startsWith('https:') === true;
  // The server itself speaks plain http, so an https address means a proxy ends TLS in front of
  // it; without believing that proxy, every request looks like plain http and the Secure session
  // cookie would never be set: nobody could sign in.
  if (httpsOnly && trustProxy === false)
    throw new ConfigError(
      'LARDER_PUBLIC_URL is https, so a proxy ends TLS in front of Larderbook: set LARDER_TRUST_PROXY to it (e.g. loopback when it runs on this machine)',
    );
  return {
    mode,
    host: env.LARDER_HOST ?? '127.0.0.1',
    port: integer(env, 'LARDER_PORT', 4310, 0, 65535),
    dataDir,
    databaseFile: path.resolve(env.LARDER_DB ?? path.join(dataDir, 'larderbook.sqlite')),
    databaseUrl: url(env, 'LARDER_DB_URL', ['postgres:', 'postgresql:']),
    // The demo edits a copy of the demo formulas in its data folder, never the checkout's own files.
    formulasDir: path.resolve(
      env.LARDER_FORMULAS ?? (mode === 'demo' ? path.join(dataDir, 'formulas') : 'formulas'),
    ),
    sessionSecret: secret ?? DEMO_SECRET,
    consoleDir: path.resolve(env.LARDER_CONSOLE ?? 'dist/console/browser'),
    signInLimit: integer(env, 'LARDER_SIGN_IN_LIMIT', 10, 1, 10_000),
    busyTimeoutMs: integer(env, 'LARDER_BUSY_TIMEOUT_MS', 10_000, 50, 600_000),
    publicUrl: publicUrl?.replace(/\/+$/, '') ?? null,
    smtpUrl,
    mailFrom: env.LARDER_MAIL_FROM || 'Larderbook <larderbook@localhost>',
    kitchenName: env.LARDER_KITCHEN || (mode === 'demo' ? 'Quillmoor Smokehouse' : 'the kitchen'),
    demoSites: integer(env, 'LARDER_DEMO_SITES', 2, 1, 2) as 1 | 2,
    // The demo's address is invented, as its kitchen is.
    kitchenAddress:
      env.LARDER_KITCHEN_ADDRESS?.trim() || (mode === 'demo' ? '14 Kiln Lane, Quillmoor' : null),
    reminderMinutes: integer(env, 'LARDER_REMINDER_MINUTES', 15, 1, 24 * 60),
    trustProxy,
    httpsOnly,
    workflow: workflowRules(env),
    processes: integer(env, 'LARDER_PROCESSES', defaultProcesses(env), 1, MAX_PROCESSES),
    calcCacheEntries: integer(env, 'LARDER_CALC_CACHE', 500, 0, 100_000),
  };
}

// Addresses, subnets and Express's names for them (loopback, linklocal, uniquelocal).
const PROXY_ADDRESS = /^(loopback|linklocal|uniquelocal|[0-9a-f.:]+(\/\d{1,3})?)$/i;

/**
 * LARDER_TRUST_PROXY as Express takes it. "true" (believe any address) is refused: then anyone
 * could name their own address in X-Forwarded-For and escape the sign-in limit.
 */
function proxies(text: string | undefined): TrustProxy {
  if (text === undefined || text === '' || text === 'false' || text === 'off') return false;
  if (/^\d+$/.test(text)) {
    const hops = Number(text);
    if (hops >= 1 && hops <= 10) return hops;
  } else {
    const parts = text.split(',').map((part) => part.trim());
    if (parts.every((part) => PROXY_ADDRESS.test(part))) return parts.join(', ');
  }
  throw new ConfigError(
    `LARDER_TRUST_PROXY must be loopback, a number of proxies from 1 to 10, or the proxy's addresses or subnets (e.g. 10.0.0.5 or 10.0.0.0/8), not "${text}"`,
  );
}
