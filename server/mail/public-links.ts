/**
 * The addresses links in messages point at: LARDER_PUBLIC_URL, or else http://HOST:PORT of the
 * running server (the port known once it listens, for LARDER_PORT=0). Never taken from a
 * request's Host header, which whoever sends the request chooses.
 */
export class PublicLinks {
  private port: number;

  constructor(private readonly settings: { publicUrl: string | null; host: string; port: number }) {
    this.port = settings.port;
  }

  /** Tells the links the port the server listens on. */
  listeningOn(port: number): void {
    this.port = port;
  }

  /** The console's address, without a trailing slash. */
  base(): string {
    if (this.settings.publicUrl) return this.settings.publicUrl;
    const host = this.settings.host;
    // A wildcard address is where the server listens, not where anyone can open it.
    const name = host === '0.0.0.0' || host === '::' ? 'localhost' : host;
    return `http://${name.includes(':') ? `[${name}]` : name}:${this.port}`;
  }

  /** The page that sets a password from an invitation. */
  setPassword(token: string): string {
    return `${this.base()}/set-password?token=${encodeURIComponent(token)}`;
  }

  /** A batch's page in the console. */
  batch(lot: string): string {
    return `${this.base()}/batches/${encodeURIComponent(lot)}`;
  }
}
