/**
 * Lot codes: YYMMDD-XX-NN. The batch's start date, two to four upper-case initials of the formula
 * id's words (quillmoor-belly → QB, hot-link-cure → HLC) and a sequence per day and prefix from 01.
 * Past 99 batches of one formula on one day the sequence simply grows a digit.
 */
export const LOT_CODE_PATTERN = /^\d{6}-[A-Z0-9]{2,4}-\d{2,3}$/;

/** The most batches of one formula a lot code can number on one day. */
export const MAX_LOT_SEQUENCE = 999;

/** The initials of a formula id: first letter of each word, at most four, at least two. */
export function formulaInitials(formulaId: string): string {
  const words = formulaId.toUpperCase().split('-').filter(Boolean);
  const initials = words.map((word) => word[0]).join('');
  if (initials.length >= 2) return initials.slice(0, 4);
  // A one-word id ("bacon") takes its first two characters instead.
  return (words.join('') + 'X').slice(0, 2);
}

/** The part of a lot code before the sequence, with its trailing dash: "261202-QB-". */
export function lotPrefix(startedOn: string, formulaId: string): string {
  const [year, month, day] = startedOn.split('-');
  return `${year.slice(2)}${month}${day}-${formulaInitials(formulaId)}-`;
}

/** A lot code from its prefix and sequence number. */
export function lotCode(prefix: string, sequence: number): string {
  return `${prefix}${String(sequence).padStart(2, '0')}`;
}

/**
 * The half-open range [low, high) of codes that start with a prefix, so that a search can walk
 * the UNIQUE index on lot_code: "261202-QB" → ["261202-QB", "261202-QC").
 */
export function prefixRange(prefix: string): readonly [string, string] {
  const last = prefix.charCodeAt(prefix.length - 1);
  return [prefix, prefix.slice(0, -1) + String.fromCharCode(last + 1)];
}
