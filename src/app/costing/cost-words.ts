import type { CostLineRecord } from '../../../shared/api/cost-record.ts';

/** Where a line's price came from, in words: "lot R261201-01", "latest price". */
export function costSourceWords(line: Pick<CostLineRecord, 'source' | 'lot' | 'unpriced'>): string {
  if (line.unpriced !== null) return line.unpriced;
  if (line.source === 'lot') return `lot ${line.lot ?? ''}`.trim();
  if (line.source === 'earlier-batch') return `batch ${line.lot ?? ''}`.trim();
  return 'latest price';
}

/**
 * The lines with no price, those with the same reason together, in the order met: "sea salt,
 * black pepper (never received with a price); water (stocked by volume, weighed in the batch)".
 */
export function unpricedWords(
  unpriced: readonly { readonly name: string; readonly reason: string }[],
): string {
  const byReason = new Map<string, string[]>();
  for (const line of unpriced)
    byReason.set(line.reason, [...(byReason.get(line.reason) ?? []), line.name]);
  return [...byReason].map(([reason, names]) => `${names.join(', ')} (${reason})`).join('; ');
}
