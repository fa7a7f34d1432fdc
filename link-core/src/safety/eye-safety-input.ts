import type { LinkBudget } from '../schemas/link-budget.schema.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { dbmToWatts } from '../units/decibels.js';
import type { EyeSafetyInput } from './classification.js';

/**
 * The eye-safety input of a link design: the transmitter's CW power [W], wavelength [m] and exit
 * beam radius W0 (1/e²) [m], and the far-field half angle (1/e²) [rad] the beam actually has. That
 * angle is the budget's (a datasheet divergence never below the diffraction limit, METHODS.md §1.5);
 * without a budget, the design's own datasheet half angle, or 0 (a collimated beam: the worst case
 * for the hazard distance) when the design states none.
 *
 * One home for the rule, so the workspace, the api and the link sheet assess the same beam.
 * @example eyeSafetyInputOf(design, evaluateLink(design)) // then assessEyeSafety(...)
 */
export function eyeSafetyInputOf(design: LinkDesignInput, budget?: Pick<LinkBudget, 'halfAngleDivergenceRad'> | null): EyeSafetyInput {
  return {
    powerW: dbmToWatts(design.transmitter.powerDbm),
    wavelengthM: design.transmitter.wavelengthM,
    apertureBeamRadiusM: design.transmitter.waistRadiusM,
    halfAngleDivergenceRad: budget?.halfAngleDivergenceRad ?? design.transmitter.halfAngleDivergenceRad ?? 0,
  };
}
