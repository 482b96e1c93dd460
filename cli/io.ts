/** Where a command writes: injectable so that tests can run commands in-process. */
export interface Io {
  out(text: string): void;
  err(text: string): void;
  /** Whether standard error is a terminal, so progress may be drawn on it. */
  readonly errIsTty: boolean;
}

/** The process's own standard output and error. */
export const PROCESS_IO: Io = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
  errIsTty: Boolean(process.stderr.isTTY),
};

/** Today's date in the kitchen's own time zone, YYYY-MM-DD. */
export function today(): string {
  const now = new Date();
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
