/**
 * Seeded Monte-Carlo check of the pointing and fade statistics behind the budget (10⁶ draws of
 * bias + jitter and of gamma-gamma irradiance, I = X·Y with X ~ Gamma(α, 1/α), Y ~ Gamma(β, 1/β),
 * Al-Habash, Andrews & Phillips 2001): the analytic mean capture, the pointing outage at the
 * pointing threshold and the fade outage at the fade threshold (each equal to its p), and the joint
 * outage probability of jointOutageProbability — each inside its 4σ confidence interval.
 */
import { describe, expect, it } from 'vitest';
import { evaluateLink, jointOutageProbability, type LinkDesignInput } from '../src/index.js';
import { logMeanAnnularCapture, logOffsetAnnularCapture, logCentredAnnularCapture } from '../src/physics.js';
import { seededUniform } from '../src/numeric/seeded-random.js';

const DRAWS = 1_000_000;

function normalSampler(uniform: () => number): () => number {
  let spare = Number.NaN;
  return () => {
    if (!Number.isNaN(spare)) {
      const value = spare;
      spare = Number.NaN;
      return value;
    }
    const radius = Math.sqrt(-2 * Math.log(uniform()));
    const angle = 2 * Math.PI * uniform();
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
}

/** Gamma(shape, 1) for shape ≥ 1 by Marsaglia & Tsang, ACM TOMS 26(3), 363–372 (2000). */
function gammaSampler(shape: number, uniform: () => number, normal: () => number): () => number {
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  return () => {
    for (;;) {
      const x = normal();
      const v0 = 1 + c * x;
      if (v0 <= 0) continue;
      const v = v0 * v0 * v0;
      const u = uniform();
      if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) return d * v;
    }
  };
}

const binomialHalfWidth = (p: number) => 4 * Math.sqrt((p * (1 - p)) / DRAWS);

// A 1.2 km link with a pointing error of a few per cent of the beam and moderate turbulence; the
// obscured aperture takes the annular capture through every path.
const design: LinkDesignInput = {
  rangeM: 1200,
  transmitter: { wavelengthM: 1.55e-6, powerDbm: 16, waistRadiusM: 0.02, halfAngleDivergenceRad: 0.4e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.12, sensitivityDbm: -36, opticsLossDb: 1.5, obscurationRatio: 0.25 },
  pointing: { jitterSigmaPerAxisRad: 60e-6, staticErrorRad: 40e-6, outageProbability: 1e-2 },
  atmosphere: { model: 'kim', visibilityM: 8000, cn2: 3e-14 },
  scintillation: { include: true, probability: 1e-2 },
};

describe('Monte-Carlo check of the pointing and fade statistics (seeded, 10⁶ draws)', () => {
  // At zero link margin (the transmit power lowered by the margin) the joint outage is largest.
  const atZeroMargin: LinkDesignInput = { ...design, transmitter: { ...design.transmitter, powerDbm: 16 - evaluateLink(design).linkMarginDb } };
  const budget = evaluateLink(atZeroMargin);
  const joint = jointOutageProbability(atZeroMargin);
  const beamRadiusM = budget.longTermBeamRadiusM!;
  const a = 0.06;
  const b = 0.015;
  const sigmaM = 60e-6 * 1200;
  const biasM = 40e-6 * 1200;
  const logCentre = logCentredAnnularCapture(beamRadiusM, a, b);
  const uniform = seededUniform(20261203);
  const normal = normalSampler(uniform);
  const drawX = gammaSampler(joint.alpha, uniform, normal);
  const drawY = gammaSampler(joint.beta, uniform, normal);
  const relativeCapture = new Float64Array(DRAWS);
  const irradiance = new Float64Array(DRAWS);
  for (let i = 0; i < DRAWS; i++) {
    const x = biasM + sigmaM * normal();
    const y = sigmaM * normal();
    relativeCapture[i] = Math.exp(logOffsetAnnularCapture(beamRadiusM, a, b, Math.hypot(x, y)) - logCentre);
    irradiance[i] = (drawX() / joint.alpha) * (drawY() / joint.beta);
  }

  it('gives the analytic mean capture E[C(R)]/C(0) (Marcum Q1 form of the beam-and-jitter convolution)', () => {
    let sum = 0;
    let sumSquares = 0;
    for (let i = 0; i < DRAWS; i++) {
      sum += relativeCapture[i]!;
      sumSquares += relativeCapture[i]! ** 2;
    }
    const mean = sum / DRAWS;
    const standardError = Math.sqrt((sumSquares / DRAWS - mean * mean) / DRAWS);
    const analytic = Math.exp(logMeanAnnularCapture(beamRadiusM, a, b, sigmaM, biasM) - logCentre);
    console.log(`mean capture: Monte-Carlo ${mean.toFixed(6)} ± ${standardError.toExponential(2)}, analytic ${analytic.toFixed(6)}`);
    expect(Math.abs(mean - analytic)).toBeLessThan(4 * standardError);
  });

  it('exceeds the outage-mode pointing loss with the outage probability', () => {
    const threshold = Math.pow(10, -budget.pointingLossDb / 10);
    let below = 0;
    for (let i = 0; i < DRAWS; i++) if (relativeCapture[i]! < threshold) below++;
    console.log(`pointing outage at the pointing threshold: ${below / DRAWS} (p = 1e-2 ± ${binomialHalfWidth(1e-2).toExponential(2)})`);
    expect(Math.abs(below / DRAWS - 1e-2)).toBeLessThan(binomialHalfWidth(1e-2));
  });

  it('exceeds the fade margin with the fade probability', () => {
    const threshold = Math.pow(10, -budget.scintillationFadeMarginDb / 10);
    let below = 0;
    for (let i = 0; i < DRAWS; i++) if (irradiance[i]! < threshold) below++;
    console.log(`fade outage at the fade threshold: ${below / DRAWS} (p = 1e-2 ± ${binomialHalfWidth(1e-2).toExponential(2)}); α = ${joint.alpha.toFixed(3)}, β = ${joint.beta.toFixed(3)}`);
    expect(Math.abs(below / DRAWS - 1e-2)).toBeLessThan(binomialHalfWidth(1e-2));
  });

  it('agrees with the joint outage probability of the numerical integral, far below either p', () => {
    const threshold = Math.pow(10, -joint.headroomDb / 10);
    let below = 0;
    for (let i = 0; i < DRAWS; i++) if (relativeCapture[i]! * irradiance[i]! < threshold) below++;
    const estimate = below / DRAWS;
    console.log(`joint outage: Monte-Carlo ${estimate} (${below} of ${DRAWS}), integral ${joint.probability.toExponential(4)}, headroom ${joint.headroomDb.toFixed(3)} dB`);
    expect(Math.abs(estimate - joint.probability)).toBeLessThan(binomialHalfWidth(joint.probability));
    expect(Math.abs(budget.linkMarginDb)).toBeLessThan(1e-9);
    expect(below).toBeGreaterThan(100); // enough events for the interval to mean something
    expect(joint.probability).toBeLessThan(1e-2 / 3);
  });
});
