import { UnprocessableEntityException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { evaluateLink, LinkDesignSchema, type LinkBudget } from '@beamwright/link-core';
import { toErrorBody } from './filters/api-exception.filter.js';
import { checkedBudget } from './checked-budget.js';

const design = LinkDesignSchema.parse({
  rangeM: 2000,
  transmitter: { wavelengthM: 1550e-9, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
  atmosphere: { model: 'kim', visibilityM: 5000, cn2: 5e-14 },
});

describe('checkedBudget', () => {
  it("passes link-core's budget through unchanged", () => {
    const budget = evaluateLink(design);
    expect(checkedBudget(budget)).toBe(budget);
  });

  it('answers 422 naming every non-finite figure of a broken budget (forged: the engine no longer returns one)', () => {
    // what evaluateLink returned for a fade probability of 1e-17 before the quantile was fixed
    const broken: LinkBudget = { ...evaluateLink(design), scintillationFadeMarginDb: Infinity, linkMarginDb: -Infinity };
    broken.terms = broken.terms.map((term) => (term.key === 'scintillationFade' ? { ...term, valueDb: -Infinity } : term));
    let thrown: unknown;
    try {
      checkedBudget(broken);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(UnprocessableEntityException);
    const body = toErrorBody(thrown);
    expect(body.statusCode).toBe(422);
    expect(body.message).toMatch(/could not be computed .*nothing was saved/);
    expect(body.issues).toEqual(
      expect.arrayContaining([
        { path: 'budget.terms.8.valueDb', message: 'must be a finite number' },
        { path: 'budget.scintillationFadeMarginDb', message: 'must be a finite number' },
        { path: 'budget.linkMarginDb', message: 'must be a finite number' },
      ]),
    );
    expect(body.issues).toHaveLength(3);
  });

  it("names a variant's budget by the path it is given", () => {
    let thrown: unknown;
    try {
      checkedBudget({ ...evaluateLink(design), linkMarginDb: Number.NaN }, 'variants.2.budget');
    } catch (error) {
      thrown = error;
    }
    expect(toErrorBody(thrown).issues).toEqual([{ path: 'variants.2.budget.linkMarginDb', message: 'must be a finite number' }]);
  });

  it('refuses NaN as well', () => {
    expect(() => checkedBudget({ ...evaluateLink(design), receivedPowerDbm: Number.NaN })).toThrow(UnprocessableEntityException);
  });
});
