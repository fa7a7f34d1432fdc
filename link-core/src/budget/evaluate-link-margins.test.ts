import { describe, expect, it } from 'vitest';
import { seededUniform } from '../numeric/seeded-random.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { workedExampleDesign } from '../examples/worked-example.js';
import { evaluateLink } from './evaluate-link.js';
import { LINK_MARGIN_FIELDS, evaluateLinkMargins, linkMarginPointDesign, type LinkMarginColumns } from './evaluate-link-margins.js';

// The kernel must give evaluateLink's margin (METHODS.md §10.8): checked point by point against
// evaluateLink on seeded designs that differ in every numeric field. Both sum the same numbers in
// the same order, so the margins agree to the last bit; the tolerance the kernel promises is 1e-9 dB.
const TOLERANCE_DB = 1e-9;
const WAVELENGTHS_M = [785e-9, 850e-9, 1310e-9, 1550e-9];

/** Columns over the span of practice (ranges 0.2–5 km, fog to clear air, calm to strong turbulence), every field varied. */
function seededColumns(count: number, seed: number, options: { outage?: boolean } = {}): LinkMarginColumns {
  const random = seededUniform(seed);
  const uniform = (min: number, max: number) => min + (max - min) * random();
  const logUniform = (min: number, max: number) => Math.exp(uniform(Math.log(min), Math.log(max)));
  const column = (draw: () => number) => Float64Array.from({ length: count }, draw);
  const columns: LinkMarginColumns = {
    rangeM: column(() => logUniform(200, 5000)),
    'transmitter.wavelengthM': column(() => WAVELENGTHS_M[Math.floor(random() * 4)]!),
    'transmitter.powerDbm': column(() => uniform(5, 27)),
    'transmitter.waistRadiusM': column(() => uniform(0.0075, 0.04)),
    'transmitter.halfAngleDivergenceRad': column(() => (random() < 0.15 ? 0 : uniform(0.25e-3, 1.5e-3))),
    'transmitter.m2': column(() => uniform(1, 1.5)),
    'transmitter.opticsLossDb': column(() => uniform(1, 3)),
    'receiver.apertureDiameterM': column(() => uniform(0.05, 0.25)),
    'receiver.obscurationRatio': column(() => (random() < 0.3 ? uniform(0.1, 0.4) : 0)),
    'receiver.sensitivityDbm': column(() => uniform(-46, -20)),
    'receiver.opticsLossDb': column(() => uniform(1, 3)),
    'pointing.jitterSigmaPerAxisRad': column(() => logUniform(10e-6, 300e-6)),
    'pointing.staticErrorRad': column(() => uniform(0, 200e-6)),
    'atmosphere.visibilityM': column(() => logUniform(200, 50_000)),
    'atmosphere.cn2': column(() => logUniform(1e-16, 1e-13)),
    'scintillation.probability': column(() => (random() < 0.6 ? 1e-3 : logUniform(1e-6, 1e-2))),
    systemMarginDb: column(() => uniform(0, 3)),
  };
  if (options.outage) columns['pointing.outageProbability'] = column(() => logUniform(1e-6, 1e-2));
  return columns;
}

function baseDesign(change: (design: LinkDesignInput) => void = () => {}): LinkDesignInput {
  const design = workedExampleDesign();
  change(design);
  return design;
}

function worstDifferenceDb(design: LinkDesignInput, columns: LinkMarginColumns): { worst: number; count: number; unequal: number } {
  const margins = evaluateLinkMargins(design, columns);
  let worst = 0;
  let unequal = 0;
  for (let i = 0; i < margins.length; i++) {
    const expected = evaluateLink(linkMarginPointDesign(design, columns, i)).linkMarginDb;
    worst = Math.max(worst, Math.abs(margins[i]! - expected));
    if (margins[i] !== expected) unequal++;
  }
  return { worst, count: margins.length, unequal };
}

/** Within the promised 1e-9 dB, and in fact equal to the last bit. */
function expectSameAsEvaluateLink(design: LinkDesignInput, columns: LinkMarginColumns): void {
  const { worst, unequal } = worstDifferenceDb(design, columns);
  expect(worst).toBeLessThan(TOLERANCE_DB);
  expect(unequal).toBe(0);
}

