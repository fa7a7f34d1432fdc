/**
 * The engine over the whole design domain: designs are generated from the bounds the schema itself
 * declares (read from the zod schemas, so a changed bound moves the generator with it), with the
 * bounds themselves, values a hair inside them and probabilities at their limits drawn often.
 * Every accepted design must give a budget whose every number is finite, and no single call may
 * take long: the slowest call of the run (CPU time, after a warm-up) is asserted against a
 * generous bound and printed.
 *
 * The bound is a guard against pathological inputs (a stalled root search took about 10 s per call
 * at p = 1e-17), not a performance target: those are in `npm run bench`.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  ATMOSPHERE_MODELS,
  AtmosphereSchema,
  evaluateLink,
  LinkDesignSchema,
  PointingSchema,
  ReceiverSchema,
  ScintillationSchema,
  TransmitterSchema,
  VISIBILITY_DEFINITIONS,
  type LinkBudget,
  type LinkDesignInput,
} from '../src/index.js';

/** Slowest single evaluateLink call allowed in the run [ms] (measured figure is printed). */
const SLOWEST_CALL_BOUND_MS = 50;
const RUNS = 3000;

interface NumberSchemaBounds {
  minValue: number | null;
  maxValue: number | null;
  safeParse(value: unknown): { success: boolean };
}

/** The number schema under .optional()/.default() wrappers. */
function numberSchemaOf(schema: z.ZodType): NumberSchemaBounds {
  let current = schema as unknown as { _zod: { def: { innerType?: unknown } } };
  while (current._zod.def.innerType) current = current._zod.def.innerType as typeof current;
  return current as unknown as NumberSchemaBounds;
}

/**
 * Values of one numeric field: both bounds (or the nearest accepted value when a bound is
 * exclusive), values just inside them, and the span between, log-uniform for positive ranges.
 */
function fieldValues(schema: z.ZodType): fc.Arbitrary<number> {
  const number = numberSchemaOf(schema);
  if (number.minValue === null || number.maxValue === null) throw new Error('every numeric design field must declare both bounds');
  const accepted = (value: number) => number.safeParse(value).success;
  const min = accepted(number.minValue) ? number.minValue : number.minValue === 0 ? Number.MIN_VALUE : number.minValue + Math.abs(number.minValue) * 1e-15;
  const max = accepted(number.maxValue) ? number.maxValue : number.maxValue * (1 - 1e-15);
  const edges = [min, max, min + (max - min) * 1e-12, max - (max - min) * 1e-12];
  if (min === 0) edges.push(1e-300, 1e-30);
  if (min === Number.MIN_VALUE) edges.push(1e-300, 1e-30, 1e-12);
  const span =
    min > 0
      ? fc.double({ min: Math.log(min), max: Math.log(max), noNaN: true }).map((log) => Math.min(max, Math.max(min, Math.exp(log))))
      : fc.double({ min, max, noNaN: true });
  return fc.oneof({ arbitrary: fc.constantFrom(...edges.filter(accepted)), weight: 1 }, { arbitrary: span, weight: 2 });
}

const shapeOf = (section: z.ZodObject) => section.shape as Record<string, z.ZodType>;

/** A record of the numeric fields of one section, optional fields sometimes absent. */
function numericSection(section: z.ZodObject, fields: readonly string[], requiredKeys: readonly string[]) {
  const shape = shapeOf(section);
  const arbitraries = Object.fromEntries(fields.map((field) => [field, fieldValues(shape[field]!)]));
  return fc.record(arbitraries, { requiredKeys: [...requiredKeys] });
}

