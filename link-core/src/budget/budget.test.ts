import { describe, expect, it } from 'vitest';
import { requiredThresholdOverSigma } from '../pointing/pointing.js';
import { captureFallsFromCentre, exactOutagePointingLossDb, ricianOutageRadius } from '../pointing/exact-pointing.js';
import { normalQuantileOf } from '../numeric/normal.js';
import { logOffsetAnnularCapture } from '../capture/capture.js';
import { LinkDesignSchema, type LinkDesignInput } from '../schemas/link-design.schema.js';
import { LinkBudgetSchema } from '../schemas/link-budget.schema.js';
import { availabilityFromClimatology, availabilityFromRecords, clearAirMarginDb } from './availability.js';
import { evaluateLink, linkMarginAtRangeDb } from './evaluate-link.js';
import { maxRange, maxRangeM } from './max-range.js';
import { beamEnvelope, marginVsRange, marginVsVisibility } from './samplers.js';
import { workedExampleDesign } from '../examples/worked-example.js';

// LB-01 of the reference set (METHODS.md §10.1); the full check against the published chain is in
// test/reference.test.ts. Here: structure, defaults and consistency between the routines.
const worked = workedExampleDesign();
const lb01: LinkDesignInput = { ...worked, atmosphere: { ...worked.atmosphere, turbulenceModel: 'spherical-wave' } };

function variant(change: (design: LinkDesignInput) => void): LinkDesignInput {
  const copy = structuredClone(lb01);
  change(copy);
  return copy;
}

