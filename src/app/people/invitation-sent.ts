/** An invitation that went out (POST /api/people, POST /api/people/:id/invitation). */
export interface InvitationSent {
  /** The address it went to. */
  readonly sentTo: string;
  /** When its link stops working (ISO 8601). */
  readonly expiresAt: string;
  /**
   * With no mail server, the link for the admin to pass on by hand: this answer is the only
   * time it is shown. Null when a mail server takes it to the person.
   */
  readonly link: string | null;
}
