/**
 * The joint outage of a budget: the probability that pointing error and scintillation together
 * take the instantaneous received power below what the budget's margin allows. Each of the two
 * budget terms is a loss exceeded with its own probability (p for the fade margin; the outage
 * probability, or the mean, for pointing); adding them in dB asks for both at once, so the joint
 * outage at the design's margin is far below either p. For information; one numerical integral.
 */
import { logCentredAnnularCapture, logOffsetAnnularCapture } from '../capture/capture.js';
import { besselI0Scaled } from '../numeric/bessel.js';
import { integrate } from '../numeric/quadrature.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { beamWaveAtReceiverFast, beamWaveScintillationFast } from '../turbulence/beam-wave.js';
import { GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT, gammaGammaCdf, lognormalIrradianceCdf } from '../turbulence/fade-statistics.js';
import { rytovVarianceFast } from '../turbulence/rytov.js';
import { gammaGammaParameters, normalisedApertureSquared } from '../turbulence/scintillation.js';
import { evaluateLink } from './evaluate-link.js';
import { resolveDesign } from './link-chain.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { DB_PER_NATURAL_LOG_POWER as DB_PER_NEPER } from '../units/constants.js';

/** Result of {@link jointOutageProbability}. */
export interface JointOutage {
  /**
   * P(10·log10(C(R)/C(0)) + 10·log10(I/⟨I⟩) < −(M + L_point + F)): the share of time pointing error
   * and scintillation together use up the pointing term, the fade margin and the link margin M.
   */
  probability: number;
  /** The room above the outage threshold, M + L_point + F [dB] (the threshold is S + system allowance). */
  headroomDb: number;
  /** Gamma-gamma α, β of the irradiance (Infinity when the fade margin is off or Cn² = 0). */
  alpha: number;
  beta: number;
}


/**
 * Joint outage probability of a design at its own margin: with R the Rician radial pointing error
 * (bias ν = bias·L, jitter σ = jitter·L), C the exact annular capture of the beam the budget uses
 * (W_LT for the Gaussian-beam model) and I the irradiance (gamma-gamma, or log-normal for
 * min(α, β) ≥ 500; none when the fade margin is off or Cn² = 0),
 *   P = ∫0^∞ f_R(r)·P(I/⟨I⟩ < h·C(0)/C(r)) dr,   h = 10^(−(M + L_point + F)/10),
 * integrated over the Rice density in σ-wide panels (Gauss–Kronrod).
 *
 * @param design the link design
 * @returns the probability in [0, 1], the headroom [dB] and α, β
 * @see Rice S.O. (1945) (Rice density); Al-Habash, Andrews & Phillips, Opt. Eng. 40(8),
 *   1554–1562 (2001) (gamma-gamma CDF); the independence of pointing and scintillation is assumed
 *   (common practice, e.g. Farid & Hranilovic, J. Lightwave Technol. 25(7), 2007).
 */
export function jointOutageProbability(design: LinkDesignInput): JointOutage {
  const budget = evaluateLink(design);
  const resolved = resolveDesign(design);
  const rangeM = resolved.rangeM;
  const apertureRadiusM = resolved.apertureDiameterM / 2;
  const obscurationRadiusM = apertureRadiusM * resolved.obscurationRatio;
  const beamRadiusM = budget.longTermBeamRadiusM ?? budget.beamRadiusAtReceiverM;
  const sigmaM = resolved.jitterSigmaPerAxisRad * rangeM;
  const biasM = resolved.staticErrorRad * rangeM;
  const headroomDb = budget.linkMarginDb + budget.pointingLossDb + budget.scintillationFadeMarginDb;
  let alpha = Infinity;
  let beta = Infinity;
  if (resolved.includeScintillation && resolved.cn2 > 0) {
    if (resolved.gaussianBeam) {
      const w = launchBeamRadiusAtRangeM(resolved.wavelengthM, resolved.apertureBeamRadiusM, resolved.halfAngleDivergenceRad, resolved.m2, rangeM);
      const beam = beamWaveAtReceiverFast(resolved.wavelengthM, resolved.apertureBeamRadiusM, resolved.halfAngleDivergenceRad, resolved.m2, rangeM, resolved.cn2, w, true);
      const wave = beamWaveScintillationFast(resolved.wavelengthM, rangeM, resolved.apertureDiameterM, resolved.obscurationRatio, beam, w, biasM, Number.NaN);
      alpha = wave.alpha;
      beta = wave.beta;
    } else {
      const shapes = gammaGammaParameters({
        rytovVariance: rytovVarianceFast(resolved.cn2, resolved.wavelengthM, rangeM, true),
        wave: 'spherical',
        apertureD2: normalisedApertureSquared(resolved.wavelengthM, rangeM, resolved.apertureDiameterM),
      });
      alpha = shapes.alpha;
      beta = shapes.beta;
    }
  }
  const fluctuating = Number.isFinite(alpha) && Number.isFinite(beta);
  const scintillationIndex = 1 / alpha + 1 / beta + 1 / (alpha * beta);
  const logThreshold = -headroomDb / DB_PER_NEPER;
  const logCentre = logCentredAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM);
  // P(I/⟨I⟩ < x) given the offset r, x = h·C(0)/C(r)
  const fadeBelow = (offsetM: number): number => {
    const logX = logThreshold + logCentre - logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, offsetM);
    if (!fluctuating) return logX > 0 ? 1 : 0;
    const x = Math.exp(logX);
    if (x === Infinity) return 1;
    return Math.min(alpha, beta) >= GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT ? lognormalIrradianceCdf(x, scintillationIndex) : gammaGammaCdf(x, alpha, beta);
  };
  let probability: number;
  if (sigmaM === 0) {
    probability = fadeBelow(biasM);
  } else {
    // Rice density of R/σ: t·exp(−(t − a)²/2)·i0e(a t), a = ν/σ; its mass lies within ±40 of a.
    const a = biasM / sigmaM;
    const density = (t: number): number => t * Math.exp(-0.5 * (t - a) * (t - a)) * besselI0Scaled(a * t);
    const from = Math.max(0, a - 40);
    const to = a + 40;
    const panels = Math.ceil((to - from) / 1);
    const width = (to - from) / panels;
    probability = 0;
    for (let i = 0; i < panels; i++) {
      const lo = from + i * width;
      probability += integrate((t) => density(t) * fadeBelow(t * sigmaM), lo, lo + width, { absoluteTolerance: 1e-18, relativeTolerance: 1e-9, maxPanels: 200 });
    }
    probability = Math.min(1, Math.max(0, probability));
  }
  return { probability, headroomDb, alpha, beta };
}
