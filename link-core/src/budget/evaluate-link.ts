/**
 * The link budget of METHODS.md §10.1 as an ordered list of terms, and the maximum range for a required
 * margin (METHODS.md §10.4).
 */
import { coherenceRadiusM } from '../turbulence/rytov.js';
import type { BudgetCheck, BudgetTerm, BudgetTermKey, LinkBudget } from '../schemas/link-budget.schema.js';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import { LinkDesignSchema, type LinkDesignInput } from '../schemas/link-design.schema.js';
import { BEAM_WAVE_FADE_DESCRIPTION, FOG_ATTENUATION_DESCRIPTION, POINTING_OUTAGE_DESCRIPTION, TERM_DESCRIPTIONS, type TermDescription } from './budget-terms.js';
import { emptyResolvedDesign, evaluateChainInto, newChainResult, resolveDesign, resolveDesignInto, specificAttenuationDbPerKm, type ChainResult, type ResolvedDesign } from './link-chain.js';
import { logOffsetAnnularCapture } from '../capture/capture.js';
import { captureFallsFromCentre, probabilityOfCaptureBelowRising, ricianOutageRadiusOverSigmaWithin, ricianOutageRadiusTable } from '../pointing/exact-pointing.js';
import { normalQuantileOf } from '../numeric/normal.js';
import { toFixedTwo } from './budget-text.js';
import { DB_PER_NATURAL_LOG_POWER as DB_PER_NEPER } from '../units/constants.js';

// The description is passed in (not looked up by key) so that each call site stays monomorphic.
function term(key: BudgetTermKey, description: TermDescription, valueDb: number): BudgetTerm {
  // `+ 0` turns −0 (a zero loss negated) into 0, so a budget survives a JSON round trip unchanged.
  return { key, label: description.label, valueDb: valueDb + 0, unit: description.unit, method: description.method, source: description.source };
}

/** Diffraction half-angle M²λ/(πW0) [rad]. */
function diffractionHalfAngle(design: ResolvedDesign): number {
  return (design.m2 * design.wavelengthM) / (Math.PI * design.apertureBeamRadiusM);
}

