import { ApiError } from '../core/api/api-error';
import { messageOf } from '../core/api/message-of';

/** GET /api/invitations/:token: a link that still works, and for whom. */
export interface InvitationInfo {
  readonly displayName: string;
  readonly expiresAt: string;
}

/** POST /api/invitations/:token: whose password the link has set. */
export interface InvitationAccepted {
  readonly username: string;
  readonly displayName: string;
}

/** Why an invitation link does not work, and what to do about it, in words. */
export interface InvitationRefusal {
  /** The code it came from: the API's, or 'no-token' for a link without one. */
  readonly code: string;
  /** A short heading: "This invitation link has expired". */
  readonly title: string;
  /** What to do now. */
  readonly advice: string;
}

const RESEND =
  'Ask an admin of your kitchen to re-send the invitation (People → Re-send invitation); the new message carries a new link.';

const REFUSALS: Readonly<Record<string, Omit<InvitationRefusal, 'code'>>> = {
  'no-token': {
    title: 'This page needs the link from your invitation',
    advice: `Open the link in the invitation message as it came, with everything after “?token=”. ${RESEND}`,
  },
  'invitation-unknown': {
    title: 'This invitation link is not known',
    advice: `Check that the whole link was copied from the message. If it still does not work: ${RESEND}`,
  },
  'invitation-used': {
    title: 'This invitation link has been used',
    advice:
      'If you set your password with it, sign in with that password. If you have forgotten it, ask an admin of your kitchen to re-send the invitation or to reset your password.',
  },
  'invitation-expired': {
    title: 'This invitation link has expired',
    advice: RESEND,
  },
  'invitation-replaced': {
    title: 'A newer invitation replaced this link',
    advice:
      'Use the link in the newest invitation message. If you cannot find it, ask an admin of your kitchen to re-send the invitation.',
  },
  'invitation-inactive': {
    title: 'This sign-in is deactivated',
    advice: 'Ask an admin of your kitchen whether it should be reactivated.',
  },
  'too-many-attempts': {
    title: 'Too many tries with invitation links',
    advice: 'Wait 15 minutes, then open the link again.',
  },
};

/**
 * Why an invitation link cannot set a password, and what the person should do.
 * @param error What checking or using the link failed with; 'no-token' when the address had none.
 * @returns A heading and advice; for a failure it does not know, the server's own words.
 */
export function invitationRefusal(error: unknown): InvitationRefusal {
  const code = error === 'no-token' ? error : error instanceof ApiError ? error.code : 'unknown';
  const known = REFUSALS[code];
  if (known) return { code, ...known };
  return {
    code,
    title: 'The invitation link could not be checked',
    advice: `${messageOf(error, 'Something went wrong.', 'sentence')} Try again in a moment; if it keeps failing, ask an admin of your kitchen.`,
  };
}

/**
 * Whether a failure means the link itself no longer works (as opposed to a passing problem such
 * as a lost connection or a refused password).
 * @param error What a request with the link failed with.
 */
export function linkRefused(error: unknown): boolean {
  return error instanceof ApiError && (error.status === 404 || error.status === 410);
}
