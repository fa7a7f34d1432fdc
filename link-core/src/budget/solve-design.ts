/**
 * Design solvers (METHODS.md §15.1): the smallest transmit power or transmit beam radius, or the
 * largest range, that leaves a required link margin, and the divergence that maximises the margin —
 * each searched over the field's whole allowed range on the budget of `evaluateLink`, with the term
 * that limits the design when nothing in range is enough.
 */
import { z } from 'zod';
import { findRootBrent } from '../numeric/root-finding.js';
import { minimiseBrent } from '../numeric/minimisation.js';
import { finiteNumber } from '../schemas/fields.js';
import type { BudgetTermKey, LinkBudget } from '../schemas/link-budget.schema.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { optimumTruncation } from '../transmit/truncation.js';
import { evaluateLink } from './evaluate-link.js';
import { designFieldRange, parseOrThrow, requireValidDesign, withDesignValue, type VariableDesignField } from './design-fields.js';

/** What {@link solveDesign} may vary: the field's name inside the design. */
export const SOLVE_DESIGN_VARIABLES = ['powerDbm', 'rangeM', 'waistRadiusM', 'halfAngleDivergenceRad'] as const;
export type SolveDesignVariable = (typeof SOLVE_DESIGN_VARIABLES)[number];

/** The design field each solver variable sets. */
export const SOLVE_DESIGN_FIELDS: Readonly<Record<SolveDesignVariable, VariableDesignField>> = {
  powerDbm: 'transmitter.powerDbm',
  rangeM: 'rangeM',
  waistRadiusM: 'transmitter.waistRadiusM',
  halfAngleDivergenceRad: 'transmitter.halfAngleDivergenceRad',
};

/** Options of {@link solveDesign}, checked with this schema (unknown keys refused). */
export const SolveDesignOptionsSchema = z.strictObject({
  vary: z.enum(SOLVE_DESIGN_VARIABLES, { error: `must be one of ${SOLVE_DESIGN_VARIABLES.join(', ')}` }),
  /** required link margin [dB]; may be negative (a margin below 0 dB is allowed as a requirement) */
  requiredMarginDb: finiteNumber(),
});
export type SolveDesignOptions = z.input<typeof SolveDesignOptionsSchema>;

/** Result of {@link solveDesign}. */
export interface SolveDesignResult {
  /** true when a value in the field's allowed range gives at least the required margin */
  achievable: boolean;
  /**
   * the solution, in the field's own unit (dBm for the power, m for range and beam radius, rad for
   * the divergence); present only when achievable
   */
  value?: number;
  /**
   * `evaluateLink(design with value).linkMarginDb` [dB]; when not achievable, the best margin
   * reached anywhere in the allowed range (at `bestValue`)
   */
  marginDb: number;
  /**
   * key of the budget term with the largest loss at `value` (or `bestValue`): what limits the
   * design. Loss terms only (not the transmit power or the sensitivity).
   */
  limitingTerm: BudgetTermKey;
  /** the solver variable and the design field it set */
  vary: SolveDesignVariable;
  field: VariableDesignField;
  requiredMarginDb: number;
  /** when not achievable: the value at which `marginDb` (the best margin) was reached */
  bestValue?: number;
  /**
   * true when the answer is an end of the searched interval: e.g. even −40 dBm leaves the margin,
   * the margin still holds at 100 km, or the narrowest beam (the diffraction limit) is best
   */
  atSearchLimit: boolean;
  /** the interval searched, in the field's unit (the schema's range; for the divergence from the diffraction limit) */
  searchInterval: { lower: number; upper: number };
  /**
   * waist solver: transmit aperture diameter 2·α_opt·w [m] for the beam radius found (or the best
   * one), at the Klein–Degnan optimum truncation α_opt = a/w (1.1209 unobscured, METHODS.md §2.3)
   */
  transmitApertureDiameterM?: number;
  /** waist solver: the truncation ratio α = a/w used for `transmitApertureDiameterM` */
  truncationRatio?: number;
  /** waist solver: the clipping loss −10·log10(T) at that ratio [dB] (0.367 dB); the budget does not charge it */
  truncationClippingLossDb?: number;
  /** what a reader of the result should know (why a limit was hit, what the budget leaves out) */
  notes: string[];
}

/** Scan density of the log-spaced searches: 48 points a decade, neighbours 4.9 % apart. */
const POINTS_PER_DECADE = 48;
/** Scan step of the power search [dB]. */
const POWER_STEP_DB = 1;
/**
 * A local maximum of the scan within this much of the requirement (or of the best scanned margin)
 * is refined: between two scan points 4.9 % apart the margin moves by well under 1 dB on the
 * budgets seen, so a peak further below cannot reach it.
 */