function collectChecks(design: ResolvedDesign, receivedPowerDbm: number, diffractionRad: number, chain: ChainResult): BudgetCheck[] {
  const checks: BudgetCheck[] = [];
  const hiddenOutage = hiddenPointingOutage(design, chain);
  if (hiddenOutage !== undefined) {
    checks.push({
      key: 'pointing-mean-hides-outage',
      severity: 'warning',
      message: `The mean pointing loss (${toFixedTwo(chain.pointingLossDb)} dB) hides outages: the pointing loss exceeded 0.1 % of the time is ${hiddenOutage.exact ? '' : 'at least '}${toFixedTwo(hiddenOutage.lossDb)} dB. Budget the pointing at an outage probability (for example 1e-3) to hold margin against it.`,
    });
  }
  if (design.halfAngleDivergenceRad > 0 && design.halfAngleDivergenceRad <= diffractionRad) {
    checks.push({
      key: 'divergence-below-diffraction-limit',
      severity: 'info',
      message: `The entered divergence is at or below the diffraction limit of this aperture (${(diffractionRad * 1e6).toFixed(1)} µrad half-angle); the beam is modelled as collimated at the aperture.`,
    });
  }
  if (design.overloadDbm !== undefined && receivedPowerDbm > design.overloadDbm) {
    checks.push({
      key: 'receiver-overload',
      severity: 'warning',
      message: `The mean received power (${receivedPowerDbm.toFixed(1)} dBm) exceeds the receiver overload level (${design.overloadDbm.toFixed(1)} dBm): add attenuation or defocus the beam.`,
    });
  }
  if (design.morInput) {
    checks.push({
      key: 'visibility-converted-from-mor',
      severity: 'info',
      message: 'Visibility entered as MOR (5 % contrast) was converted to the 2 % visibility (× ln 50/ln 20 = 1.30587) before the attenuation model was applied.',
    });
  }
  const step = publishedVisibilityStepKm(design);
  if (step !== undefined) {
    checks.push({
      key: 'published-model-step',
      severity: 'info',
      message: `The visibility (${design.visibility2PercentKm.toFixed(1)} km, 2 % contrast) is near ${step} km, where the ${design.kruse ? 'Kruse' : 'Kim'} model's wavelength exponent changes by a published step: the attenuation, and the margin, jump there by design of that model.`,
    });
  }
  if (design.kruse && design.visibility2PercentKm <= 6) {
    checks.push({
      key: 'kruse-in-fog',
      severity: 'info',
      message: "Below 6 km visibility Kruse's wavelength dependence is not supported by fog measurements (Pierce et al., 2001); Kim's model is preferred.",
    });
  }
  if (
    design.fogNumeratorPerKm > 0 &&
    (design.visibility2PercentKm < 0.05 || design.visibility2PercentKm > 1 || design.wavelengthM < 0.69e-6 || design.wavelengthM > 1.55e-6)
  ) {
    checks.push({
      key: 'fog-model-outside-validity',
      severity: 'warning',
      message: "Al Naboulsi's fog models are stated for 50 m–1 km visibility and 0.69–1.55 µm; this design lies outside that range, so the atmospheric term is an extrapolation (Kim's model covers haze and clear air).",
    });
  }
  if (design.fieldOfViewRad !== undefined && design.cn2 > 0) {
    // Turbulence blur of the focused spot ≈ λ/ρ0 (METHODS.md §6.4); the field of view should exceed it.
    const rho0 = coherenceRadiusM({ cn2: design.cn2, wavelengthM: design.wavelengthM, distanceM: design.rangeM, wave: 'spherical' });
    const blurRad = design.wavelengthM / rho0;
    if (blurRad > design.fieldOfViewRad) {
      checks.push({
        key: 'field-of-view-below-turbulence-blur',
        severity: 'warning',
        message: `The receiver field of view (${(design.fieldOfViewRad * 1e6).toFixed(0)} µrad half-angle) is smaller than the turbulence blur λ/ρ0 ≈ ${(blurRad * 1e6).toFixed(0)} µrad.`,
      });
    }
  }
  return checks;
}

/**
 * The published step of the visibility exponent within 10 % of the design's visibility: Kim's q(V)
 * at 50 km, Kruse's at 6 and 50 km (the other Kim breakpoints are continuous).
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001); Kruse et al. (1962).
 */
function publishedVisibilityStepKm(design: ResolvedDesign): number | undefined {
  if (design.fogNumeratorPerKm > 0) return undefined;
  const steps = design.kruse ? KRUSE_STEPS_KM : KIM_STEPS_KM;
  for (const step of steps) if (Math.abs(design.visibility2PercentKm / step - 1) <= 0.1) return step;
  return undefined;
}
const KIM_STEPS_KM = [50];
const KRUSE_STEPS_KM = [6, 50];

/** Probability at which the mean-mode pointing term is compared with the loss it hides. */
const HIDDEN_OUTAGE_PROBABILITY = 1e-3;
/** The mean hides an outage when the loss at that probability exceeds it by more than this [dB]. */
const HIDDEN_OUTAGE_EXCESS_DB = 1;
const RAYLEIGH_RADIUS_AT_HIDDEN_OUTAGE = Math.sqrt(-2 * Math.log(HIDDEN_OUTAGE_PROBABILITY));
const NORMAL_RADIUS_AT_HIDDEN_OUTAGE = -normalQuantileOf(HIDDEN_OUTAGE_PROBABILITY);

/**
 * r_p/σ exceeded with 1e-3 against ν/σ = 0, 1/16, …, 20 (about a millisecond to build, once at
 * load; beyond 20 the series leave their fast domain): for any bias/jitter ratio up to 20 two
 * neighbouring entries bracket r_p to 0.06σ or better (exact-pointing.ts), where the closed-form
 * bracket below is 0.63σ wide.
 */
