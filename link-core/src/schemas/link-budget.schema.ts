/**
 * The result of evaluateLink: the budget of METHODS.md §10.1 as an ordered list of terms plus the named
 * quantities an engineer reads off it. Results are produced by link-core, so this schema is for
 * consumers that receive a budget over the wire (the API response, stored revisions) and for
 * documentation; the hot path never parses it.
 */
import { z } from 'zod';
import { finiteNumber } from './fields.js';
import { TURBULENCE_MODELS } from './link-design.schema.js';

/** Stable keys of the budget terms, in the order they appear. */
export const BUDGET_TERM_KEYS = [
  'transmitPower',
  'transmitOptics',
  'geometricSpread',
  'turbulenceBeamSpread',
  'atmosphericAttenuation',
  'pointingLoss',
  'receiveOptics',
  'receiverSensitivity',
  'scintillationFade',
  'systemAllowance',
] as const;
export type BudgetTermKey = (typeof BUDGET_TERM_KEYS)[number];

/**
 * One step of the budget. `valueDb` is the signed contribution to the link margin: the transmit
 * power counts positive (in dBm), every loss and allowance negative (in dB), and the sensitivity
 * term is −S (in dB relative to 1 mW). A loss term can be a gain (positive `valueDb`) where the
 * physics gives one (the pointing term on an obscured aperture); it is never clamped. Summing `valueDb` over the terms gives the link margin, and
 * summing the terms up to `receiveOptics` gives the received power in dBm — a waterfall chart is
 * the running sum.
 */
export const BudgetTermSchema = z.object({
  key: z.enum(BUDGET_TERM_KEYS),
  /** human-readable name, e.g. "Geometric spread (beam larger than the aperture)" */
  label: z.string(),
  valueDb: finiteNumber(),
  /** 'dBm' only for the transmit power and the sensitivity, 'dB' for the rest */
  unit: z.enum(['dB', 'dBm']),
  /** the formula or method behind the value, in one line */
  method: z.string(),
  /** the published source (author, title, year, equation) or "common practice" */
  source: z.string(),
});
export type BudgetTerm = z.infer<typeof BudgetTermSchema>;

/** A finding worth showing beside the budget (receiver overload, field of view, model validity). */
export const BudgetCheckSchema = z.object({
  key: z.string(),
  severity: z.enum(['info', 'warning']),
  message: z.string(),
});
export type BudgetCheck = z.infer<typeof BudgetCheckSchema>;

export const LinkBudgetSchema = z.object({
  /** ordered terms; their valueDb sum is linkMarginDb */
  terms: z.array(BudgetTermSchema),
  /** 'defocused' when the datasheet divergence exceeds the diffraction limit, else 'collimated' */
  beamModel: z.enum(['collimated', 'defocused']),
  /** far-field half-angle actually used (the larger of the datasheet value and M²λ/(πW0)) [rad] */
  halfAngleDivergenceRad: finiteNumber(),
  /** diffraction-limited half-angle M²λ/(πW0) [rad] */
  diffractionHalfAngleRad: finiteNumber(),
  /**
   * Rayleigh range πW0²/(M²λ) of the collimated launch, i.e. a beam with its waist at the aperture [m]
   * (how far this aperture could keep a beam near W0). A defocused beam has a virtual waist behind
   * the aperture with a much shorter Rayleigh range: beamEnvelope reports both.
   */
  rayleighRangeM: finiteNumber(),
  /** 1/e² beam radius at the receiver W(L) [m] */
  beamRadiusAtReceiverM: finiteNumber(),
  /**
   * turbulence model the budget used. Optional here (and in the two fields below) so that budgets
   * stored by engines before 0.3 still parse: those were computed with the spherical wave.
   */
  turbulenceModel: z.enum(TURBULENCE_MODELS).optional(),
  /** long-term (turbulence-spread) 1/e² beam radius W_LT [m]; equals beamRadiusAtReceiverM for the spherical wave or Cn² = 0 */
  longTermBeamRadiusM: finiteNumber().optional(),
  /** radial rms beam wander √⟨r_c²⟩ [m], contained in W_LT (for information); 0 for the spherical wave */
  beamWanderRmsM: finiteNumber().optional(),
  /** fraction of the beam power inside the (annular) receive aperture, centred, in [0, 1] (0 only by underflow, when the obscuration blocks the beam) */
  captureFraction: finiteNumber(),
  /** geometric (capture) loss, positive [dB] */
  geometricLossDb: finiteNumber(),
  /** visibility used by the model after any MOR conversion (2 % contrast) [m] */
  effectiveVisibilityM: finiteNumber(),
  /** specific attenuation γ [dB/km] */
  specificAttenuationDbPerKm: finiteNumber(),
  /** atmospheric loss γ·L, positive [dB] */
  atmosphericLossDb: finiteNumber(),
  /**
   * pointing loss [dB], relative to the centred capture, from the exact annular capture under the
   * Rician error: the mean loss or, for an outage-based design, the loss exceeded with the outage
   * probability. Signed: negative (a gain, shown as one) when an offset moves power from behind a
   * central obscuration onto the annulus.
   */
  pointingLossDb: finiteNumber(),
  pointingLossModel: z.enum(['mean', 'outage']),
  /** mean received power at the receiver's reference plane [dBm] */
  receivedPowerDbm: finiteNumber(),
  /** spherical-wave Rytov variance β0² (0 when the fade margin is off or Cn² = 0) */
  rytovVarianceSpherical: finiteNumber(),
  /** aperture-averaged scintillation index σ_I²(D) (0 when the fade margin is off or Cn² = 0) */
  scintillationIndex: finiteNumber(),
  /** fade margin at the design probability, positive [dB]; 0 when excluded */
  scintillationFadeMarginDb: finiteNumber(),
  /** allowance subtracted for ageing and dirt [dB] */
  systemMarginDb: finiteNumber(),
  /** P_rx − S − F_scint − M_system [dB] */
  linkMarginDb: finiteNumber(),
  checks: z.array(BudgetCheckSchema),
});
export type LinkBudget = z.infer<typeof LinkBudgetSchema>;