describe('evaluateLink', () => {
  const budget = evaluateLink(lb01);

  it('gives the LB-01 margin with the exact capture (12.33 dB, reference case LB-01-exact-pointing)', () => {
    expect(budget.linkMarginDb).toBeCloseTo(12.33237831, 6);
    expect(budget.receivedPowerDbm).toBeCloseTo(-13.8521807, 6);
  });

  it('refuses a design with a required field missing instead of answering NaN, naming the field', () => {
    const { rangeM: _rangeM, ...withoutRange } = lb01;
    expect(() => evaluateLink(withoutRange as LinkDesignInput)).toThrow(/rangeM: is required/);
    const withoutPower = variant((design) => delete (design.transmitter as Partial<typeof design.transmitter>).powerDbm);
    expect(() => evaluateLink(withoutPower)).toThrow(/transmitter\.powerDbm: is required/);
    const withoutCn2 = variant((design) => delete (design.atmosphere as Partial<typeof design.atmosphere>).cn2);
    expect(() => evaluateLink(withoutCn2)).toThrow(/atmosphere\.cn2: is required/);
    const stringRange = variant((design) => ((design as unknown as Record<string, unknown>).rangeM = '2000'));
    expect(() => evaluateLink(stringRange)).toThrow(RangeError);
  });

  it('names the field of a NaN or infinite input also where the fade margin is included', () => {
    expect(() => evaluateLink(variant((design) => (design.rangeM = Number.NaN)))).toThrow(/evaluateLink: rangeM/);
    expect(() => evaluateLink(variant((design) => (design.atmosphere.cn2 = Infinity)))).toThrow(/evaluateLink: atmosphere\.cn2/);
  });

  it('returns a budget that satisfies its own schema', () => {
    expect(LinkBudgetSchema.safeParse(budget).success).toBe(true);
  });

  it('lists the terms in budget order and they sum to the margin and the received power', () => {
    expect(budget.terms.map((term) => term.key)).toEqual([
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
    ]);
    const sum = budget.terms.reduce((total, term) => total + term.valueDb, 0);
    expect(sum).toBeCloseTo(budget.linkMarginDb, 12);
    const untilReceiver = budget.terms.slice(0, 7).reduce((total, term) => total + term.valueDb, 0);
    expect(untilReceiver).toBeCloseTo(budget.receivedPowerDbm, 12);
    for (const term of budget.terms) {
      expect(term.method.length).toBeGreaterThan(10);
      expect(term.source.length).toBeGreaterThan(10);
    }
  });

  it('applies the schema defaults itself: a raw minimal design equals the parsed one', () => {
    const { scintillation: _scintillation, ...minimal } = lb01;
    const raw = evaluateLink(minimal);
    const parsed = evaluateLink(LinkDesignSchema.parse(minimal));
    expect(raw).toEqual(parsed);
    expect(raw.linkMarginDb).toBeCloseTo(budget.linkMarginDb, 12);
  });

  it('subtracts the system allowance from the margin only', () => {
    const withAllowance = evaluateLink(variant((design) => (design.systemMarginDb = 2)));
    expect(withAllowance.linkMarginDb).toBeCloseTo(budget.linkMarginDb - 2, 12);
    expect(withAllowance.receivedPowerDbm).toBe(budget.receivedPowerDbm);
  });

  it('drops the fade margin when scintillation is off or Cn² is 0', () => {
    const off = evaluateLink(variant((design) => (design.scintillation = { include: false, probability: 1e-3 })));
    const calm = evaluateLink(variant((design) => (design.atmosphere.cn2 = 0)));
    expect(off.scintillationFadeMarginDb).toBe(0);
    expect(calm.scintillationFadeMarginDb).toBe(0);
    expect(off.linkMarginDb).toBeCloseTo(budget.linkMarginDb + budget.scintillationFadeMarginDb, 12);
  });

  it('converts a MOR visibility to the 2 % visibility before the model (METHODS.md §5.1)', () => {
    const mor = evaluateLink(variant((design) => (design.atmosphere = { ...design.atmosphere, visibilityM: 5000 / 1.305865361, visibilityDefinition: 'mor-5-percent' })));
    expect(mor.atmosphericLossDb).toBeCloseTo(budget.atmosphericLossDb, 6);
    expect(mor.checks.map((check) => check.key)).toContain('visibility-converted-from-mor');
  });

  it("uses Al Naboulsi's fog models by fog type (ATT-NABOULSI-850-V0.2: 85.43 / 86.81 dB/km)", () => {
    const fog = (model: 'al-naboulsi-advection' | 'al-naboulsi-radiation', visibilityM: number) =>
      evaluateLink(variant((design) => {
        design.transmitter.wavelengthM = 850e-9;
        design.rangeM = 500;
        design.atmosphere = { ...design.atmosphere, model, visibilityM };
      }));
    const advection = fog('al-naboulsi-advection', 200);
    expect(advection.specificAttenuationDbPerKm).toBeCloseTo(85.43143556, 6);
    expect(advection.atmosphericLossDb).toBeCloseTo(85.43143556 / 2, 6);
    expect(advection.terms.find((t) => t.key === 'atmosphericAttenuation')!.source).toMatch(/Al Naboulsi/);
    expect(advection.checks.map((check) => check.key)).not.toContain('fog-model-outside-validity');
    expect(fog('al-naboulsi-radiation', 200).specificAttenuationDbPerKm).toBeCloseTo(86.80866697, 6);
    expect(fog('al-naboulsi-advection', 5000).checks.map((check) => check.key)).toContain('fog-model-outside-validity');
  });

  it('models a beam without divergence, or below the diffraction limit, as collimated', () => {
    const collimated = evaluateLink(variant((design) => delete design.transmitter.halfAngleDivergenceRad));
    // w(L) = w0·sqrt(1 + (L/z_R)²), z_R = πw0²/λ (Kogelnik & Li 1966)
    const rayleigh = (Math.PI * 0.025 ** 2) / 1.55e-6;
    expect(collimated.beamModel).toBe('collimated');
    expect(collimated.rayleighRangeM).toBeCloseTo(rayleigh, 6);
    expect(collimated.beamRadiusAtReceiverM).toBeCloseTo(0.025 * Math.sqrt(1 + (2000 / rayleigh) ** 2), 12);
    const belowLimit = evaluateLink(variant((design) => (design.transmitter.halfAngleDivergenceRad = 1e-5)));
    expect(belowLimit.beamRadiusAtReceiverM).toBe(collimated.beamRadiusAtReceiverM);
    expect(belowLimit.checks.map((check) => check.key)).toContain('divergence-below-diffraction-limit');
  });

  it('loses the obscured part of the aperture', () => {
    const obscured = evaluateLink(variant((design) => (design.receiver.obscurationRatio = 0.3)));
    // a ≪ W: the captured power scales with the open area, 1 − 0.3² = 0.91
    expect(obscured.geometricLossDb - budget.geometricLossDb).toBeCloseTo(-10 * Math.log10(0.91), 3);
  });

  it('warns when the received power exceeds the overload level', () => {
    const short = evaluateLink(variant((design) => {
      design.rangeM = 100;
      design.receiver.overloadDbm = -10;
    }));
    expect(short.receivedPowerDbm).toBeGreaterThan(-10);
    expect(short.checks.find((check) => check.key === 'receiver-overload')?.severity).toBe('warning');
  });

  it('warns when the field of view is narrower than the turbulence blur', () => {
    const narrow = evaluateLink(variant((design) => (design.receiver.fieldOfViewRad = 1e-6)));
    expect(narrow.checks.map((check) => check.key)).toContain('field-of-view-below-turbulence-blur');
    const wide = evaluateLink(variant((design) => (design.receiver.fieldOfViewRad = 5e-3)));
    expect(wide.checks.map((check) => check.key)).not.toContain('field-of-view-below-turbulence-blur');
  });

  it('budgets the exact capture at the outage radius for an outage-based design', () => {
    const outage = evaluateLink(variant((design) => (design.pointing.outageProbability = 1e-3)));
    // bias/jitter = 100/50 µrad = 2 and p = 1e-3 give r_p = 5.241σ (Marcum Q1 root, as in the PT-04 reference case)
    const radiusM = ricianOutageRadius(50e-6 * 2000, 100e-6 * 2000, 1e-3);
    expect(radiusM / (50e-6 * 2000)).toBeCloseTo(5.241, 3);
    const w = outage.beamRadiusAtReceiverM;
    const exact = -(10 / Math.LN10) * (logOffsetAnnularCapture(w, 0.05, 0, radiusM) - Math.log(-Math.expm1(-2 * (0.05 / w) ** 2)));
    expect(outage.pointingLossModel).toBe('outage');
    expect(outage.pointingLossDb).toBeCloseTo(exact, 12);
    // a/W = 0.025 here: the small-receiver form 8.686·(r_p/W)² is within 1e-3 dB of the exact capture
    expect(outage.pointingLossDb).toBeCloseTo(8.686 * (radiusM / w) ** 2, 2);
    expect(outage.pointingLossDb).toBeGreaterThan(budget.pointingLossDb);
    expect(outage.terms.find((t) => t.key === 'pointingLoss')!.label).toMatch(/outage/);
    expect(budget.pointingLossModel).toBe('mean');
    const noJitter = evaluateLink(variant((design) => {
      design.pointing = { jitterSigmaPerAxisRad: 0, staticErrorRad: 100e-6, outageProbability: 1e-3 };
    }));
    expect(noJitter.pointingLossDb).toBeCloseTo(8.6859 * ((100e-6 * 2000) / noJitter.beamRadiusAtReceiverM) ** 2, 3);
  });

  it('finds the outage radius of a bias of many σ by the exact root, and by the large-bias expansion beyond 1000 σ', () => {
    const design = variant((d) => (d.pointing = { jitterSigmaPerAxisRad: 1e-6, staticErrorRad: 150e-6, outageProbability: 1e-3 }));
    const exactRadiusM = requiredThresholdOverSigma({ outageProbability: 1e-3, staticOffsetOverSigma: 150 }) * 1e-6 * 2000;
    expect(Math.abs(ricianOutageRadius(1e-6 * 2000, 150e-6 * 2000, 1e-3) / exactRadiusM - 1)).toBeLessThan(1e-12);
    const budgetOutage = evaluateLink(design);
    const w = budgetOutage.beamRadiusAtReceiverM;
    const exactLossDb = -(10 / Math.LN10) * (logOffsetAnnularCapture(w, 0.05, 0, exactRadiusM) - Math.log(-Math.expm1(-2 * (0.05 / w) ** 2)));
    expect(Math.abs(budgetOutage.pointingLossDb / exactLossDb - 1)).toBeLessThan(1e-9);
    // from 1000 σ the budget uses the large-bias expansion ν + σz + σ²/(2ν) − σ³z/(4ν²), z = −Φ⁻¹(p):
    // against the exact root (quadrature Q1), through the budget's own outage term
    for (const nu of [1000, 3000]) {
      for (const p of [1e-9, 1e-3, 0.3]) {
        const exactFar = ricianOutageRadius(1, nu, p);
        const z = -normalQuantileOf(p);
        expect(Math.abs((nu + z + 0.5 / nu - z / (4 * nu * nu)) / exactFar - 1)).toBeLessThan(1e-10);
      }
    }
    const far = variant((d) => (d.pointing = { jitterSigmaPerAxisRad: 0.05e-6, staticErrorRad: 100e-6, outageProbability: 1e-3 }));
    const farBudget = evaluateLink(far);
    const farRadiusM = ricianOutageRadius(0.05e-6 * 2000, 100e-6 * 2000, 1e-3);
    const farExactLossDb =
      -(10 / Math.LN10) * (logOffsetAnnularCapture(farBudget.beamRadiusAtReceiverM, 0.05, 0, farRadiusM) - Math.log(-Math.expm1(-2 * (0.05 / farBudget.beamRadiusAtReceiverM) ** 2)));
    expect(Math.abs(farBudget.pointingLossDb / farExactLossDb - 1)).toBeLessThan(1e-9);
  });

  it('makes the pointing term a gain when an offset moves power onto an obscured aperture', () => {
    // Short link, narrow beam, large obscuration: the beam centre sits behind the secondary mirror.
    const gain = evaluateLink(variant((design) => {
      design.rangeM = 200;
      design.transmitter.halfAngleDivergenceRad = 100e-6;
      design.receiver.apertureDiameterM = 0.2;
      design.receiver.obscurationRatio = 0.4;
      design.pointing = { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 150e-6 };
      design.scintillation = { include: false };
    }));
    expect(gain.pointingLossDb).toBeLessThan(0);
    expect(gain.terms.find((t) => t.key === 'pointingLoss')!.valueDb).toBeGreaterThan(0);
    const sum = gain.terms.reduce((total, t) => total + t.valueDb, 0);
    expect(sum).toBeCloseTo(gain.linkMarginDb, 9);
  });

  it('stays finite where the obscuration hides nearly all of the beam', () => {
    const hidden = evaluateLink(variant((design) => {
      design.rangeM = 50;
      design.transmitter.halfAngleDivergenceRad = undefined;
      design.receiver.apertureDiameterM = 0.5;
      design.receiver.obscurationRatio = 0.9;
      design.pointing = { jitterSigmaPerAxisRad: 1e-6, staticErrorRad: 2e-6 };
    }));
    expect(hidden.geometricLossDb).toBeGreaterThan(300);
    expect(Number.isFinite(hidden.pointingLossDb)).toBe(true);
    expect(Number.isFinite(hidden.linkMarginDb)).toBe(true);
    const outage = evaluateLink(variant((design) => {
      design.rangeM = 50;
      design.transmitter.halfAngleDivergenceRad = undefined;
      design.receiver.apertureDiameterM = 0.5;
      design.receiver.obscurationRatio = 0.9;
      design.pointing = { jitterSigmaPerAxisRad: 1e-6, staticErrorRad: 2e-6, outageProbability: 1e-3 };
    }));
    expect(Number.isFinite(outage.pointingLossDb)).toBe(true);
  });

  it("names the published steps of the visibility models in the ledger (Kim at 50 km, Kruse at 6 and 50 km)", () => {
    const keys = (model: 'kim' | 'kruse', visibilityM: number) =>
      evaluateLink(variant((design) => (design.atmosphere = { ...design.atmosphere, model, visibilityM }))).checks.map((check) => check.key);
    expect(keys('kim', 48_000)).toContain('published-model-step');
    expect(keys('kim', 6_000)).not.toContain('published-model-step'); // Kim's q is continuous at 6 km
    expect(keys('kruse', 6_200)).toContain('published-model-step');
    expect(keys('kim', 20_000)).not.toContain('published-model-step');
    const attenuation = evaluateLink(lb01).terms.find((t) => t.key === 'atmosphericAttenuation')!;
    expect(attenuation.method).toMatch(/50 km/);
  });

  it('warns when the mean pointing loss hides outages, and only in mean mode', () => {
    // jitter 400 µrad on a 2 m beam at 2 km: σ = 0.8 m, a mean loss that looks mild
    const jittery = variant((design) => (design.pointing = { jitterSigmaPerAxisRad: 400e-6, staticErrorRad: 100e-6 }));
    const warned = evaluateLink(jittery);
    const check = warned.checks.find((c) => c.key === 'pointing-mean-hides-outage');
    expect(check?.severity).toBe('warning');
    const atOutage = evaluateLink({ ...jittery, pointing: { ...jittery.pointing, outageProbability: 1e-3 } });
    expect(atOutage.pointingLossDb - warned.pointingLossDb).toBeGreaterThan(1);
    // the message states the loss at 1e-3, or a lower bound of it ("at least"), never more than it
    const stated = Number(/is (?:at least )?(\d+\.\d+) dB/.exec(check!.message)![1]);
    expect(stated).toBeLessThanOrEqual(atOutage.pointingLossDb + 0.005);
    expect(stated - warned.pointingLossDb).toBeGreaterThan(1);
    expect(check?.message).toMatch(/outage probability/);
    expect(atOutage.checks.map((c) => c.key)).not.toContain('pointing-mean-hides-outage');
    expect(budget.checks.map((c) => c.key)).not.toContain('pointing-mean-hides-outage');
  });

  it('decides the hidden-outage warning as the exact quantile does, also where an obscuration makes the capture rise from the centre', () => {
    // short links with narrow beams on obscured apertures, where the mean pointing term is often a gain
    let rising = 0;
    const risingVerdicts = new Set<boolean>();
    for (const rangeM of [200, 350, 600, 1000])
      for (const obscurationRatio of [0, 0.2, 0.3, 0.4])
        for (const jitterSigmaPerAxisRad of [10e-6, 30e-6, 80e-6, 200e-6])
          for (const staticErrorRad of [0, 40e-6, 120e-6, 200e-6]) {
            const design = variant((d) => {
              d.rangeM = rangeM;
              d.transmitter.halfAngleDivergenceRad = undefined;
              d.transmitter.waistRadiusM = 0.01;
              d.receiver = { ...d.receiver, apertureDiameterM: 0.2, obscurationRatio };
              d.pointing = { jitterSigmaPerAxisRad, staticErrorRad };
              d.atmosphere = { ...d.atmosphere, turbulenceModel: 'gaussian-beam' };
            });
            const result = evaluateLink(design);
            const beamRadiusM = result.longTermBeamRadiusM!; // always set by the current engine
            const exactDb = exactOutagePointingLossDb(beamRadiusM, 0.1, 0.1 * obscurationRatio, jitterSigmaPerAxisRad * rangeM, staticErrorRad * rangeM, 1e-3);
            const excessDb = exactDb - result.pointingLossDb;
            if (Math.abs(excessDb - 1) < 1e-9) continue; // a tie: either verdict is right
            const warned = result.checks.some((c) => c.key === 'pointing-mean-hides-outage');
            expect(warned, `range ${rangeM} m, ε ${obscurationRatio}, σ ${jitterSigmaPerAxisRad}, bias ${staticErrorRad}`).toBe(excessDb > 1);
            if (!captureFallsFromCentre(beamRadiusM, 0.1, 0.1 * obscurationRatio)) {
              rising++;
              risingVerdicts.add(warned);
            }
          }
    expect(rising).toBeGreaterThan(10);
    expect([...risingVerdicts].sort()).toEqual([false, true]);
  });

  it('gives the same margin through linkMarginAtRangeDb', () => {
    expect(linkMarginAtRangeDb(lb01, 2000)).toBeCloseTo(budget.linkMarginDb, 12);
  });
});