const PEAK_WINDOW_DB = 3;
/** At most this many local maxima are refined per search (the best ones first). */
const MAX_REFINED_PEAKS = 8;
/** A margin the engine cannot compute (non-finite) counts as this far short of the requirement [dB]. */
const UNCOMPUTABLE_EXCESS_DB = -1e9;
/** Budget terms that are losses (the transmit power and the sensitivity are not). */
const LOSS_TERMS: readonly BudgetTermKey[] = [
  'transmitOptics',
  'geometricSpread',
  'turbulenceBeamSpread',
  'atmosphericAttenuation',
  'pointingLoss',
  'receiveOptics',
  'scintillationFade',
  'systemAllowance',
];

/**
 * Solves a design for one field (METHODS.md §15.1), holding every other field as designed:
 * - `powerDbm`: the smallest `transmitter.powerDbm` in −40 … 50 dBm with margin ≥ requiredMarginDb;
 * - `waistRadiusM`: the smallest `transmitter.waistRadiusM` in 0.1 mm … 1 m with margin ≥ required,
 *   with the transmit aperture diameter at the optimum truncation ratio beside it;
 * - `rangeM`: the largest `rangeM` in 1 m … 100 km with margin ≥ required;
 * - `halfAngleDivergenceRad`: the `transmitter.halfAngleDivergenceRad` in (0, 0.1 rad] that
 *   maximises the margin (wide enough for the pointing error, narrow enough for power), achievable
 *   when that maximum meets the requirement. At or below the diffraction limit M²λ/(πW0) the beam is
 *   collimated and the margin the same, so the search starts there.
 *
 * "Margin" is `evaluateLink(design with value).linkMarginDb`; the value returned meets the
 * requirement (margin ≥ requiredMarginDb) and lies within 1e-10 relative of the crossing, so the
 * margin there is the requirement to far better than 0.01 dB. The margin need not be monotone in
 * the field (a datasheet divergence makes it peak where the diffraction angle meets it; an
 * obscured receiver makes it rise with range), so each search scans the whole range (48 log-spaced
 * points a decade, 1 dB steps for the power), refines any local maximum of the scan near the
 * requirement with Brent's minimisation, and brackets the first (or last) crossing for Brent's root
 * finder. When nothing in range is enough, the result is not achievable, with the best margin, the
 * value that reaches it, and the largest loss there as `limitingTerm`.
 *
 * @param design the link design (validated: a bad field throws, naming it as `design.<path>`)
 * @param options `vary` (one of SOLVE_DESIGN_VARIABLES) and `requiredMarginDb` [dB], finite
 * @returns achievable, value (field unit), margin [dB], limiting term, and the search details
 * @throws InvalidInputError (a RangeError) naming the bad design field or option
 * @see METHODS.md §15.1 and §10.1; Brent R.P., "Algorithms for Minimization without Derivatives"
 *   (1973), ch. 4 (roots) and ch. 5 (minima); Klein B.J., Degnan J.J., Appl. Opt. 13(9), 2134–2141
 *   (1974) (optimum truncation).
 * @example solveDesign(workedExampleDesign(), { vary: 'powerDbm', requiredMarginDb: 6 }).value // 13.61 dBm
 */
export function solveDesign(design: LinkDesignInput, options: SolveDesignOptions): SolveDesignResult {
  const { vary, requiredMarginDb } = parseOrThrow('solveDesign', SolveDesignOptionsSchema, options);
  requireValidDesign('solveDesign', design);
  const field = SOLVE_DESIGN_FIELDS[vary];
  const marginAt = (value: number): number => evaluateLink(withDesignValue(design, field, value)).linkMarginDb;
  const excessAt = (value: number): number => {
    const excess = marginAt(value) - requiredMarginDb;
    return Number.isFinite(excess) ? excess : UNCOMPUTABLE_EXCESS_DB;
  };
  const range = designFieldRange(field);
  const search = vary === 'halfAngleDivergenceRad' ? maximiseMargin(design, excessAt, range.upper) : findCrossing(vary, excessAt, range.lower, range.upper);
  const value = search.value;
  const budget = evaluateLink(withDesignValue(design, field, value));
  const marginDb = budget.linkMarginDb;
  const achievable = marginDb >= requiredMarginDb;
  const result: SolveDesignResult = {
    achievable,
    ...(achievable ? { value } : { bestValue: value }),
    marginDb,
    limitingTerm: largestLossTerm(budget),
    vary,
    field,
    requiredMarginDb,
    atSearchLimit: value === search.lower || value === search.upper,
    searchInterval: { lower: search.lower, upper: search.upper },
    notes: search.notes,
  };
  if (vary === 'waistRadiusM') addTransmitAperture(result, value, budget, design);
  return result;
}

interface SearchOutcome {
  /** the solution, or the best value when nothing meets the requirement */
  value: number;
  lower: number;
  upper: number;
  notes: string[];
}