const HIDDEN_OUTAGE_RADII = ricianOutageRadiusTable(HIDDEN_OUTAGE_PROBABILITY, 1 / 16, 321);

/**
 * In mean mode, when the pointing loss exceeded with probability 1e-3 is more than 1 dB above the
 * mean loss: that loss, or a lower bound of it; undefined otherwise. The radius r_p exceeded with
 * 1e-3 is first bracketed without a series: from the table of r_p/σ against ν/σ (monotone, so two
 * neighbouring entries bracket it), or beyond the table by [max(3.717σ, ν + 3.090σ), ν + 3.717σ]
 * (R is stochastically larger than without bias; P(R > ν + t) ≥ P(X₁ > t); |ν + X| ≤ ν + |X|).
 * Closed-form bounds on the capture at the ends of that bracket, then the exact captures there,
 * decide nearly every design without solving for r_p: the warning then states the loss at the
 * lower end as "at least". Only where the 1 dB level falls inside the bracket (or where C rises
 * from the centre) is r_p solved, by Newton steps inside the bracket.
 */
function hiddenPointingOutage(design: ResolvedDesign, chain: ChainResult): { lossDb: number; exact: boolean } | undefined {
  if (!Number.isNaN(design.pointingOutageAngleRad)) return undefined;
  const jitterM = design.jitterSigmaPerAxisRad * design.rangeM;
  if (jitterM === 0) return undefined;
  const biasM = design.staticErrorRad * design.rangeM;
  const beamRadiusM = chain.longTermBeamRadiusM;
  const apertureRadiusM = design.apertureDiameterM / 2;
  const obscurationRadiusM = apertureRadiusM * design.obscurationRatio;
  // The bracket of r_p/σ, and a start for Newton inside it.
  const offset = biasM / jitterM;
  const position = offset / HIDDEN_OUTAGE_RADII.offsetStep;
  const radii = HIDDEN_OUTAGE_RADII.radiiOverSigma;
  let lowerOverSigma: number;
  let upperOverSigma: number;
  let startOverSigma: number;
  if (position < radii.length - 1) {
    const index = Math.floor(position);
    // the tabulated roots are good to 1e-13 relative: widen by 1e-12 so that the bracket holds
    lowerOverSigma = radii[index]! * (1 - 1e-12);
    upperOverSigma = radii[index + 1]! * (1 + 1e-12);
    startOverSigma = radii[index]! + (radii[index + 1]! - radii[index]!) * (position - index);
  } else {
    lowerOverSigma = Math.max(RAYLEIGH_RADIUS_AT_HIDDEN_OUTAGE, offset + NORMAL_RADIUS_AT_HIDDEN_OUTAGE);
    upperOverSigma = offset + RAYLEIGH_RADIUS_AT_HIDDEN_OUTAGE;
    startOverSigma = Math.min(Math.max(offset + NORMAL_RADIUS_AT_HIDDEN_OUTAGE + 0.5 / offset, lowerOverSigma), upperOverSigma);
  }
  const lowerRadiusM = lowerOverSigma * jitterM;
  const upperRadiusM = upperOverSigma * jitterM;
  // Closed-form bounds on the capture of any rotationally symmetric aperture (derived): writing the
  // shifted Gaussian as g(x)·e^(−2r²/W²)·e^(4x·r/W²), C(r)/C(0) = e^(−2r²/W²)·E[e^(4x·r/W²)] with
  // x distributed over the aperture with weights g. By symmetry that mean is E[cosh(4x∥r/W²)]
  // = E[I0(4ρr/W²)] (ρ = |x|, the angle uniform), between 1 and I0(4ar/W²) as ρ ≤ a. So
  //   exp(−2r²/W²) ≤ C(r)/C(0) ≤ exp(−2r²/W²)·I0(u),  u = 4ar/W²,  ln I0(u) ≤ min(u²/4, u)
  // (I0(u) ≤ Σ(u²/4)^k/k! and I0(u) ≤ e^u). The upper loss bound 2·4.343·r²/W² grows with r, so the
  // loss exceeded with 1e-3 is at most its value at the upper radius; the lower bound
  // 4.343·(2r²/W² − min(u²/4, u)) grows with r where 2a² < W² (or past max(a, W²/a)), and then the
  // loss exceeded with 1e-3 is at least its value at the lower radius, whether or not C falls from
  // the centre. For a receiver small against the beam the two nearly meet: most designs are decided
  // here without a series.
  const beamSquareM2 = beamRadiusM * beamRadiusM;
  const smallReceiverBoundDb = (2 * DB_PER_NEPER * upperRadiusM * upperRadiusM) / beamSquareM2;
  if (!(smallReceiverBoundDb - chain.pointingLossDb > HIDDEN_OUTAGE_EXCESS_DB)) return undefined;
  if (2 * apertureRadiusM * apertureRadiusM < beamSquareM2 || lowerRadiusM >= Math.max(apertureRadiusM, beamSquareM2 / apertureRadiusM)) {
    const u = (4 * apertureRadiusM * lowerRadiusM) / beamSquareM2;
    const lowerBoundDb = DB_PER_NEPER * ((2 * lowerRadiusM * lowerRadiusM) / beamSquareM2 - Math.min(0.25 * u * u, u));
    if (lowerBoundDb - chain.pointingLossDb > HIDDEN_OUTAGE_EXCESS_DB) return { lossDb: lowerBoundDb, exact: false };
  }
  const logCentre = -(chain.geometricLossDb + chain.turbulenceBeamSpreadLossDb) / DB_PER_NEPER;
  if (captureFallsFromCentre(beamRadiusM, apertureRadiusM, obscurationRadiusM)) {
    // C falls with r: the exact captures at the two radii bound the quantile more tightly.
    const lowerLossDb = offsetLossDb(beamRadiusM, apertureRadiusM, obscurationRadiusM, lowerRadiusM, logCentre);
    if (lowerLossDb - chain.pointingLossDb > HIDDEN_OUTAGE_EXCESS_DB) return { lossDb: lowerLossDb, exact: false };
    if (!(offsetLossDb(beamRadiusM, apertureRadiusM, obscurationRadiusM, upperRadiusM, logCentre) - chain.pointingLossDb > HIDDEN_OUTAGE_EXCESS_DB)) return undefined;
    // The capture falls: the loss exceeded with p is the loss at r_p (exactOutagePointingLossDb).
    const outageRadiusM = outageRadiusWithinM(offset, jitterM, lowerOverSigma, upperOverSigma, startOverSigma);
    const lossDb = offsetLossDb(beamRadiusM, apertureRadiusM, obscurationRadiusM, outageRadiusM, logCentre);
    return lossDb - chain.pointingLossDb > HIDDEN_OUTAGE_EXCESS_DB ? { lossDb, exact: true } : undefined;
  }
  const outageRadiusM = outageRadiusWithinM(offset, jitterM, lowerOverSigma, upperOverSigma, startOverSigma);
  return hiddenPointingOutageRising(chain.pointingLossDb, beamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM, logCentre, outageRadiusM);
}

