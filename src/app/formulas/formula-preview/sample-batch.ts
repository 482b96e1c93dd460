import type { BatchOptions, FormulaKind } from '../formula-api-types';

/** The sample-batch fields of the preview, as typed (weights and lengths with their units). */
export interface SampleBatch {
  meat: string;
  thickness: string;
  largestPiece: string;
  pumpedWeight: string;
  pieces: string;
  piece: string;
  mixBy: 'total' | 'base';
  total: string;
  blendTotal: string;
  base: string;
}

/** A sample batch that makes sense for every kind, in metric units. */
export const DEFAULT_SAMPLE: SampleBatch = {
  meat: '5 kg',
  thickness: '4 cm',
  largestPiece: '',
  pumpedWeight: '',
  pieces: '24',
  piece: '',
  mixBy: 'total',
  total: '2 kg',
  blendTotal: '10 kg',
  base: '1 kg',
};

/** What each batch option is called on screen. */
export const OPTION_LABELS: Record<string, string> = {
  meat: 'Green weight',
  thickness: 'Thickness',
  'largest-piece': 'Heaviest piece',
  'pumped-weight': 'Weight after injecting',
  pieces: 'Pieces',
  piece: 'Piece weight',
  total: 'Total weight',
  base: 'Base weight',
};

/**
 * The batch options of a sample batch for a formula of `kind` (and, for a cure, its method);
 * empty fields are left out.
 */
export function batchOptions(
  kind: FormulaKind,
  sample: SampleBatch,
  cureMethod: string | null,
): BatchOptions {
  const given = (options: BatchOptions): BatchOptions =>
    Object.fromEntries(
      Object.entries(options)
        .map(([key, value]) => [key, value?.trim()])
        .filter(([, value]) => value),
    );
  switch (kind) {
    case 'cure':
      return given({
        meat: sample.meat,
        thickness: sample.thickness,
        largestPiece: sample.largestPiece,
        // The server takes a pumped weight only for pump cures.
        pumpedWeight: cureMethod === 'pump' ? sample.pumpedWeight : '',
      });
    case 'dough':
      return given({ pieces: sample.pieces, piece: sample.piece });
    case 'blend':
      return given({ total: sample.blendTotal });
    case 'mix':
      return given(sample.mixBy === 'base' ? { base: sample.base } : { total: sample.total });
    case 'assembly':
      // An assembly is planned for a count and a day, never calculated as one batch.
      return {};
  }
}

/** A batch-input message of the API in the console's words: "--meat" becomes "Green weight". */
export function batchMessage(message: string): string {
  return message.replace(/--([a-z-]+)/g, (whole, option: string) =>
    OPTION_LABELS[option] ? `“${OPTION_LABELS[option]}”` : whole,
  );
}
