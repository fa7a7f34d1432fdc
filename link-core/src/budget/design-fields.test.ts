import { describe, expect, it } from 'vitest';
import { workedExampleDesign } from '../examples/worked-example.js';
import { LinkDesignSchema } from '../schemas/link-design.schema.js';
import { designFieldRange, designValueOf, InvalidInputError, requireDesignFieldValue, requireValidDesign, VARIABLE_DESIGN_FIELDS, withDesignValue } from './design-fields.js';

const worked = workedExampleDesign();

describe('variable design fields', () => {
  it('sets exactly the named field, leaving the design it came from unchanged', () => {
    for (const field of VARIABLE_DESIGN_FIELDS) {
      const before = structuredClone(worked);
      const changed = withDesignValue(worked, field, 0.0123);
      expect(designValueOf(changed, field)).toBe(0.0123);
      expect(worked).toEqual(before);
      // every other variable field keeps its value
      for (const other of VARIABLE_DESIGN_FIELDS) if (other !== field) expect(designValueOf(changed, other)).toBe(designValueOf(worked, other));
    }
  });

  it('reads the allowed ranges from LinkDesignSchema', () => {
    expect(designFieldRange('rangeM')).toEqual({ field: 'rangeM', lower: 1, upper: 100_000, lowerExclusive: false, unit: 'm' });
    expect(designFieldRange('transmitter.powerDbm')).toMatchObject({ lower: -40, upper: 50, unit: 'dBm' });
    expect(designFieldRange('transmitter.waistRadiusM')).toMatchObject({ lower: 1e-4, upper: 1, lowerExclusive: false });
    expect(designFieldRange('transmitter.halfAngleDivergenceRad')).toMatchObject({ lower: 0, upper: 0.1, lowerExclusive: true, unit: 'rad' });
    expect(designFieldRange('atmosphere.cn2')).toMatchObject({ lower: 0, upper: 1e-10, lowerExclusive: false });
    // every bound is what the schema itself accepts or refuses
    for (const field of VARIABLE_DESIGN_FIELDS) {
      const range = designFieldRange(field);
      expect(LinkDesignSchema.safeParse(withDesignValue(worked, field, range.upper)).success).toBe(true);
      expect(LinkDesignSchema.safeParse(withDesignValue(worked, field, range.upper * 1.001 + 1e-12)).success).toBe(false);
      expect(LinkDesignSchema.safeParse(withDesignValue(worked, field, range.lower)).success).toBe(!range.lowerExclusive);
    }
  });

  it('rejects a value outside the field range, naming the entry, the field and the reason', () => {
    expect(() => requireDesignFieldValue('marginSweep', 'axis.to', 'rangeM', 2e5)).toThrow('marginSweep: axis.to: must be at most 100 km (as rangeM)');
    expect(() => requireDesignFieldValue('marginSweep', 'axis.from', 'transmitter.halfAngleDivergenceRad', 0)).toThrow(/axis\.from: must be greater than 0/);
    expect(() => requireDesignFieldValue('marginSweep', 'axis.from', 'rangeM', 500)).not.toThrow();
  });

  it('reports every bad design field with its path, as an InvalidInputError (a RangeError)', () => {
    const bad = { ...worked, rangeM: -1, transmitter: { ...worked.transmitter, wavelenghtM: 1 } };
    try {
      requireValidDesign('solveDesign', bad);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(InvalidInputError);
      expect(error).toBeInstanceOf(RangeError);
      const issues = (error as InvalidInputError).issues;
      expect(issues).toContainEqual({ path: 'design.rangeM', message: 'must be greater than 0' });
      expect(issues).toContainEqual({ path: 'design.transmitter.wavelenghtM', message: 'is not a known field' });
      expect((error as Error).message).toMatch(/^solveDesign: /);
    }
  });
});
