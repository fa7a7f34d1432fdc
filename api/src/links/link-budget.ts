import { evaluateLink, LINK_CORE_VERSION, type LinkBudget, type LinkDesign } from '@beamwright/link-core';

/**
 * The budget stored with a revision: exactly link-core's evaluateLink of the stored design, so the
 * number on the planner's screen (computed in the browser) and the stored number are one computation.
 */
export function computeBudget(design: LinkDesign): { budget: LinkBudget; linkCoreVersion: string } {
  return { budget: evaluateLink(design), linkCoreVersion: LINK_CORE_VERSION };
}
