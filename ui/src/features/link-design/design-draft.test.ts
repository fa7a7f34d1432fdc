import { describe, expect, it } from 'vitest';
import { LinkDesignSchema, evaluateLink } from '@beamwright/link-core';
import { draftFromDesign, evaluateDraft, toOneOverESquaredRadius } from '@/features/link-design/design-draft';
import { rebaseDraft } from '@/features/link-design/design-rebase';
import { diffDesigns } from '@/features/link-design/design-diff';
import { workedExampleDesign } from '@/testing/designs';

describe('design draft', () => {
  it('writes a stored design in the units engineers type', () => {
    const draft = draftFromDesign(workedExampleDesign);
    expect(draft.text.rangeM).toBe('2 km');
    expect(draft.text['transmitter.wavelengthM']).toBe('1550 nm');
    expect(draft.text['transmitter.powerDbm']).toBe('20 dBm');
    expect(draft.text['transmitter.waistRadiusM']).toBe('25 mm');
    expect(draft.text['transmitter.halfAngleDivergenceRad']).toBe('1 mrad');
    expect(draft.text['pointing.jitterSigmaPerAxisRad']).toBe('50 µrad');
    expect(draft.text['atmosphere.cn2']).toBe('5e-14');
  });

  it('reads the text back to the same design, so an untouched form changes nothing', () => {
    const { design, errors } = evaluateDraft(draftFromDesign(workedExampleDesign), workedExampleDesign);
    expect(errors).toEqual({});
    expect(diffDesigns(LinkDesignSchema.parse(workedExampleDesign), design)).toEqual([]);
    // the published margin of the worked example (12.33 dB) comes out of the parsed form
    expect(evaluateLink({ ...design!, atmosphere: { ...design!.atmosphere, turbulenceModel: 'spherical-wave' } }).linkMarginDb).toBeCloseTo(12.33, 1);
  });

  it('accepts other spellings of the same quantities', () => {
    const draft = draftFromDesign(workedExampleDesign);
    draft.text.rangeM = '2000 m';
    draft.text['transmitter.wavelengthM'] = '1.55 µm';
    draft.text['transmitter.powerDbm'] = '100 mW';
    draft.text['receiver.apertureDiameterM'] = '10 cm';
    draft.text['receiver.sensitivityDbm'] = '−36'; // typographic minus, plain number in dBm
    const { design, errors } = evaluateDraft(draft, workedExampleDesign);
    expect(errors).toEqual({});
    expect(design?.rangeM).toBeCloseTo(2000, 9);
    expect(design?.transmitter.wavelengthM).toBeCloseTo(1.55e-6, 15);
    expect(design?.transmitter.powerDbm).toBeCloseTo(20, 9);
    expect(design?.receiver.apertureDiameterM).toBeCloseTo(0.1, 12);
    expect(design?.receiver.sensitivityDbm).toBeCloseTo(-36, 9);
  });

  it('converts a full-angle FWHM divergence to the 1/e² half angle (factor 1.6986 / 2)', () => {
    const draft = draftFromDesign(workedExampleDesign);
    draft.text['transmitter.halfAngleDivergenceRad'] = '2 mrad';
    draft.divergence = { extent: 'full', definition: 'fwhm' };
    const { design } = evaluateDraft(draft, workedExampleDesign);
    // 1/e² = 1.6986 × FWHM (Gaussian profile; link-core/METHODS.md §1.3, check GB-05)
    expect(design?.transmitter.halfAngleDivergenceRad).toBeCloseTo((2e-3 * 1.6986) / 2, 7);
    expect(toOneOverESquaredRadius(1, 'radius', '1/e')).toBeCloseTo(Math.SQRT2, 12);
  });

  it('names the field and the reason for text that does not parse and for values the schema refuses', () => {
    const draft = draftFromDesign(workedExampleDesign);
    draft.text.rangeM = 'far';
    draft.text['transmitter.wavelengthM'] = '100 nm';
    draft.text['receiver.apertureDiameterM'] = '10 mrad';
    draft.text['transmitter.opticsLossDb'] = '-1 dB';
    draft.text['pointing.staticErrorRad'] = '';
    const { design, errors } = evaluateDraft(draft, workedExampleDesign);
    expect(design).toBeNull();
    expect(errors.rangeM).toMatch(/^Path length is not a number/);
    expect(errors['transmitter.wavelengthM']).toBe('Wavelength must be at least 200 nm');
    expect(errors['receiver.apertureDiameterM']).toMatch(/^Receive aperture diameter "mrad" is not a unit of length/);
    expect(errors['transmitter.opticsLossDb']).toMatch(/^Transmit optics loss must be at least 0 dB/);
    expect(errors['pointing.staticErrorRad']).toBe('Static pointing error is required');
  });

  it('carries over stored fields the form does not show', () => {
    const stored = { ...workedExampleDesign, receiver: { ...workedExampleDesign.receiver, overloadDbm: -3 } };
    const draft = draftFromDesign(stored);
    expect(draft.text['receiver.overloadDbm']).toBe('-3 dBm');
    const { design } = evaluateDraft(draft, stored);
    expect(design?.receiver.overloadDbm).toBeCloseTo(-3, 9);
  });
});

describe('re-applying edits after a save conflict', () => {
  it('keeps the engineer’s edits, takes the other changes, and reports where both touched a field', () => {
    const mine = draftFromDesign(workedExampleDesign);
    mine.text.rangeM = '2.5 km';
    mine.text['transmitter.powerDbm'] = '23 dBm';
    mine.text['receiver.apertureDiameterM'] = 'abc'; // still being typed: must survive
    const latest = {
      ...workedExampleDesign,
      transmitter: { ...workedExampleDesign.transmitter, powerDbm: 18 },
      atmosphere: { ...workedExampleDesign.atmosphere, visibilityM: 2000 },
    };
    const { draft, reapplied, overlapping } = rebaseDraft(mine, workedExampleDesign, latest);
    expect(draft.text.rangeM).toBe('2.5 km');
    expect(draft.text['transmitter.powerDbm']).toBe('23 dBm');
    expect(draft.text['receiver.apertureDiameterM']).toBe('abc');
    expect(draft.text['atmosphere.visibilityM']).toBe('2 km');
    expect(reapplied.sort()).toEqual(['rangeM', 'receiver.apertureDiameterM', 'transmitter.powerDbm']);
    expect(overlapping).toEqual(['transmitter.powerDbm']);
  });
});

describe('design diff', () => {
  it('lists changed fields with labels and units', () => {
    const after = { ...workedExampleDesign, rangeM: 2500, atmosphere: { ...workedExampleDesign.atmosphere, model: 'kruse' as const } };
    expect(diffDesigns(workedExampleDesign, after)).toEqual([
      { path: 'rangeM', label: 'Path length', before: '2.000 km', after: '2.500 km' },
      { path: 'atmosphere.model', label: 'Visibility model', before: 'Kim (2001)', after: 'Kruse (1962)' },
    ]);
  });
});
