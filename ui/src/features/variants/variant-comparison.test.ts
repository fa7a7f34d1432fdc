import { describe, expect, it } from 'vitest';
import { assessEyeSafety, evaluateLink, eyeSafetyInputOf, maxRange } from '@beamwright/link-core';
import { workedExampleDesign } from '@/testing/designs';
import { compareDesigns } from '@/features/variants/variant-comparison';
import { wavelengthSet } from '@/features/variants/wavelength-set';

const primary = workedExampleDesign;
const set = wavelengthSet(primary);

describe('side-by-side comparison', () => {
  const columns = [{ name: 'Design', design: primary }, ...set];
  const rows = compareDesigns(columns, 3);
  const row = (key: string) => rows.find((candidate) => candidate.key === key)!;

  it('builds a wavelength set of the same optics at the other usual wavelengths', () => {
    expect(set.map((item) => item.name)).toEqual(['785 nm', '850 nm', '1310 nm']);
    for (const item of set) expect({ ...item.design, transmitter: { ...item.design.transmitter, wavelengthM: primary.transmitter.wavelengthM } }).toEqual(primary);
  });

  it('gives each design the engine’s own figures', () => {
    columns.forEach(({ design }, index) => {
      const budget = evaluateLink(design);
      expect(row('margin').values[index]).toBeCloseTo(budget.linkMarginDb, 12);
      expect(row('term.geometricSpread').values[index]).toBeCloseTo(budget.terms.find((term) => term.key === 'geometricSpread')!.valueDb, 12);
      const range = maxRange(design, 3);
      if (range.status === 'found') expect(row('maxRange').values[index]).toBeCloseTo(range.rangeM! / 1000, 9);
      const safety = assessEyeSafety(eyeSafetyInputOf(design, budget));
      expect(row('class').values[index]).toBe(safety.indicativeClass);
      expect(row('nohd').values[index]).toBeCloseTo(safety.nohdUnaidedM, 9);
    });
  });

  it('marks the best value of a row and what differs from the design', () => {
    const margins = row('margin').values as number[];
    const best = margins.indexOf(Math.max(...margins));
    expect(row('margin').best).toEqual([best]);
    expect(row('wavelength').differs).toEqual([false, true, true, true]);
    expect(row('power').differs).toEqual([false, false, false, false]);
    // every design has the same power: a row of equal values has no best
    expect(row('term.transmitPower').best).toEqual([]);
    // a smaller NOHD is better
    const nohd = row('nohd').values as number[];
    expect(row('nohd').best).toEqual(nohd.flatMap((value, index) => (Math.abs(value - Math.min(...nohd)) <= 0.005 ? [index] : [])));
  });
});
