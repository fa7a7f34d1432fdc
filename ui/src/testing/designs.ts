import { workedExampleDesign as freshWorkedExample, type LinkDesignInput } from '@beamwright/link-core';

/**
 * The repository's one worked example design (LB-01, link-core/METHODS.md §10.1): 20 dBm at 1550 nm,
 * W0 = 25 mm, θ = 1 mrad, 2 km, 100 mm receiver; 12.33 dB with the spherical wave.
 */
export const workedExampleDesign: LinkDesignInput = freshWorkedExample();