const designArbitrary: fc.Arbitrary<LinkDesignInput> = fc.record({
  rangeM: fieldValues(LinkDesignSchema.shape.rangeM),
  transmitter: numericSection(TransmitterSchema, ['wavelengthM', 'powerDbm', 'waistRadiusM', 'halfAngleDivergenceRad', 'm2', 'opticsLossDb'], ['wavelengthM', 'powerDbm', 'waistRadiusM', 'opticsLossDb']),
  receiver: numericSection(ReceiverSchema, ['apertureDiameterM', 'sensitivityDbm', 'opticsLossDb', 'overloadDbm', 'obscurationRatio', 'fieldOfViewRad'], ['apertureDiameterM', 'sensitivityDbm', 'opticsLossDb']),
  pointing: numericSection(PointingSchema, ['jitterSigmaPerAxisRad', 'staticErrorRad', 'outageProbability'], ['jitterSigmaPerAxisRad', 'staticErrorRad']),
  atmosphere: fc.record(
    {
      model: fc.constantFrom(...ATMOSPHERE_MODELS),
      visibilityM: fieldValues(shapeOf(AtmosphereSchema).visibilityM!),
      visibilityDefinition: fc.constantFrom(...VISIBILITY_DEFINITIONS),
      cn2: fieldValues(shapeOf(AtmosphereSchema).cn2!),
    },
    { requiredKeys: ['visibilityM', 'cn2'] },
  ),
  scintillation: fc.record({ include: fc.boolean(), probability: fieldValues(shapeOf(ScintillationSchema).probability!) }, { requiredKeys: [] }),
  systemMarginDb: fieldValues(LinkDesignSchema.shape.systemMarginDb),
}) as fc.Arbitrary<LinkDesignInput>;

/** Every number anywhere in the budget, with its path. */
function numbersOf(value: unknown, path = ''): [string, number][] {
  if (typeof value === 'number') return [[path, value]];
  if (Array.isArray(value)) return value.flatMap((item, index) => numbersOf(item, `${path}.${index}`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([key, child]) => numbersOf(child, path ? `${path}.${key}` : key));
  return [];
}

describe('evaluateLink over the whole schema domain', () => {
  it(`gives only finite numbers, and no call takes more than ${SLOWEST_CALL_BOUND_MS} ms`, () => {
    // Warm-up, so that the first calls' compilation is not counted as the cost of a design.
    for (const input of fc.sample(designArbitrary, { numRuns: 300, seed: 1 })) {
      const parsed = LinkDesignSchema.safeParse(input);
      if (parsed.success) evaluateLink(parsed.data);
    }
    let slowestMs = 0;
    let slowestDesign: unknown;
    let evaluated = 0;
    fc.assert(
      fc.property(designArbitrary, (input) => {
        const parsed = LinkDesignSchema.safeParse(input);
        // the only cross-field rule: the overload level must exceed the sensitivity
        fc.pre(parsed.success);
        const design = parsed.data!;
        // CPU time of this process: on a shared machine wall time would also count the neighbours.
        const start = process.cpuUsage();
        const budget: LinkBudget = evaluateLink(design);
        const used = process.cpuUsage(start);
        const elapsedMs = (used.user + used.system) / 1000;
        evaluated++;
        if (elapsedMs > slowestMs) {
          slowestMs = elapsedMs;
          slowestDesign = design;
        }
        const notFinite = numbersOf(budget).filter(([, value]) => !Number.isFinite(value));
        expect(notFinite).toEqual([]);
        expect(budget.terms).toHaveLength(10);
      }),
      { numRuns: RUNS, seed: 20261203 },
    );
    // The slowest call mixes the design's own cost with collector pauses: re-time that design alone.
    let retimedMs = Infinity;
    for (let i = 0; i < 5; i++) {
      const start = process.cpuUsage();
      evaluateLink(slowestDesign as LinkDesignInput);
      const used = process.cpuUsage(start);
      retimedMs = Math.min(retimedMs, (used.user + used.system) / 1000);
    }
    console.log(
      `slowest evaluateLink call over ${evaluated} designs across the schema domain: ${slowestMs.toFixed(2)} ms CPU (bound ${SLOWEST_CALL_BOUND_MS} ms); that design re-timed alone: ${retimedMs.toFixed(2)} ms`,
    );
    expect(evaluated).toBeGreaterThan(RUNS * 0.8);
    expect(slowestMs, `slowest design: ${JSON.stringify(slowestDesign)}`).toBeLessThan(SLOWEST_CALL_BOUND_MS);
  });

  it('draws the probabilities at their bounds', () => {
    const probability = fieldValues(shapeOf(ScintillationSchema).probability!);
    const samples = fc.sample(probability, { numRuns: 400, seed: 7 });
    expect(samples).toContain(1e-9);
    expect(samples).toContain(0.5);
  });
});
