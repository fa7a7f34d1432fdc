import { describe, expect, it } from 'vitest';
import { workedExampleDesign } from '../examples/worked-example.js';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import { CreateLinkRequestSchema, CreateRevisionRequestSchema } from './links.contract.js';
import { MAX_VARIANTS_PER_REVISION, PromoteVariantRequestSchema, uniqueVariantName, VARIANT_NAME_MAX_LENGTH, variantNameKey } from './variants.contract.js';

function atWavelength(wavelengthM: number) {
  const design = workedExampleDesign();
  design.transmitter.wavelengthM = wavelengthM;
  return design;
}

function issuesOf(body: unknown) {
  const result = CreateRevisionRequestSchema.safeParse(body);
  return result.success ? [] : formatZodIssues(result.error);
}

const base = { baseRevision: 1, design: workedExampleDesign() };

describe('variants of a revision body', () => {
  it('are optional, default to none, and come out trimmed and NFC with design defaults applied', () => {
    expect(CreateRevisionRequestSchema.parse(base).variants).toEqual([]);
    expect(CreateLinkRequestSchema.parse({ name: 'Hop', design: workedExampleDesign() }).variants).toEqual([]);
    const parsed = CreateRevisionRequestSchema.parse({ ...base, variants: [{ name: '  Cafe\u0301 850 nm ', design: atWavelength(850e-9) }] });
    expect(parsed.variants).toHaveLength(1);
    expect(parsed.variants[0]!.name).toBe('Caf\u00e9 850 nm');
    expect(parsed.variants[0]!.design.transmitter.m2).toBe(1);
    expect(parsed.variants[0]!.design.transmitter.wavelengthM).toBe(850e-9);
  });

  it('name the variant in the path of a bad design field', () => {
    const bad = atWavelength(-850e-9);
    const variants = [
      { name: '785 nm', design: atWavelength(785e-9) },
      { name: '850 nm', design: atWavelength(850e-9) },
      { name: 'broken', design: bad },
    ];
    expect(issuesOf({ ...base, variants })).toEqual([{ path: 'variants.2.design.transmitter.wavelengthM', message: 'must be at least 200 nm' }]);
    const typo = { ...workedExampleDesign(), wavelenghtM: 1 };
    expect(issuesOf({ ...base, variants: [{ name: 'typo', design: typo }] })).toEqual([{ path: 'variants.0.design.wavelenghtM', message: 'is not a known field' }]);
    expect(issuesOf({ ...base, variants: [{ name: 'no design' }] })).toEqual([{ path: 'variants.0.design', message: 'is required' }]);
    expect(issuesOf({ ...base, variants: [{ name: 'x', design: workedExampleDesign(), colour: 'red' }] })).toEqual([{ path: 'variants.0.colour', message: 'is not a known field' }]);
    expect(issuesOf({ ...base, variants: { name: 'x' } })).toEqual([{ path: 'variants', message: 'must be a list of variants' }]);
  });

  it(`hold at most ${MAX_VARIANTS_PER_REVISION}`, () => {
    const variants = (count: number) => Array.from({ length: count }, (_, index) => ({ name: `variant ${index}`, design: workedExampleDesign() }));
    expect(CreateRevisionRequestSchema.parse({ ...base, variants: variants(MAX_VARIANTS_PER_REVISION) }).variants).toHaveLength(MAX_VARIANTS_PER_REVISION);
    expect(issuesOf({ ...base, variants: variants(MAX_VARIANTS_PER_REVISION + 1) })).toEqual([{ path: 'variants', message: 'must hold at most 8 variants' }]);
  });

  it('need a name of at most 100 characters, without control characters, unique regardless of case', () => {
    const named = (...names: string[]) => ({ ...base, variants: names.map((name) => ({ name, design: workedExampleDesign() })) });
    expect(issuesOf(named('   '))).toEqual([{ path: 'variants.0.name', message: 'is required' }]);
    expect(issuesOf(named('a'.repeat(VARIANT_NAME_MAX_LENGTH + 1)))).toEqual([{ path: 'variants.0.name', message: 'must be at most 100 characters' }]);
    expect(issuesOf(named('a\nb'))[0]).toMatchObject({ path: 'variants.0.name', message: expect.stringMatching(/^must not contain control characters/) });
    expect(issuesOf(named('850 nm', '1550 nm', ' 850 NM'))).toEqual([
      { path: 'variants.2.name', message: 'must differ from the name of variant 0 ("850 nm"); names are compared regardless of case' },
    ]);
    expect(issuesOf(named('Cafe\u0301', 'CAF\u00c9'))).toHaveLength(1);
    expect(issuesOf(named('785 nm', '850 nm'))).toEqual([]);
  });
});

describe('promotion body and names', () => {
  it('takes an optional note and an optional name for the former design', () => {
    expect(PromoteVariantRequestSchema.parse({})).toEqual({});
    expect(PromoteVariantRequestSchema.parse({ note: ' chosen ', primaryName: ' 1550 nm ' })).toEqual({ note: 'chosen', primaryName: '1550 nm' });
    const refused = PromoteVariantRequestSchema.safeParse({ primaryName: '', extra: 1 });
    expect(refused.success ? [] : formatZodIssues(refused.error)).toEqual([
      { path: 'primaryName', message: 'is required' },
      { path: 'extra', message: 'is not a known field' },
    ]);
  });

  it('makes a name unique among the others by a counted suffix, regardless of case', () => {
    expect(variantNameKey(' 850 NM ')).toBe('850 nm');
    expect(uniqueVariantName('Primary of revision 3', ['785 nm'])).toBe('Primary of revision 3');
    expect(uniqueVariantName('Primary of revision 3', ['primary of REVISION 3', 'Primary of revision 3 (2)'])).toBe('Primary of revision 3 (3)');
  });
});
