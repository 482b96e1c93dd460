/**
 * The named, sourced critical limits a formula refers to (`rule: KEY`). CONTRACT STUB: the core
 * engineer fills CONTROL_TEMPLATES; the keys listed in the contract are fixed.
 */
import type { ControlTemplate } from './control-types.ts';

/** Every template, in the order a formula writer reads them. */
export const CONTROL_TEMPLATES: readonly ControlTemplate[] = [];

/** The template with this key, if there is one. */
export function controlTemplate(key: string): ControlTemplate | undefined {
  return CONTROL_TEMPLATES.find((template) => template.key === key);
}
