import { evaluateLink, LINK_CORE_VERSION, type LinkBudget, type LinkDesign } from '@beamwright/link-core';
import { checkedBudget } from '../common/checked-budget.js';

/**
 * The budget stored with a revision: exactly link-core's evaluateLink of the stored design, so the
 * number on the planner's screen (computed in the browser) and the stored number are one computation.
 * Checked against LinkBudgetSchema first: a budget with a non-finite figure is a 422, never stored.
 * Callers compute it before their transaction opens, so a refused budget leaves nothing half-saved.
 */
export function computeBudget(design: LinkDesign): { budget: LinkBudget; linkCoreVersion: string } {
  return { budget: checkedBudget(evaluateLink(design)), linkCoreVersion: LINK_CORE_VERSION };
}
