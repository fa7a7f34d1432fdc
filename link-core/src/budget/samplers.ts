/**
 * Series for the planner's charts: margin against range, margin against visibility, and the beam
 * envelope along the path. Plain arrays, ready for a chart library; pure and cheap (no terms built).
 */
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { beamWaveAtReceiverFast } from '../turbulence/beam-wave.js';
import { evaluateChain, resolveDesign, specificAttenuationDbPerKm } from './link-chain.js';

/** Options of {@link marginVsRange}. */
export interface RangeSweepOptions {
  /** first range [m] (default 50) */
  fromM?: number;
  /** last range [m] (default twice the design range, at most 50 km) */
  toM?: number;
  /** number of samples, 2…2000 (default 101), evenly spaced */
  points?: number;
}

/** Result of {@link marginVsRange}. */
export interface RangeSweep {
  rangeM: number[];
  linkMarginDb: number[];
  receivedPowerDbm: number[];
  beamRadiusM: number[];
}

function sampleCount(points: number | undefined, fallback: number): number {
  const count = points ?? fallback;
  if (!Number.isInteger(count) || count < 2 || count > 2000) throw new RangeError('points: must be an integer from 2 to 2000');
  return count;
}

function checkInterval(fromM: number, toM: number): void {
  if (!(fromM > 0) || !Number.isFinite(fromM)) throw new RangeError('fromM: must be a finite number greater than 0');
  if (!(toM > fromM) || !Number.isFinite(toM)) throw new RangeError('toM: must be a finite number greater than fromM');
}

/**
 * Link margin, received power and beam radius at evenly spaced ranges, all else as designed.
 *
 * @param design the link design
 * @param options range interval [m] and number of samples
 * @returns ranges [m], margins [dB], received powers [dBm], beam radii [m]
 * @see evaluateLink (METHODS.md §10.1); the curve is usually monotone (METHODS.md §10.4).
 */
export function marginVsRange(design: LinkDesignInput, options: RangeSweepOptions = {}): RangeSweep {
  const resolved = resolveDesign(design);
  const fromM = options.fromM ?? 50;
  const toM = options.toM ?? Math.min(50_000, Math.max(2 * resolved.rangeM, fromM * 2));
  checkInterval(fromM, toM);
  const count = sampleCount(options.points, 101);
  const attenuation = specificAttenuationDbPerKm(resolved, resolved.visibility2PercentKm);
  const sweep: RangeSweep = { rangeM: [], linkMarginDb: [], receivedPowerDbm: [], beamRadiusM: [] };
  for (let i = 0; i < count; i++) {
    const rangeM = fromM + ((toM - fromM) * i) / (count - 1);
    const chain = evaluateChain(resolved, rangeM, attenuation, resolved.includeScintillation);
    sweep.rangeM.push(rangeM);
    sweep.linkMarginDb.push(chain.linkMarginDb);
    sweep.receivedPowerDbm.push(chain.receivedPowerDbm);
    sweep.beamRadiusM.push(chain.beamRadiusAtReceiverM);
  }
  return sweep;
}

/** Options of {@link marginVsVisibility}. */
export interface VisibilitySweepOptions {
  /** lowest visibility [m] (default 50), in the design's visibility definition */
  fromM?: number;
  /** highest visibility [m] (default 50 000) */
  toM?: number;
  /** number of samples, 2…2000 (default 61), evenly spaced in log V */
  points?: number;
}

/** Result of {@link marginVsVisibility}. */
export interface VisibilitySweep {
  /** visibility in the design's definition [m] */
  visibilityM: number[];
  atmosphericLossDb: number[];
  linkMarginDb: number[];
}

/**
 * Link margin at logarithmically spaced visibilities, all else as designed (the fade margin is
 * included when the design includes it).
 *
 * @param design the link design
 * @param options visibility interval [m] and number of samples
 * @returns visibilities [m], atmospheric losses [dB], margins [dB]
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001); METHODS.md §5 and §10.5.
 */
export function marginVsVisibility(design: LinkDesignInput, options: VisibilitySweepOptions = {}): VisibilitySweep {
  const resolved = resolveDesign(design);
  const fromM = options.fromM ?? 50;
  const toM = options.toM ?? 50_000;
  checkInterval(fromM, toM);
  const count = sampleCount(options.points, 61);
  // One chain without weather gives everything but the atmospheric term, which is linear in γ.
  const base = evaluateChain(resolved, resolved.rangeM, 0, resolved.includeScintillation);
  const toTwoPercentKm = resolved.visibility2PercentKm / design.atmosphere.visibilityM; // MOR factor / 1000
  const sweep: VisibilitySweep = { visibilityM: [], atmosphericLossDb: [], linkMarginDb: [] };
  const logFrom = Math.log(fromM);
  const logStep = (Math.log(toM) - logFrom) / (count - 1);
  for (let i = 0; i < count; i++) {
    const visibilityM = Math.exp(logFrom + logStep * i);
    const lossDb = (specificAttenuationDbPerKm(resolved, visibilityM * toTwoPercentKm) * resolved.rangeM) / 1000;
    sweep.visibilityM.push(visibilityM);
    sweep.atmosphericLossDb.push(lossDb);
    sweep.linkMarginDb.push(base.linkMarginDb - lossDb);
  }
  return sweep;
}

/** Options of {@link beamEnvelope}. */
export interface BeamEnvelopeOptions {
  /** number of samples from the transmitter to the receiver, 2…2000 (default 101) */
  points?: number;
}

