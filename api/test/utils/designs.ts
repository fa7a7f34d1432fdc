import { workedExampleDesign, type LinkDesignInput } from '@beamwright/link-core';

// The one worked example design of the repository (LB-01, link-core/METHODS.md §10.1): 12.33 dB
// with the spherical wave.
export { workedExampleDesign };

/** The worked example with a few fields changed, for revisions. */
export function designWith(changes: { rangeM?: number; powerDbm?: number; visibilityM?: number }): LinkDesignInput {
  const design = workedExampleDesign();
  if (changes.rangeM !== undefined) design.rangeM = changes.rangeM;
  if (changes.powerDbm !== undefined) design.transmitter.powerDbm = changes.powerDbm;
  if (changes.visibilityM !== undefined) design.atmosphere.visibilityM = changes.visibilityM;
  return design;
}
