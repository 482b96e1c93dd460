import { dayWords } from '../../shared/presentation/date-words.ts';

/** A message's words, as plain text and as simple HTML built from the same parts. */
export interface MessageContent {
  readonly subject: string;
  readonly text: string;
  readonly html: string;
}

/** A message to one person, ready for the transport. */
export interface OutgoingMessage extends MessageContent {
  readonly to: { readonly address: string; readonly name: string | null };
  /** Stable for the message, so a mail server can tell a retry from a new message. */
  readonly messageId: string;
}

/** The parts every message is built from; each string is plain text, escaped for the HTML here. */
export interface MessageParts {
  readonly subject: string;
  /** "Hello Wren," */
  readonly greeting: string;
  readonly paragraphs: readonly string[];
  /** The one thing to click, shown as a button in HTML and as a bare link in text. */
  readonly action?: { readonly label: string; readonly url: string };
  /** Who sent it and how to change reminder choices: every message carries these. */
  readonly footer: readonly string[];
}

const HTML_ESCAPES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Text made safe to put into HTML, in element content and in quoted attributes alike. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c] ?? c);
}

/**
 * Builds the plain-text and HTML bodies from the same parts. Everything interpolated into the
 * HTML is escaped, names and lot codes included; the HTML is deliberately plain (inline styles,
 * no images, nothing loaded from elsewhere).
 */
export function composeMessage(parts: MessageParts): MessageContent {
  const text = [
    parts.greeting,
    '',
    ...parts.paragraphs.flatMap((p) => [p, '']),
    ...(parts.action ? [`${parts.action.label}: ${parts.action.url}`, ''] : []),
    '--',
    ...parts.footer,
    '',
  ].join('\n');
  const p = (body: string, style = ''): string =>
    `<p style="margin:0 0 14px;${style}">${escapeHtml(body)}</p>`;
  const action = parts.action
    ? `<p style="margin:4px 0 18px"><a href="${escapeHtml(parts.action.url)}" style="display:inline-block;padding:10px 18px;border-radius:8px;background:#7a3e1d;color:#ffffff;text-decoration:none;font-weight:600">${escapeHtml(parts.action.label)}</a></p>` +
      p(`Or open this address: ${parts.action.url}`, 'font-size:13px;color:#5c4b40')
    : '';
  const html = [
    '<!doctype html>',
    `<html><head><meta charset="utf-8"><title>${escapeHtml(parts.subject)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f6efe6;font-family:\'Fira Sans\',Arial,sans-serif;color:#2b211b;line-height:1.5">',
    '<div style="max-width:560px;margin:0 auto;padding:24px;border-radius:14px;background:#ffffff">',
    p(parts.greeting),
    ...parts.paragraphs.map((body) => p(body)),
    action,
    '<hr style="border:none;border-top:1px solid #e4d8cb;margin:18px 0">',
    ...parts.footer.map((body) => p(body, 'font-size:13px;color:#5c4b40')),
    '</div></body></html>',
    '',
  ].join('\n');
  return { subject: parts.subject, text, html };
}

/**
 * The footer every message carries: that it comes from Larderbook at the kitchen, and how to
 * change which reminders one gets.
 */
export function standardFooter(kitchen: string, consoleUrl: string, reason: string): string[] {
  return [
    `This message comes from Larderbook at ${kitchen}: the kitchen's formulas, batch records and cure reminders. ${reason}`,
    `To choose which reminders you get (turn days, ready days, overdue batches), sign in at ${consoleUrl} and open “My reminders” in the account menu, top right.`,
  ];
}

/** A date as people read it in a message, the console's form: "4 Dec 2026". */
export function dayText(isoDate: string): string {
  return dayWords(isoDate);
}