/** Result of {@link beamEnvelope}. */
export interface BeamEnvelope {
  /** distance from the transmit aperture [m] */
  distanceM: number[];
  /** 1/e² beam radius [m] */
  beamRadiusM: number[];
  /**
   * long-term (turbulence-spread, wander included) 1/e² radius W_LT [m] at each distance, as the
   * budget computes it at its receiver; present only for the Gaussian-beam model with Cn² > 0
   */
  longTermBeamRadiusM?: number[];
  /** receive aperture radius [m], to draw against the beam at the far end */
  receiveApertureRadiusM: number;
  /** 1/e² beam radius at the transmit aperture W0 [m] */
  transmitBeamRadiusM: number;
  beamModel: 'collimated' | 'defocused';
  /**
   * position of the beam's waist relative to the transmit aperture [m]: 0 for a collimated beam,
   * negative (a virtual waist behind the aperture) for a defocused one
   */
  waistPositionM: number;
  /** radius of that waist [m] */
  waistRadiusM: number;
  /** Rayleigh range of the beam about its waist, π·w_waist²/(M²λ) [m] */
  rayleighRangeM: number;
  /** where the Rayleigh range ends, measured from the aperture [m]: waistPositionM + rayleighRangeM (may be ≤ 0 or beyond the path) */
  rayleighRangeEndM: number;
  /** true when rayleighRangeEndM lies inside (0, rangeM]: the chart should mark it */
  rayleighRangeEndWithinPath: boolean;
}

/**
 * Beam radius along the path, with the waist and Rayleigh range of the launched beam. A defocused
 * launch (F0 < 0) is a Gaussian whose waist lies behind the aperture: with the complex beam
 * parameter 1/q = 1/R − i/z_R0 at the aperture (R = −F0 > 0, z_R0 = πW0²/(M²λ)),
 * q = z_w + i·z_R gives the distance z_w from the virtual waist and its Rayleigh range z_R.
 * With the Gaussian-beam turbulence model and Cn² > 0 it adds the long-term radius W_LT(z), each
 * sample computed as the budget computes it for a receiver at z (METHODS.md, the beam-wave model;
 * W_LT(0) = W0: no path, no spread), so the last sample is the budget's `longTermBeamRadiusM`.
 *
 * @param design the link design
 * @param options number of samples
 * @returns distances [m], beam radii [m], aperture radii [m], waist position/radius [m], Rayleigh range [m]
 * @see Kogelnik H., Li T., Appl. Opt. 5(10), 1550–1567 (1966) (q parameter); Andrews & Phillips
 *   (2005), ch. 4 (defocused launch, METHODS.md §1.5).
 */
export function beamEnvelope(design: LinkDesignInput, options: BeamEnvelopeOptions = {}): BeamEnvelope {
  const resolved = resolveDesign(design);
  const count = sampleCount(options.points, 101);
  const w0 = resolved.apertureBeamRadiusM;
  const diffractionRad = (resolved.m2 * resolved.wavelengthM) / (Math.PI * w0);
  const collimatedRayleighM = w0 / diffractionRad;
  const excess = resolved.halfAngleDivergenceRad * resolved.halfAngleDivergenceRad - diffractionRad * diffractionRad;
  let waistPositionM = 0;
  let rayleighRangeM = collimatedRayleighM;
  let waistRadiusM = w0;
  if (excess > 0) {
    const inverseCurvature = Math.sqrt(excess) / w0; // 1/R, R = −F0 = W0/√(θ² − θd²)
    const inverseRayleigh = 1 / collimatedRayleighM;
    const denominator = inverseCurvature * inverseCurvature + inverseRayleigh * inverseRayleigh;
    waistPositionM = -inverseCurvature / denominator;
    rayleighRangeM = inverseRayleigh / denominator;
    waistRadiusM = w0 / Math.sqrt(1 + (waistPositionM / rayleighRangeM) ** 2);
  }
  const envelope: BeamEnvelope = {
    distanceM: [],
    beamRadiusM: [],
    receiveApertureRadiusM: resolved.apertureDiameterM / 2,
    transmitBeamRadiusM: w0,
    beamModel: excess > 0 ? 'defocused' : 'collimated',
    waistPositionM,
    waistRadiusM,
    rayleighRangeM,
    rayleighRangeEndM: waistPositionM + rayleighRangeM,
    rayleighRangeEndWithinPath: waistPositionM + rayleighRangeM > 0 && waistPositionM + rayleighRangeM <= resolved.rangeM,
  };
  for (let i = 0; i < count; i++) {
    const distanceM = (resolved.rangeM * i) / (count - 1);
    const relative = (distanceM - waistPositionM) / rayleighRangeM;
    envelope.distanceM.push(distanceM);
    envelope.beamRadiusM.push(waistRadiusM * Math.sqrt(1 + relative * relative));
  }
  if (resolved.gaussianBeam && resolved.cn2 > 0) {
    const { wavelengthM, halfAngleDivergenceRad, m2, cn2 } = resolved;
    envelope.longTermBeamRadiusM = envelope.distanceM.map((distanceM) => {
      if (distanceM === 0) return w0;
      const freeSpaceM = launchBeamRadiusAtRangeM(wavelengthM, w0, halfAngleDivergenceRad, m2, distanceM);
      return beamWaveAtReceiverFast(wavelengthM, w0, halfAngleDivergenceRad, m2, distanceM, cn2, freeSpaceM, false).longTermBeamRadiusM;
    });
  }
  return envelope;
}