/** r_p [m] from its bracket in σ units (the closed form without bias). */
function outageRadiusWithinM(offset: number, jitterM: number, lowerOverSigma: number, upperOverSigma: number, startOverSigma: number): number {
  if (offset === 0) return RAYLEIGH_RADIUS_AT_HIDDEN_OUTAGE * jitterM;
  return ricianOutageRadiusOverSigmaWithin(offset, HIDDEN_OUTAGE_PROBABILITY, lowerOverSigma, upperOverSigma, startOverSigma) * jitterM;
}

/** −10·log10(C(r)/C(0)) from ln C(0) at hand (a plain function: no closure per budget). */
function offsetLossDb(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number, offsetM: number, logCentre: number): number {
  return -DB_PER_NEPER * (logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, offsetM) - logCentre);
}

/**
 * The hidden-outage decision where C rises from the centre (heavy obscuration), without solving
 * for the quantile. With r_p the radius R exceeds with 1e-3 and C unimodal (derived):
 * {C < C(r_p)} holds [0, r_p) or (r_p, ∞), so P(C(R) < C(r_p)) ≥ p and the loss L_q exceeded with
 * p is at least L(r_p); when C(r_p) ≤ C(0) it equals L(r_p) ({C < C(r_p)} = (r_p, ∞)); otherwise
 * {C < C(0)} = (r0, ∞) with r0 > r_p, so L_q < 0. What these leave open (a mean gain of more than
 * 1 dB) is decided by P(C(R) < c) > p at the level c of the mean loss plus 1 dB: two crossings.
 * `outageRadiusM` is r_p.
 */