describe('maxRangeM', () => {
  it('finds the range where the margin equals the requirement', () => {
    const rangeM = maxRangeM(lb01, 3)!;
    expect(linkMarginAtRangeDb(lb01, rangeM)).toBeCloseTo(3, 6);
  });

  it('returns null when even 50 m does not give the margin', () => {
    expect(maxRangeM(lb01, 200)).toBeNull();
    expect(maxRange(lb01, 200).status).toBe('not-achievable');
  });

  it('caps at 50 km and says so', () => {
    const result = maxRange(lb01, -500);
    expect(result).toMatchObject({ status: 'beyond-search-limit', rangeM: 50_000 });
    expect(maxRangeM(lb01, -500)).toBe(50_000);
  });

  it('rejects a non-finite requirement', () => {
    expect(() => maxRangeM(lb01, Number.NaN)).toThrow(/requiredMarginDb/);
  });
});

describe('availability', () => {
  const oneKm = variant((design) => {
    design.rangeM = 1000;
    design.scintillation = { include: false, probability: 1e-3 };
  });
  // Synthetic climatology of the reference case LB-03 (not real data).
  const climatology = {
    visibilityM: [50, 100, 200, 500, 1000, 2000, 5000, 10000],
    probabilityBelow: [0.0005, 0.001, 0.002, 0.005, 0.01, 0.03, 0.1, 0.3],
  };

  it('matches LB-03: V_min 540 m, availability 99.46 %', () => {
    const result = availabilityFromClimatology(oneKm, climatology);
    expect(result.minimumVisibilityM).toBeCloseTo(540.317, 2);
    expect(result.availabilityPercent).toBeCloseTo(99.4597, 3);
    expect(result.lookup).toBe('interpolated');
  });

  it('reads a MOR climatology at V_min/1.306', () => {
    const twoPercent = availabilityFromClimatology(oneKm, climatology);
    const mor = availabilityFromClimatology(oneKm, { ...climatology, visibilityDefinition: 'mor-5-percent' });
    expect(mor.minimumVisibilityM! * 1.305865361).toBeCloseTo(twoPercent.minimumVisibilityM!, 4);
  });

  it("inverts Al Naboulsi's fog model in closed form: at V_min the fog takes exactly the clear-air margin", () => {
    const fogDesign = variant((design) => {
      design.rangeM = 1000;
      design.scintillation = { include: false, probability: 1e-3 };
      design.atmosphere = { ...design.atmosphere, model: 'al-naboulsi-radiation' };
    });
    const result = availabilityFromClimatology(fogDesign, climatology);
    const atMinimum = evaluateLink({ ...fogDesign, atmosphere: { ...fogDesign.atmosphere, visibilityM: result.minimumVisibilityM! } });
    expect(atMinimum.linkMarginDb).toBeCloseTo(0, 9);
  });

  it('reports a link that never closes', () => {
    const result = availabilityFromClimatology(oneKm, climatology, { requiredMarginDb: 100 });
    expect(result).toMatchObject({ availability: 0, minimumVisibilityM: null, lookup: 'always-down' });
  });

  it('rejects malformed tables with the field', () => {
    expect(() => availabilityFromClimatology(oneKm, { visibilityM: [100, 50], probabilityBelow: [0.1, 0.2] })).toThrow(/visibilityM\.1/);
    expect(() => availabilityFromClimatology(oneKm, { visibilityM: [50, 100], probabilityBelow: [0.2, 1.5] })).toThrow(/probabilityBelow\.1/);
  });

  it('counts hourly records below V_min as down, and agrees with the clear-air margin', () => {
    const vMin = availabilityFromClimatology(oneKm, climatology).minimumVisibilityM!;
    const visibilityM = [10_000, vMin * 0.9, vMin * 0.8, 20_000, Number.NaN, vMin * 0.5, vMin * 1.1, 300];
    const result = availabilityFromRecords(oneKm, { visibilityM });
    expect(result).toMatchObject({ recordCount: 8, usableCount: 7, missingCount: 1, unavailableHours: 4, availableHours: 3, outageCount: 3, longestOutageH: 2 });
    expect(result.availability).toBeCloseTo(3 / 7, 12);
    expect(result.clearAirMarginDb).toBeCloseTo(clearAirMarginDb(oneKm), 12);
    expect(result.worstMarginDb).toBeLessThan(0);
  });

  it('weights time-stamped records by their interval and treats long gaps as missing time', () => {
    const hour = 3_600_000;
    const result = availabilityFromRecords(oneKm, {
      visibilityM: [100, 100, 20_000, 20_000],
      timestampsMs: [0, 0.5 * hour, 1 * hour, 11 * hour],
    });
    // 0.5 h down, 0.5 h down, then 1 h up before a 10 h gap (counted as one nominal hour), 1 h up
    expect(result.unavailableHours).toBeCloseTo(1, 12);
    expect(result.coveredHours).toBeCloseTo(3, 12);
    expect(result.outageCount).toBe(1);
    expect(result.longestOutageH).toBeCloseTo(1, 12);
    expect(() => availabilityFromRecords(oneKm, { visibilityM: [1, 2], timestampsMs: [5, 5] })).toThrow(/timestampsMs\.1/);
  });
});

