import type { LinkBudget, LinkDesign } from '@beamwright/link-core';
import type { Link } from './link.entity.js';

/**
 * The link row's copy of its latest revision's figures, which the links list sorts and filters on
 * without reading every revision: one rule for a new link, a new revision and the demo seed.
 */
export function latestRevisionColumns(
  design: Pick<LinkDesign, 'rangeM'> & { transmitter: Pick<LinkDesign['transmitter'], 'wavelengthM'> },
  budget: Pick<LinkBudget, 'linkMarginDb' | 'receivedPowerDbm'>,
): Pick<Link, 'latestLinkMarginDb' | 'latestReceivedPowerDbm' | 'latestRangeM' | 'latestWavelengthM'> {
  return {
    latestLinkMarginDb: budget.linkMarginDb,
    latestReceivedPowerDbm: budget.receivedPowerDbm,
    latestRangeM: design.rangeM,
    latestWavelengthM: design.transmitter.wavelengthM,
  };
}