function hiddenPointingOutageRising(
  meanLossDb: number,
  beamRadiusM: number,
  apertureRadiusM: number,
  obscurationRadiusM: number,
  jitterM: number,
  biasM: number,
  logCentre: number,
  outageRadiusM: number,
): { lossDb: number; exact: boolean } | undefined {
  // C is flat to second order at the centre; the exact quantile takes it as C(0) there (exact-pointing.ts).
  const lossAtRadiusDb = outageRadiusM < 1e-6 * beamRadiusM ? 0 : offsetLossDb(beamRadiusM, apertureRadiusM, obscurationRadiusM, outageRadiusM, logCentre);
  if (lossAtRadiusDb - meanLossDb > HIDDEN_OUTAGE_EXCESS_DB) return { lossDb: lossAtRadiusDb, exact: lossAtRadiusDb >= 0 };
  if (lossAtRadiusDb >= 0 || !(-meanLossDb > HIDDEN_OUTAGE_EXCESS_DB)) return undefined;
  // L(r_p) < 0 and L(r_p) ≤ mean + 1 dB < 0: the level c = C(0)·10^(−(mean + 1 dB)/10) lies in (C(0), C(r_p)].
  const thresholdDb = meanLossDb + HIDDEN_OUTAGE_EXCESS_DB;
  const logLevel = logCentre - thresholdDb / DB_PER_NEPER;
  const below = probabilityOfCaptureBelowRising(beamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM, logLevel, outageRadiusM);
  // P(C(R) < c) > p: the quantile lies below c, i.e. L_q > mean + 1 dB (stated as a lower bound).
  return below > HIDDEN_OUTAGE_PROBABILITY ? { lossDb: thresholdDb, exact: false } : undefined;
}


/**
 * True when every number the chain reads is a number (a missing required field resolves to
 * undefined). A dozen typeof checks: cheap enough for the hot path, unlike a schema parse.
 */
export function hasEveryRequiredNumber(design: ResolvedDesign): boolean {
  return (
    typeof design.rangeM === 'number' &&
    typeof design.wavelengthM === 'number' &&
    typeof design.powerDbm === 'number' &&
    typeof design.apertureBeamRadiusM === 'number' &&
    typeof design.halfAngleDivergenceRad === 'number' &&
    typeof design.m2 === 'number' &&
    typeof design.transmitOpticsLossDb === 'number' &&
    typeof design.apertureDiameterM === 'number' &&
    typeof design.obscurationRatio === 'number' &&
    typeof design.sensitivityDbm === 'number' &&
    typeof design.receiveOpticsLossDb === 'number' &&
    typeof design.jitterSigmaPerAxisRad === 'number' &&
    typeof design.staticErrorRad === 'number' &&
    typeof design.visibility2PercentKm === 'number' &&
    typeof design.cn2 === 'number' &&
    typeof design.fadeProbability === 'number' &&
    typeof design.systemMarginDb === 'number'
  );
}