/** Scan abscissae: 1 dB steps for the power, 48 a decade (log-spaced) otherwise; ends exact. */
function scanGrid(vary: SolveDesignVariable, lower: number, upper: number): Float64Array {
  if (vary === 'powerDbm') {
    const count = Math.ceil((upper - lower) / POWER_STEP_DB) + 1;
    return Float64Array.from({ length: count }, (_, i) => (i === count - 1 ? upper : lower + i * POWER_STEP_DB));
  }
  const decades = Math.log10(upper / lower);
  const count = Math.max(2, Math.ceil(decades * POINTS_PER_DECADE) + 1);
  return Float64Array.from({ length: count }, (_, i) => (i === 0 ? lower : i === count - 1 ? upper : lower * Math.pow(upper / lower, i / (count - 1))));
}

/** A peak of the excess between the scan neighbours of index i, refined with Brent's minimisation. */
function refinePeak(excessAt: (value: number) => number, grid: Float64Array, excess: Float64Array, i: number): { value: number; excess: number } {
  const from = grid[Math.max(i - 1, 0)]!;
  const to = grid[Math.min(i + 1, grid.length - 1)]!;
  const peak = minimiseBrent((value) => -excessAt(value), from, to, { xTolerance: 1e-10 * Math.max(Math.abs(from), Math.abs(to)) });
  // Brent may settle within its tolerance of an end; the scan point itself may be higher.
  return -peak.value > excess[i]! ? { value: peak.x, excess: -peak.value } : { value: grid[i]!, excess: excess[i]! };
}

/** Indices of the scan's local maxima (ends included), best first, at most MAX_REFINED_PEAKS within PEAK_WINDOW_DB of `reference`. */
function peaksNear(excess: Float64Array, reference: number): number[] {
  const peaks: number[] = [];
  for (let i = 0; i < excess.length; i++) {
    const left = i === 0 ? -Infinity : excess[i - 1]!;
    const right = i === excess.length - 1 ? -Infinity : excess[i + 1]!;
    if (excess[i]! >= left && excess[i]! >= right && excess[i]! >= reference - PEAK_WINDOW_DB) peaks.push(i);
  }
  return peaks.sort((a, b) => excess[b]! - excess[a]!).slice(0, MAX_REFINED_PEAKS);
}

/**
 * A value between `infeasible` (excess < 0) and `feasible` (excess ≥ 0) where the excess crosses
 * zero, on the feasible side: Brent's root, nudged by its tolerance when it landed just short.
 */
function crossingBetween(excessAt: (value: number) => number, infeasible: number, feasible: number): number {
  const tolerance = 1e-10 * Math.max(Math.abs(infeasible), Math.abs(feasible), 1e-300);
  let value = findRootBrent(excessAt, infeasible, feasible, { xTolerance: tolerance });
  const direction = Math.sign(feasible - infeasible);
  for (let step = tolerance; excessAt(value) < 0; step *= 2) {
    value += direction * step;
    if ((value - feasible) * direction >= 0) return feasible;
  }
  return value;
}

/**
 * Smallest (power, waist) or largest (range) value meeting the requirement: walk the scan from the
 * wanted end; the first scan point that meets it, or the first local maximum whose refined peak does,
 * closes the bracket for the crossing. Nothing: the best margin found (scan and refined peaks).
 */
function findCrossing(vary: SolveDesignVariable, excessAt: (value: number) => number, lower: number, upper: number): SearchOutcome {
  const grid = scanGrid(vary, lower, upper);
  const excess = grid.map(excessAt);
  const largest = vary === 'rangeM';
  const notes: string[] = [];
  const candidates = new Set(peaksNear(excess, 0));
  for (let k = 0; k < grid.length; k++) {
    const i = largest ? grid.length - 1 - k : k;
    const previous = largest ? i + 1 : i - 1;
    if (excess[i]! >= 0) {
      if (previous < 0 || previous >= grid.length) {
        notes.push(limitNote(vary, largest ? upper : lower));
        return { value: grid[i]!, lower, upper, notes };
      }
      return { value: crossingBetween(excessAt, grid[previous]!, grid[i]!), lower, upper, notes };
    }
    if (candidates.has(i)) {
      const peak = refinePeak(excessAt, grid, excess, i);
      if (peak.excess >= 0) {
        // The peak lies between the neighbours of i, every scan point up to i falls short: bracket
        // the crossing between the peak and the scan point on the near side of it.
        const peakBeyond = largest ? peak.value < grid[i]! : peak.value > grid[i]!;
        const infeasibleEnd = peakBeyond ? grid[i]! : grid[previous]!;
        return { value: crossingBetween(excessAt, infeasibleEnd, peak.value), lower, upper, notes };
      }
    }
  }
  // Not achievable: the best margin over the scan and its refined peaks.
  const best = bestOfScan(excessAt, grid, excess);
  notes.push('No value in the allowed range gives the required margin: the margin shown is the best reached, at the value shown as the best.');
  return { value: best, lower, upper, notes };
}

