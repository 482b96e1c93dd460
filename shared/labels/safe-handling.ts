import type { Formula } from '../formula/formula-types.ts';

/** Whether a product needs the safe handling instructions of raw meat and poultry, and why. */
export interface SafeHandling {
  readonly required: boolean;
  /** Why, in words for the record. */
  readonly reason: string;
}

/** The process-control rules of an in-plant lethality step (FSIS Appendix A): a cooked product. */
const LETHALITY_RULE = /^fsis-lethality-/;

/** The section asking for the instructions: poultry's, meat's, or both for a mixture. */
function sections(formula: Formula): string {
  const species = 'species' in formula ? formula.species : undefined;
  const list = Array.isArray(species) ? species : [species];
  const poultry = list.includes('poultry') || species === 'mixed';
  const meat = list.some((s) => s !== 'poultry');
  return [meat ? '9 CFR 317.2(l)' : '', poultry ? '9 CFR 381.125(b)' : '']
    .filter(Boolean)
    .join(', ');
}

/**
 * Whether a batch of a formula is raw or not-ready-to-eat meat or poultry, which must carry the
 * safe handling instructions: a cure or a blend of a named species that is not ready to eat. The
 * formula's `label.ready_to_eat` says so when it is set; without it, a product is taken as ready
 * to eat only when its controls hold an in-plant lethality step (FSIS Appendix A), taken as the
 * product's cook before packing: common practice, no source. A sauce or a dough is not a meat or
 * poultry product.
 * source: 9 CFR 381.125(b) (read, 2019 CFR): "Safe handling instructions shall be provided for
 * all poultry products not processed in accordance with the provisions of § 381.150(a) or that
 * have not undergone other processing that would render them ready-to-eat"; 9 CFR 317.2(l) for
 * meat, the same, from memory; FSIS Directive 10240.4, Resource 1: a product "which has not
 * received an adequate lethality treatment for pathogens (i.e., raw or partially cooked
 * product)" is not ready to eat, and "Use of Safe Handling Instruction (SHI) labeling required".
 */
export function safeHandling(formula: Formula): SafeHandling {
  const meat = (formula.kind === 'cure' || formula.kind === 'blend') && formula.species;
  if (!meat) return { required: false, reason: 'not a meat or poultry product' };
  const stated = formula.label?.ready_to_eat;
  const cooked =
    stated ?? (formula.controls ?? []).some((control) => LETHALITY_RULE.test(control.rule ?? ''));
  if (cooked)
    return {
      required: false,
      reason:
        stated === undefined
          ? 'cooked to a lethality control before packing: ready to eat'
          : 'ready to eat, as its formula says',
    };
  const why =
    formula.kind === 'blend'
      ? 'raw meat or poultry'
      : 'cured but not cooked to a lethality: not ready to eat';
  return { required: true, reason: `${why} (${sections(formula)})` };
}
