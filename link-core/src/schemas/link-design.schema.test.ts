import { describe, expect, it } from 'vitest';
import { formatZodIssues } from './format-zod-issues.js';
import { workedExampleDesign } from '../examples/worked-example.js';
import { FADE_PROBABILITY_MESSAGE, LINK_DESIGN_DEFAULTS, LinkDesignSchema, POINTING_OUTAGE_PROBABILITY_MESSAGE, PROBABILITY_BOUNDS, type LinkDesignInput } from './link-design.schema.js';

// The worked example LB-01 of the reference set (METHODS.md §10.1): a 2 km 1550 nm link.
const lb01: LinkDesignInput = workedExampleDesign();

function withChange(path: string, value: unknown): unknown {
  const copy = structuredClone(lb01) as Record<string, unknown>;
  const keys = path.split('.');
  let target = copy;
  for (const key of keys.slice(0, -1)) target = target[key] as Record<string, unknown>;
  target[keys.at(-1)!] = value;
  return copy;
}

function issuesOf(design: unknown) {
  const result = LinkDesignSchema.safeParse(design);
  expect(result.success).toBe(false);
  return formatZodIssues(result.error!);
}

describe('LinkDesignSchema', () => {
  it('accepts the LB-01 design and applies the defaults', () => {
    const design = LinkDesignSchema.parse(lb01);
    expect(design.transmitter.m2).toBe(1);
    expect(design.receiver.obscurationRatio).toBe(0);
    expect(design.atmosphere.visibilityDefinition).toBe('contrast-2-percent');
    expect(design.systemMarginDb).toBe(0);
  });

  it('fills the scintillation section and the atmosphere model when they are absent', () => {
    const { scintillation: _omitted, ...rest } = lb01;
    const design = LinkDesignSchema.parse({ ...rest, atmosphere: { visibilityM: 5000, cn2: 5e-14 } });
    expect(design.scintillation).toEqual({ include: true, probability: LINK_DESIGN_DEFAULTS.scintillationProbability });
    expect(design.atmosphere.model).toBe('kim');
  });

  it.each([
    ['rangeM', 0, 'must be greater than 0'],
    ['rangeM', -5, 'must be greater than 0'],
    ['rangeM', 150_000, 'must be at most 100 km'],
    ['rangeM', 0.5, 'must be at least 1 m'],
    ['transmitter.waistRadiusM', 1e-6, 'must be at least 0.1 mm'],
    ['receiver.apertureDiameterM', 1e-6, 'must be at least 1 mm'],
    ['atmosphere.visibilityM', 0.1, 'must be at least 1 m'],
    ['transmitter.wavelengthM', 0, 'must be at least 200 nm'],
    ['transmitter.wavelengthM', -1.55e-6, 'must be at least 200 nm'],
    ['transmitter.wavelengthM', 1550, 'must be at most 20 µm'],
    ['transmitter.waistRadiusM', 0, 'must be greater than 0'],
    ['transmitter.halfAngleDivergenceRad', -1e-3, 'must be greater than 0'],
    ['transmitter.m2', 0.5, 'must be at least 1'],
    ['transmitter.opticsLossDb', -1, 'must be at least 0 dB (a loss cannot be negative)'],
    ['receiver.apertureDiameterM', 0, 'must be greater than 0'],
    ['receiver.obscurationRatio', 1, 'must be less than 1'],
    ['receiver.opticsLossDb', -0.5, 'must be at least 0 dB (a loss cannot be negative)'],
    ['pointing.jitterSigmaPerAxisRad', -1e-6, 'must be at least 0'],
    ['atmosphere.visibilityM', 0, 'must be greater than 0'],
    ['atmosphere.cn2', -1e-14, 'must be at least 0 m^(−2/3)'],
    ['atmosphere.model', 'fog', 'must be one of kim, kruse, al-naboulsi-advection, al-naboulsi-radiation'],
    ['atmosphere.visibilityDefinition', '5%', 'must be one of contrast-2-percent, mor-5-percent'],
    ['scintillation.probability', 0, FADE_PROBABILITY_MESSAGE],
    ['scintillation.probability', 1e-17, FADE_PROBABILITY_MESSAGE],
    ['scintillation.probability', 9.9e-10, FADE_PROBABILITY_MESSAGE],
    ['scintillation.probability', 0.51, FADE_PROBABILITY_MESSAGE],
    ['scintillation.probability', 1, FADE_PROBABILITY_MESSAGE],
    ['scintillation.probability', 1.5, FADE_PROBABILITY_MESSAGE],
    ['pointing.outageProbability', 1, POINTING_OUTAGE_PROBABILITY_MESSAGE],
    ['pointing.outageProbability', 1e-12, POINTING_OUTAGE_PROBABILITY_MESSAGE],
    ['pointing.outageProbability', 0.75, POINTING_OUTAGE_PROBABILITY_MESSAGE],
    ['scintillation.include', 'yes', 'must be true or false'],
    ['systemMarginDb', -3, 'must be at least 0 dB (a loss cannot be negative)'],
    ['transmitter.wavelengthM', '1550 nm', 'must be a finite number'],
    ['transmitter.wavelengthM', undefined, 'is required'],
    ['transmitter', undefined, 'is required'],
  ])('rejects %s = %s with "%s"', (path, value, message) => {
    expect(issuesOf(withChange(path, value))).toEqual([{ path, message }]);
  });

  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])('rejects the non-finite value %s', (value) => {
    expect(issuesOf(withChange('transmitter.powerDbm', value))).toEqual([
      { path: 'transmitter.powerDbm', message: 'must be a finite number' },
    ]);
  });

  it('accepts every probability at the bounds of the range where its model holds', () => {
    for (const probability of [PROBABILITY_BOUNDS.fade.min, PROBABILITY_BOUNDS.fade.max]) {
      expect(LinkDesignSchema.safeParse(withChange('scintillation.probability', probability)).success).toBe(true);
    }
    for (const probability of [PROBABILITY_BOUNDS.pointingOutage.min, PROBABILITY_BOUNDS.pointingOutage.max]) {
      expect(LinkDesignSchema.safeParse(withChange('pointing.outageProbability', probability)).success).toBe(true);
    }
    // the message says why, and names the bounds
    expect(FADE_PROBABILITY_MESSAGE).toMatch(/^must be between 1e-9 and 0\.5: /);
    expect(POINTING_OUTAGE_PROBABILITY_MESSAGE).toMatch(/^must be between 1e-9 and 0\.5: /);
  });

  it('rejects unknown keys with the path of the typo', () => {
    const design = structuredClone(lb01) as unknown as Record<string, Record<string, unknown>>;
    design.transmitter!.wavelenghtM = 1.55e-6;
    design.extra = {};
    expect(issuesOf(design)).toEqual([
      { path: 'transmitter.wavelenghtM', message: 'is not a known field' },
      { path: 'extra', message: 'is not a known field' },
    ]);
  });

  it('rejects an overload level that is not above the sensitivity', () => {
    expect(issuesOf(withChange('receiver.overloadDbm', -40))).toEqual([
      { path: 'receiver.overloadDbm', message: 'must be greater than the sensitivity' },
    ]);
  });

  it('reports every bad field at once', () => {
    const design = withChange('rangeM', -1) as Record<string, Record<string, unknown>>;
    design.receiver!.apertureDiameterM = Number.NaN;
    expect(issuesOf(design).map((issue) => issue.path)).toEqual(['rangeM', 'receiver.apertureDiameterM']);
  });
});
