import type { ServerConfig } from '../config.ts';
import type { Database } from '../db/database.ts';
import { MailDelivery } from './mail-delivery.ts';
import { createMailer, type Mailer } from './mailer.ts';
import { OutboxRepository } from './outbox-repository.ts';
import { PublicLinks } from './public-links.ts';

/** Everything that sends mail shares: the outbox, its delivery, the links and the kitchen's name. */
export interface MailService {
  readonly outbox: OutboxRepository;
  readonly delivery: MailDelivery;
  readonly mailer: Mailer;
  readonly links: PublicLinks;
  /** How messages name the kitchen: "Larderbook at …". */
  readonly kitchen: string;
  /** Finishes the delivery run going on and closes the transport. */
  close(): Promise<void>;
}

/**
 * What an audit entry of a message says of its delivery: `kept: true` when no mail server is set
 * up, as the message then stays in the outbox and never leaves; nothing otherwise.
 */
export function deliveryFact(mail: Pick<MailService, 'mailer'>): { kept?: true } {
  return mail.mailer.transport === 'local' ? { kept: true } : {};
}

/** The domain of an address such as "Larderbook <larder@example.com>", for Message-IDs. */
function domainOf(from: string): string {
  const match = /@([A-Za-z0-9.-]+)>?\s*$/.exec(from);
  return match?.[1] ?? 'localhost';
}

/** Builds the mail service: the local outbox, or SMTP when LARDER_SMTP_URL is set. */
export function openMail(db: Database, config: ServerConfig, now: () => Date): MailService {
  const mailer = createMailer(config);
  const outbox = new OutboxRepository(db, mailer.transport, domainOf(config.mailFrom), now);
  const delivery = new MailDelivery(outbox, mailer);
  return {
    outbox,
    delivery,
    mailer,
    links: new PublicLinks(config),
    kitchen: config.kitchenName,
    close: () => delivery.stop(),
  };
}
