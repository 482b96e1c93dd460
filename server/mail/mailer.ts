import nodemailer, { type NodemailerError, type Transporter } from 'nodemailer';
import type { TransportName } from '../../shared/api/outbox-message.ts';
import type { OutgoingMessage } from './mail-message.ts';

/** What became of handing one message to the transport. */
export interface Delivery {
  readonly ok: boolean;
  /** A refusal that retrying will not change (an SMTP 5xx, a rejected address). */
  readonly permanent: boolean;
  /** What the transport said, in its words (never a password). */
  readonly response: string;
}

/** Hands messages to a transport; the outbox keeps the record. */
export interface Mailer {
  readonly transport: TransportName;
  /** Where messages go, in words and without credentials, for the start-up line. */
  readonly description: string;
  /** Sends one message; never rejects: a failure comes back as `ok: false`. */
  send(message: OutgoingMessage): Promise<Delivery>;
  close(): void;
}

/** What the local transport answers: the outbox is where the message stays. */
export const LOCAL_RESPONSE = 'kept in the local outbox; nothing left this machine';

// Half a minute for a mail server to answer at each step; the next run tries again.
const SMTP_TIMEOUTS = { connectionTimeout: 15_000, greetingTimeout: 15_000, socketTimeout: 30_000 };

function options(message: OutgoingMessage, from: string) {
  return {
    from,
    to: message.to.name
      ? { name: message.to.name, address: message.to.address }
      : message.to.address,
    subject: message.subject,
    text: message.text,
    html: message.html,
    messageId: message.messageId,
  };
}

function failed(error: unknown): Delivery {
  const e = error as NodemailerError;
  const response = [e.code, e.response ?? e.message].filter(Boolean).join(': ');
  return { ok: false, permanent: e.permanent === true, response: response || 'sending failed' };
}

/**
 * The default: nodemailer composes each message (so addresses and headers are checked the same
 * way as for real mail) with its JSON transport, and nothing is sent anywhere. The outbox row
 * is the message; admins read it in the console.
 */
class LocalMailer implements Mailer {
  readonly transport = 'local';
  readonly description = 'the local outbox only (LARDER_SMTP_URL is not set): nothing is sent';
  private readonly transporter = nodemailer.createTransport({ jsonTransport: true });

  constructor(private readonly from: string) {}

  async send(message: OutgoingMessage): Promise<Delivery> {
    try {
      await this.transporter.sendMail(options(message, this.from));
      return { ok: true, permanent: false, response: LOCAL_RESPONSE };
    } catch (error) {
      return failed(error);
    }
  }

  close(): void {
    this.transporter.close();
  }
}

/** Real mail through the SMTP server of LARDER_SMTP_URL. */
class SmtpMailer implements Mailer {
  readonly transport = 'smtp';
  readonly description: string;
  private readonly transporter: Transporter;

  constructor(
    url: string,
    private readonly from: string,
  ) {
    const parsed = new URL(url);
    this.description = `${parsed.protocol}//${parsed.host}${parsed.username ? ` as ${decodeURIComponent(parsed.username)}` : ''}`;
    this.transporter = nodemailer.createTransport({ url, ...SMTP_TIMEOUTS });
  }

  async send(message: OutgoingMessage): Promise<Delivery> {
    try {
      const info = await this.transporter.sendMail(options(message, this.from));
      const rejected = (info.rejected ?? []).map(String);
      if (rejected.length > 0)
        return {
          ok: false,
          permanent: true,
          response: `refused ${rejected.join(', ')}: ${info.response ?? ''}`.trim(),
        };
      return { ok: true, permanent: false, response: info.response ?? 'accepted' };
    } catch (error) {
      return failed(error);
    }
  }

  close(): void {
    this.transporter.close();
  }
}

/** The local outbox by default; the SMTP server when a URL is given. */
export function createMailer(settings: { smtpUrl: string | null; mailFrom: string }): Mailer {
  return settings.smtpUrl
    ? new SmtpMailer(settings.smtpUrl, settings.mailFrom)
    : new LocalMailer(settings.mailFrom);
}