/** The sum of the numbers the chain reads: finite exactly when each of them is (for the designs the schema accepts). */
export function sumOfInputs(design: ResolvedDesign): number {
  return (
    design.rangeM +
    design.wavelengthM +
    design.powerDbm +
    design.apertureBeamRadiusM +
    design.halfAngleDivergenceRad +
    design.m2 +
    design.transmitOpticsLossDb +
    design.apertureDiameterM +
    design.obscurationRatio +
    design.sensitivityDbm +
    design.receiveOpticsLossDb +
    design.jitterSigmaPerAxisRad +
    design.staticErrorRad +
    design.visibility2PercentKm +
    design.cn2 +
    design.fadeProbability +
    design.systemMarginDb
  );
}

/**
 * The error for a design the engine cannot evaluate: the schema's own issues, so the message names
 * each field ("rangeM: is required"). Only reached on failure, so the parse costs nothing otherwise.
 * `context` starts the message (the entry, and for a batch the point).
 */
export function invalidDesignError(design: unknown, context = 'evaluateLink'): RangeError {
  const result = LinkDesignSchema.safeParse(design);
  const issues = result.success ? [] : formatZodIssues(result.error);
  const detail = issues.length > 0 ? issues.map((issue) => `${issue.path || 'design'}: ${issue.message}`).join('; ') : 'the design is not valid';
  return new RangeError(`${context}: ${detail}`);
}

/**
 * Link budget and margin of a design (METHODS.md §10.1):
 * P_rx = P_tx − L_tx − L_geo − γ·L − L_point − L_rx [dBm]; M = P_rx − S − F_scint − M_system [dB].
 *
 * Accepts a validated design or a raw one with only the required fields: the defaults of
 * LINK_DESIGN_DEFAULTS are applied here with `??`; nothing is parsed, so callers that take user
 * input validate with LinkDesignSchema first. A design with a required number missing (or NaN)
 * throws a RangeError naming the field instead of answering NaN. Terms are returned in budget order; each term's
 * `valueDb` is its signed contribution, so the terms sum to `linkMarginDb`.
 *
 * @param design the link design (SI units, powers in dBm, losses in dB); see LinkDesignSchema for ranges
 * @returns the budget: terms, beam radius at the receiver [m], losses [dB], received power [dBm],
 *   fade margin [dB], link margin [dB] and findings
 * @see Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001) (budget structure); each term's source is in its `source`.
 */
export function evaluateLink(design: LinkDesignInput): LinkBudget {
  // fresh work objects per call: no state lives between calls at module level (METHODS.md §10.8)
  return budgetOf(design, emptyResolvedDesign(), newChainResult());
}

