import type { Transaction } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import { conflict } from '../http/app-error.ts';
import { composeMessage, standardFooter, type MessageContent } from '../mail/mail-message.ts';
import type { Person } from '../../shared/api/person.ts';
import { INVITATION_HOURS } from './invitation-repository.ts';
import { deliveryFact } from '../mail/mail-service.ts';

/** What an admin is told about an invitation: where it went and until when it works. */
export interface InvitationSent {
  readonly sentTo: string;
  readonly expiresAt: string;
  /**
   * With no mail server, the set-password link for the admin to pass on by hand: in this answer
   * only, never stored or shown again. Null when a mail server takes it to the person.
   */
  readonly link: string | null;
}

/** The invitation's words. */
export function invitationMessage(options: {
  person: Pick<Person, 'displayName' | 'username' | 'role'>;
  invitedBy: string;
  link: string;
  consoleUrl: string;
  kitchen: string;
}): MessageContent {
  const { person, kitchen } = options;
  const roleWords = {
    admin: 'an admin: people, formulas and every batch record',
    cook: 'a cook: running and recording batches, reading formulas',
    reviewer: 'a reviewer: reading every record and signing batches off',
  }[person.role];
  return composeMessage({
    subject: `Your Larderbook sign-in at ${kitchen}`,
    greeting: `Hello ${person.displayName},`,
    paragraphs: [
      `${options.invitedBy} has added you to Larderbook, where ${kitchen} keeps its formulas, batch records and cure log. You are ${roleWords}.`,
      `Your username is ${person.username}. Choose your own password with the link below; it works once, for ${INVITATION_HOURS} hours. After that, ask an admin to send a new invitation.`,
    ],
    action: { label: 'Set my password', url: options.link },
    footer: standardFooter(
      kitchen,
      options.consoleUrl,
      'If you did not expect it, you can ignore it: nothing happens until the link is used.',
    ),
  });
}

/**
 * Makes a new invitation for a person with an e-mail address and puts the message in the
 * outbox, inside the caller's transaction, with an audit entry. The caller kicks the mail
 * delivery once the transaction has committed.
 * @throws AppError 409 'no-email' without an address, 'inactive' for a deactivated person
 */
export async function sendInvitation(
  context: AppContext,
  transaction: Transaction,
  person: Person,
  by: { actor: { id: number; username: string; displayName: string }; ip?: string | undefined },
): Promise<InvitationSent> {
  if (!person.email)
    throw conflict(
      'no-email',
      `${person.displayName} has no e-mail address; add one first, or reset their password instead`,
    );
  if (!person.active)
    throw conflict('inactive', `${person.displayName} is deactivated; reactivate them first`);
  const { mail, invitations, audit } = context;
  const { token, expiresAt } = await invitations.create(transaction, person.id, by.actor.id);
  const link = mail.links.setPassword(token);
  const content = invitationMessage({
    person,
    invitedBy: by.actor.displayName,
    link,
    consoleUrl: mail.links.base(),
    kitchen: mail.kitchen,
  });
  await mail.outbox.enqueue(transaction, {
    ...content,
    to: { address: person.email, name: person.displayName },
    personId: person.id,
    kind: 'invitation',
    related: person.username,
  });
  await audit.append(
    {
      actor: by.actor,
      action: 'invitation-send',
      subject: person.username,
      detail: { to: person.email, expiresAt, ...deliveryFact(mail) },
      ...(by.ip === undefined ? {} : { ip: by.ip }),
    },
    transaction,
  );
  // Without a mail server nothing takes the link to the person: the admin does, from this answer.
  return { sentTo: person.email, expiresAt, link: mail.mailer.transport === 'local' ? link : null };
}
