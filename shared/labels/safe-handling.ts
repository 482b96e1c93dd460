import type { AssemblyFormula, BatchFormula, Formula } from '../formula/formula-types.ts';

/** Whether a product needs the safe handling instructions of raw meat and poultry, and why. */
export interface SafeHandling {
  readonly required: boolean;
  /** Why, in words for the record. */
  readonly reason: string;
}

/** The process-control rules of an in-plant lethality step (FSIS Appendix A): a cooked product. */
const LETHALITY_RULE = /^fsis-lethality-/;

/** The sections asking for the instructions: poultry's, meat's, or both for a mixture. */
function sections(formulas: readonly Formula[]): string {
  const all = formulas.flatMap((formula) => {
    const species = 'species' in formula ? formula.species : undefined;
    return species === undefined ? [] : Array.isArray(species) ? species : [species];
  });
  const poultry = all.includes('poultry') || all.includes('mixed');
  const meat = all.some((s) => s !== 'poultry');
  return [meat ? '9 CFR 317.2(l)' : '', poultry ? '9 CFR 381.125(b)' : '']
    .filter(Boolean)
    .join(', ');
}

/** Whether a formula makes a meat or poultry product: a cure or a blend of a named species. */
function isMeat(formula: Formula): boolean {
  return (formula.kind === 'cure' || formula.kind === 'blend') && formula.species !== undefined;
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
  if (!isMeat(formula)) return { required: false, reason: 'not a meat or poultry product' };
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
  return { required: true, reason: `${why} (${sections([formula])})` };
}

/**
 * Whether a unit of an assembly must carry the safe handling instructions, and why. An assembly
 * with no meat or poultry part needs none. Its formula's `label.ready_to_eat` decides when it is
 * set (a burger kit of raw patties is not ready to eat whatever its bun is; a sandwich of cooked
 * meat is); without it, the unit needs them when any meat or poultry part does
 * ({@link safeHandling} of that part), since a raw part is not made ready to eat by being packed
 * beside cooked ones: common practice, no source.
 * source: as {@link safeHandling}: 9 CFR 381.125(b) (read, 2019 CFR), 317.2(l) (from memory)
 * @param parts the formulas of the batches its parts were made from
 */
export function assemblySafeHandling(
  assembly: AssemblyFormula,
  parts: readonly BatchFormula[],
): SafeHandling {
  const meat = parts.filter(isMeat);
  if (meat.length === 0) return { required: false, reason: 'no meat or poultry part' };
  const stated = assembly.label?.ready_to_eat;
  if (stated === true) return { required: false, reason: 'ready to eat, as its formula says' };
  if (stated === false)
    return {
      required: true,
      reason: `not ready to eat, as its formula says (${sections(meat)})`,
    };
  const raw = meat.filter((part) => safeHandling(part).required);
  if (raw.length === 0)
    return { required: false, reason: 'every meat or poultry part is ready to eat' };
  const titles = raw.map((part) => part.title).join(', ');
  return {
    required: true,
    reason: `${titles} ${raw.length === 1 ? 'is' : 'are'} raw or not ready to eat (${sections(raw)})`,
  };
}