function budgetOf(design: LinkDesignInput, workDesign: ResolvedDesign, workChain: ChainResult): LinkBudget {
  const resolved = resolveDesignInto(workDesign, design);
  if (!hasEveryRequiredNumber(resolved)) throw invalidDesignError(design);
  // NaN or ±Infinity anywhere makes the sum non-finite: name the field before a model's own guard
  // (e.g. the beam-wave scintillation's) reports an internal quantity instead.
  if (!Number.isFinite(sumOfInputs(resolved)) && !LinkDesignSchema.safeParse(design).success) throw invalidDesignError(design);
  const attenuation = specificAttenuationDbPerKm(resolved, resolved.visibility2PercentKm);
  const chain = evaluateChainInto(workChain, resolved, resolved.rangeM, attenuation, resolved.includeScintillation, 'report');
  // NaN or ±Infinity in an input the typeof check let through (the schema rejects both) shows in
  // the margin or the beam: name the field rather than answer NaN. A design the schema accepts is
  // returned as computed (callers that store budgets check them against LinkBudgetSchema).
  if (!Number.isFinite(chain.linkMarginDb + chain.beamRadiusAtReceiverM) && !LinkDesignSchema.safeParse(design).success) throw invalidDesignError(design);
  const diffractionRad = diffractionHalfAngle(resolved);
  const defocused = resolved.halfAngleDivergenceRad > diffractionRad;
  const outagePointing = !Number.isNaN(resolved.pointingOutageAngleRad);
  const terms: BudgetTerm[] = [
    term('transmitPower', TERM_DESCRIPTIONS.transmitPower, resolved.powerDbm),
    term('transmitOptics', TERM_DESCRIPTIONS.transmitOptics, -resolved.transmitOpticsLossDb),
    term('geometricSpread', TERM_DESCRIPTIONS.geometricSpread, -chain.geometricLossDb),
    term('turbulenceBeamSpread', TERM_DESCRIPTIONS.turbulenceBeamSpread, -chain.turbulenceBeamSpreadLossDb),
    term('atmosphericAttenuation', resolved.fogNumeratorPerKm > 0 ? FOG_ATTENUATION_DESCRIPTION : TERM_DESCRIPTIONS.atmosphericAttenuation, -chain.atmosphericLossDb),
    term('pointingLoss', outagePointing ? POINTING_OUTAGE_DESCRIPTION : TERM_DESCRIPTIONS.pointingLoss, -chain.pointingLossDb),
    term('receiveOptics', TERM_DESCRIPTIONS.receiveOptics, -resolved.receiveOpticsLossDb),
    term('receiverSensitivity', TERM_DESCRIPTIONS.receiverSensitivity, -resolved.sensitivityDbm),
    term('scintillationFade', resolved.gaussianBeam ? BEAM_WAVE_FADE_DESCRIPTION : TERM_DESCRIPTIONS.scintillationFade, -chain.scintillationFadeMarginDb),
    term('systemAllowance', TERM_DESCRIPTIONS.systemAllowance, -resolved.systemMarginDb),
  ];
  return {
    terms,
    beamModel: defocused ? 'defocused' : 'collimated',
    halfAngleDivergenceRad: defocused ? resolved.halfAngleDivergenceRad : diffractionRad,
    diffractionHalfAngleRad: diffractionRad,
    rayleighRangeM: resolved.apertureBeamRadiusM / diffractionRad,
    beamRadiusAtReceiverM: chain.beamRadiusAtReceiverM,
    turbulenceModel: resolved.gaussianBeam ? 'gaussian-beam' : 'spherical-wave',
    longTermBeamRadiusM: chain.longTermBeamRadiusM,
    beamWanderRmsM: chain.beamWanderRmsM,
    captureFraction: chain.captureFraction,
    geometricLossDb: chain.geometricLossDb,
    effectiveVisibilityM: resolved.visibility2PercentKm * 1000,
    specificAttenuationDbPerKm: attenuation,
    atmosphericLossDb: chain.atmosphericLossDb,
    pointingLossDb: chain.pointingLossDb,
    pointingLossModel: outagePointing ? 'outage' : 'mean',
    receivedPowerDbm: chain.receivedPowerDbm,
    rytovVarianceSpherical: chain.rytovVarianceSpherical,
    scintillationIndex: chain.scintillationIndex,
    scintillationFadeMarginDb: chain.scintillationFadeMarginDb,
    systemMarginDb: resolved.systemMarginDb,
    linkMarginDb: chain.linkMarginDb,
    checks: collectChecks(resolved, chain.receivedPowerDbm, diffractionRad, chain),
  };
}

/**
 * Link margin of a design at another range, everything else unchanged (cheaper than evaluateLink:
 * no terms, no findings).
 *
 * @param design the link design
 * @param rangeM path length [m], > 0
 * @returns link margin [dB]
 * @see evaluateLink
 */
export function linkMarginAtRangeDb(design: LinkDesignInput, rangeM: number): number {
  const resolved = resolveDesign(design);
  const attenuation = specificAttenuationDbPerKm(resolved, resolved.visibility2PercentKm);
  return evaluateChainInto(newChainResult(), resolved, rangeM, attenuation, resolved.includeScintillation, 'margin').linkMarginDb;
}