function bestOfScan(excessAt: (value: number) => number, grid: Float64Array, excess: Float64Array): number {
  let bestValue = grid[0]!;
  let bestExcess = -Infinity;
  for (const i of peaksNear(excess, Math.max(...excess))) {
    const peak = refinePeak(excessAt, grid, excess, i);
    if (peak.excess > bestExcess) {
      bestExcess = peak.excess;
      bestValue = peak.value;
    }
  }
  return bestValue;
}

function limitNote(vary: SolveDesignVariable, limit: number): string {
  switch (vary) {
    case 'powerDbm':
      return `Even the lowest allowed power (${limit} dBm) leaves the required margin.`;
    case 'waistRadiusM':
      return `Even the smallest allowed transmit beam radius (${limit * 1000} mm) leaves the required margin.`;
    default:
      return `The required margin still holds at the longest allowed range (${limit / 1000} km).`;
  }
}

/**
 * Divergence: the maximum of the margin over [θ_d, upper], θ_d = M²λ/(πW0) (below it the beam is
 * collimated and the margin the same). Every local maximum of the scan within 3 dB of the best is
 * refined; the highest wins.
 */
function maximiseMargin(design: LinkDesignInput, excessAt: (value: number) => number, upper: number): SearchOutcome {
  const diffractionRad = evaluateLink(design).diffractionHalfAngleRad;
  const lower = Math.min(diffractionRad, upper);
  const notes: string[] = [];
  if (!(lower < upper)) {
    notes.push(`The diffraction limit of this beam (${(diffractionRad * 1e3).toFixed(3)} mrad) is at or above the largest allowed divergence: the beam is collimated, and the margin the same, for every allowed value.`);
    return { value: upper, lower: upper, upper, notes };
  }
  const grid = scanGrid('halfAngleDivergenceRad', lower, upper);
  const excess = grid.map(excessAt);
  const best = bestOfScan(excessAt, grid, excess);
  const value = excessAt(lower) >= excessAt(best) ? lower : best;
  if (value === lower) {
    notes.push(`The narrowest beam gives the most margin: the diffraction limit M²λ/(πW0) = ${(lower * 1e6).toFixed(1)} µrad (a collimated beam); any smaller datasheet divergence gives the same margin.`);
  }
  return { value, lower, upper, notes };
}

/** The loss term with the largest loss (most negative contribution) in the budget. */
function largestLossTerm(budget: LinkBudget): BudgetTermKey {
  let key: BudgetTermKey = LOSS_TERMS[0]!;
  let worst = Infinity;
  for (const term of budget.terms) {
    if (LOSS_TERMS.includes(term.key) && term.valueDb < worst) {
      worst = term.valueDb;
      key = term.key;
    }
  }
  return key;
}

/** Waist solver: the transmit aperture at the optimum truncation, and what the budget leaves out. */
function addTransmitAperture(result: SolveDesignResult, beamRadiusM: number, budget: LinkBudget, design: LinkDesignInput): void {
  const optimum = optimumTruncation({ obscurationRatio: 0 });
  result.truncationRatio = optimum.apertureToBeamRatio;
  result.transmitApertureDiameterM = 2 * optimum.apertureToBeamRatio * beamRadiusM;
  result.truncationClippingLossDb = optimum.clippingLossDb;
  result.notes.push(
    `Transmit aperture ${(result.transmitApertureDiameterM * 1000).toFixed(1)} mm at the Klein–Degnan optimum a/w = ${optimum.apertureToBeamRatio.toFixed(4)} (collimated far-field beam, unobscured): it clips ${optimum.clippingLossDb.toFixed(3)} dB, which the budget does not charge (include it in the transmit optics loss); a/w ≥ 1.5 (common practice, under 0.05 dB) needs ${(3 * beamRadiusM * 1000).toFixed(1)} mm.`,
  );
  const divergence = design.transmitter.halfAngleDivergenceRad;
  if (divergence !== undefined) {
    // Above this radius the diffraction angle M²λ/(πW0) falls below the datasheet angle (METHODS.md §1.5).
    const cornerM = ((design.transmitter.m2 ?? 1) * design.transmitter.wavelengthM) / (Math.PI * divergence);
    result.notes.push(
      `The design's datasheet divergence (${(divergence * 1e3).toFixed(3)} mrad) sets the spot for beam radii above M²λ/(πθ) = ${(cornerM * 1e3).toFixed(3)} mm: there a larger transmit beam only widens it${budget.beamModel === 'defocused' ? ' (the beam found is one of them)' : ''}. Remove the divergence to size a collimated beam.`,
    );
  }
}
