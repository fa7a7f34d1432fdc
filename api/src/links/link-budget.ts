import { evaluateLink, LINK_CORE_VERSION, type LinkBudget, type LinkDesign } from '@beamwright/link-core';
import { checkedBudget } from '../common/checked-budget.js';

/**
 * The budget stored with a revision: exactly link-core's evaluateLink of the stored design, so the
 * number on the planner's screen (computed in the browser) and the stored number are one computation.
 * Checked against LinkBudgetSchema first: a budget with a non-finite figure is a 422, never stored.
 * Callers compute it before their transaction opens, so a refused budget leaves nothing half-saved.
 *
 * @param path where the budget sits in the answer, for the 422's field paths
 */
export function computeBudget(design: LinkDesign, path = 'budget'): { budget: LinkBudget; linkCoreVersion: string } {
  return { budget: checkedBudget(evaluateLink(design), path), linkCoreVersion: LINK_CORE_VERSION };
}

/** A revision's variant as it is inserted: its place in the list, name, design and budget. */
export interface VariantRow {
  position: number;
  name: string;
  design: LinkDesign;
  budget: LinkBudget;
  linkCoreVersion: string;
}

/**
 * The budget of every variant of a revision, in the body's order, by the same rule as the
 * revision's own budget; a refused one is a 422 naming it (`variants.2.budget.linkMarginDb`).
 */
export function computeVariantBudgets(variants: readonly { name: string; design: LinkDesign }[]): VariantRow[] {
  return variants.map((variant, position) => ({ position, name: variant.name, design: variant.design, ...computeBudget(variant.design, `variants.${position}.budget`) }));
}