describe('evaluateLinkMargins', () => {
  it('gives evaluateLink’s margin within 1e-9 dB on 3000 seeded designs without scintillation (Gaussian-beam model, Kim and Kruse)', () => {
    for (const model of ['kim', 'kruse'] as const) {
      const design = baseDesign((d) => {
        d.scintillation = { include: false };
        d.atmosphere = { ...d.atmosphere, model };
      });
      const { worst, count, unequal } = worstDifferenceDb(design, seededColumns(3000, model === 'kim' ? 11 : 12));
      expect(count).toBe(3000);
      expect(worst).toBeLessThan(TOLERANCE_DB);
      expect(unequal).toBe(0);
    }
  });

  it('gives evaluateLink’s margin with the gamma-gamma fade margin, for both turbulence models', () => {
    for (const turbulenceModel of ['gaussian-beam', 'spherical-wave'] as const) {
      const design = baseDesign((d) => (d.atmosphere = { ...d.atmosphere, turbulenceModel }));
      const { worst, unequal } = worstDifferenceDb(design, seededColumns(2000, turbulenceModel === 'gaussian-beam' ? 21 : 22));
      expect(worst).toBeLessThan(TOLERANCE_DB);
      expect(unequal).toBe(0);
    }
  });

  it('gives evaluateLink’s margin for the spherical-wave model without scintillation, and with MOR visibility', () => {
    const design = baseDesign((d) => {
      d.scintillation = { include: false };
      d.atmosphere = { ...d.atmosphere, turbulenceModel: 'spherical-wave', visibilityDefinition: 'mor-5-percent' };
    });
    expectSameAsEvaluateLink(design, seededColumns(2000, 31));
  });

  it('gives evaluateLink’s margin with outage-based pointing and with Al Naboulsi’s fog model', () => {
    expectSameAsEvaluateLink(baseDesign(), seededColumns(1000, 41, { outage: true }));
    const fog = baseDesign((d) => (d.atmosphere = { ...d.atmosphere, model: 'al-naboulsi-advection' }));
    const columns = seededColumns(1000, 42);
    columns['atmosphere.visibilityM'] = Float64Array.from({ length: 1000 }, (_, i) => 60 + (i % 50) * 18);
    expectSameAsEvaluateLink(fog, columns);
  });

  it('reuses the path part only where it may: a range × visibility grid and a power sweep equal evaluateLink point by point', () => {
    const ranges = [400, 900, 1600, 2500, 4000];
    const visibilities = [150, 400, 1000, 3000, 10_000, 30_000];
    const rangeM = new Float64Array(ranges.length * visibilities.length);
    const visibilityM = new Float64Array(rangeM.length);
    ranges.forEach((range, row) =>
      visibilities.forEach((visibility, column) => {
        rangeM[row * visibilities.length + column] = range;
        visibilityM[row * visibilities.length + column] = visibility;
      }),
    );
    const grid = { rangeM, 'atmosphere.visibilityM': visibilityM };
    expectSameAsEvaluateLink(baseDesign(), grid);
    // columns laid out the other way (range the inner axis) give the same margins
    const sweep = { 'transmitter.powerDbm': Float64Array.from({ length: 40 }, (_, i) => 5 + i / 2) };
    expectSameAsEvaluateLink(baseDesign(), sweep);
    // a varied field set back to the base value between points is recomputed, not reused
    const alternating = { 'atmosphere.cn2': Float64Array.from({ length: 20 }, (_, i) => (i % 2 === 0 ? 5e-14 : 2e-15)) };
    expectSameAsEvaluateLink(baseDesign(), alternating);
  });

  it('without columns gives the base design’s margin, and writes into a given array', () => {
    const design = baseDesign();
    const single = evaluateLinkMargins(design, {});
    expect(single).toHaveLength(1);
    expect(Math.abs(single[0]! - evaluateLink(design).linkMarginDb)).toBeLessThan(TOLERANCE_DB);
    const into = new Float64Array(3);
    const result = evaluateLinkMargins(design, { rangeM: Float64Array.of(1000, 2000, 3000) }, into);
    expect(result).toBe(into);
    expect(Math.abs(into[1]! - evaluateLink(design).linkMarginDb)).toBeLessThan(TOLERANCE_DB);
    expect(into[0]).toBeGreaterThan(into[2]!);
  });

  it('names the field when a column is wrong or the base design lacks a field', () => {
    const design = baseDesign();
    expect(() => evaluateLinkMargins(design, { rangeM: [1000, 2000] as unknown as Float64Array })).toThrow(/rangeM: must be a Float64Array/);
    expect(() => evaluateLinkMargins(design, { rangeM: new Float64Array(3), 'atmosphere.cn2': new Float64Array(2) })).toThrow(/atmosphere\.cn2: has 2 values where the other columns have 3/);
    expect(() => evaluateLinkMargins(design, { 'atmosphere.model': new Float64Array(1) } as unknown as LinkMarginColumns)).toThrow(/atmosphere\.model: not a numeric design field/);
    expect(() => evaluateLinkMargins(design, { rangeM: new Float64Array(2) }, new Float64Array(3))).toThrow(/into must be a Float64Array of length 2/);
    const { rangeM: _rangeM, ...withoutRange } = design;
    expect(() => evaluateLinkMargins(withoutRange as LinkDesignInput, {})).toThrow(/evaluateLinkMargins: rangeM: is required/);
  });

  it('names the point and the field whose value makes the margin meaningless, as evaluateLink does for one design', () => {
    const rangeM = Float64Array.of(1000, 1500, Number.NaN, 2500);
    expect(() => evaluateLinkMargins(baseDesign(), { rangeM })).toThrow(/point 2: rangeM/);
    expect(() => evaluateLink(linkMarginPointDesign(baseDesign(), { rangeM }, 2))).toThrow(/rangeM/);
  });

  it('lists every numeric field of the design it can vary, each once', () => {
    expect(new Set(LINK_MARGIN_FIELDS).size).toBe(LINK_MARGIN_FIELDS.length);
    const point = linkMarginPointDesign(baseDesign(), seededColumns(1, 5, { outage: true }), 0);
    for (const field of LINK_MARGIN_FIELDS) {
      const [group, name] = field.includes('.') ? field.split('.') : [undefined, field];
      const value = group ? (point as unknown as Record<string, Record<string, unknown>>)[group]![name!] : (point as unknown as Record<string, unknown>)[name!];
      if (field !== 'transmitter.halfAngleDivergenceRad' || value !== undefined) expect(typeof value, field).toBe('number');
    }
  });
});