describe('chart samplers', () => {
  const budget = evaluateLink(lb01);

  it('marginVsRange passes through the design point and falls with range', () => {
    const sweep = marginVsRange(lb01, { fromM: 1000, toM: 3000, points: 5 });
    expect(sweep.rangeM).toEqual([1000, 1500, 2000, 2500, 3000]);
    expect(sweep.linkMarginDb[2]).toBeCloseTo(budget.linkMarginDb, 12);
    for (let i = 1; i < 5; i++) expect(sweep.linkMarginDb[i]!).toBeLessThan(sweep.linkMarginDb[i - 1]!);
  });

  it('marginVsVisibility passes through the design visibility and rises with it', () => {
    const sweep = marginVsVisibility(lb01, { fromM: 500, toM: 50_000, points: 3 });
    expect(sweep.visibilityM[1]).toBeCloseTo(5000, 9);
    expect(sweep.linkMarginDb[1]).toBeCloseTo(budget.linkMarginDb, 9);
    expect(sweep.linkMarginDb[0]!).toBeLessThan(sweep.linkMarginDb[2]!);
  });

  it('beamEnvelope ends at the budget beam radius and starts at W0', () => {
    const envelope = beamEnvelope(lb01, { points: 11 });
    expect(envelope.beamRadiusM[0]).toBeCloseTo(0.025, 12);
    expect(envelope.beamRadiusM[10]).toBeCloseTo(budget.beamRadiusAtReceiverM, 9);
    expect(envelope.beamModel).toBe('defocused');
    expect(envelope.waistPositionM).toBeLessThan(0);
    expect(envelope.rayleighRangeEndWithinPath).toBe(false);
  });

  it('beamEnvelope adds the long-term radius of the Gaussian-beam model, as the budget computes it at each distance', () => {
    // a narrow collimated beam over 3 km in moderate turbulence
    const narrow = variant((d) => {
      d.rangeM = 3000;
      d.transmitter.waistRadiusM = 0.005;
      delete d.transmitter.halfAngleDivergenceRad;
      d.atmosphere.cn2 = 1e-14;
      d.atmosphere.turbulenceModel = 'gaussian-beam';
    });
    const envelope = beamEnvelope(narrow, { points: 7 });
    const longTerm = envelope.longTermBeamRadiusM!;
    expect(longTerm).toHaveLength(7);
    expect(longTerm[0]).toBe(0.005); // no path, no spread
    envelope.distanceM.forEach((distanceM, i) => {
      if (i === 0) return;
      const atDistance = evaluateLink({ ...narrow, rangeM: distanceM });
      expect(Math.abs(longTerm[i]! / atDistance.longTermBeamRadiusM! - 1)).toBeLessThan(1e-12);
      expect(Math.abs(envelope.beamRadiusM[i]! / atDistance.beamRadiusAtReceiverM - 1)).toBeLessThan(1e-9);
      expect(longTerm[i]!).toBeGreaterThan(envelope.beamRadiusM[i]!);
    });
    const receiver = evaluateLink(narrow);
    expect(Math.abs(longTerm[6]! / receiver.longTermBeamRadiusM! - 1)).toBeLessThan(1e-12);
    expect(receiver.longTermBeamRadiusM! / receiver.beamRadiusAtReceiverM).toBeGreaterThan(1.02); // 3.3 % wider at the receiver here

    expect(beamEnvelope(variant((d) => (d.atmosphere.turbulenceModel = 'spherical-wave'))).longTermBeamRadiusM).toBeUndefined();
    expect(beamEnvelope(variant((d) => ((d.atmosphere.turbulenceModel = 'gaussian-beam'), (d.atmosphere.cn2 = 0)))).longTermBeamRadiusM).toBeUndefined();
  });

  it('marks the Rayleigh range of a collimated beam at πW0²/(M²λ) from the aperture', () => {
    const design = variant((d) => {
      delete d.transmitter.halfAngleDivergenceRad;
      d.transmitter.m2 = 1.2;
    });
    const envelope = beamEnvelope(design);
    const rayleigh = (Math.PI * 0.025 ** 2) / (1.2 * 1.55e-6);
    expect(envelope.rayleighRangeEndM).toBeCloseTo(rayleigh, 6);
    expect(envelope.rayleighRangeEndWithinPath).toBe(true);
  });

  it('rejects a bad sample count', () => {
    expect(() => marginVsRange(lb01, { points: 1 })).toThrow(/points/);
  });
});
