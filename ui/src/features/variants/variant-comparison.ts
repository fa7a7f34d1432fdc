// The side-by-side comparison of a design and its alternatives: every budget term, the margin,
// the maximum range at the required margin, the fade margin, the indicative eye-safety class and
// the NOHD, each computed with link-core for each design. Pure; the table only lays it out.
import { assessEyeSafety, evaluateLink, eyeSafetyInputOf, maxRange, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';

export interface ComparedDesign {
  name: string;
  design: LinkDesignInput;
}

/** Which way a row is better: a larger margin, a smaller NOHD… (null: a plain input, no "best"). */
export type Preference = 'higher' | 'lower' | null;

export interface ComparisonRow {
  key: string;
  label: string;
  unit: string;
  group: 'inputs' | 'budget' | 'results' | 'eye safety';
  /** one value per design, primary first; a number in `unit`, a word, or null when not computed */
  values: (number | string | null)[];
  preference: Preference;
  /** columns holding the best value of the row (ties all marked); empty without a preference */
  best: number[];
  /** columns whose value differs from the primary's (column 0) */
  differs: boolean[];
}

const CLASS_ORDER = ['1', '1M', '3R', '3B', '4'];

/** Numbers closer than this count as equal (a rounding step of the table, in the row's unit). */
const SAME_WITHIN = 0.005;

function bestColumns(values: (number | string | null)[], preference: Preference, rank?: (value: string) => number): number[] {
  if (!preference) return [];
  const scores = values.map((value) => (typeof value === 'number' ? value : typeof value === 'string' && rank ? rank(value) : null));
  const finite = scores.filter((score): score is number => score !== null && Number.isFinite(score));
  if (finite.length < 2) return [];
  // a row where every design gives the same value has no best
  if (Math.max(...finite) - Math.min(...finite) <= SAME_WITHIN) return [];
  const target = preference === 'higher' ? Math.max(...finite) : Math.min(...finite);
  return scores.flatMap((score, index) => (score !== null && Math.abs(score - target) <= SAME_WITHIN ? [index] : []));
}

function differsFromPrimary(values: (number | string | null)[]): boolean[] {
  const [primary] = values;
  return values.map((value, index) => {
    if (index === 0) return false;
    if (typeof value === 'number' && typeof primary === 'number') return Math.abs(value - primary) > SAME_WITHIN;
    return value !== primary;
  });
}

interface Evaluated {
  budget: LinkBudget | null;
  maxRangeKm: number | string | null;
  eyeClass: string | null;
  nohdM: number | null;
}

function evaluate(design: LinkDesignInput, requiredMarginDb: number): Evaluated {
  let budget: LinkBudget;
  try {
    budget = evaluateLink(design);
  } catch {
    return { budget: null, maxRangeKm: null, eyeClass: null, nohdM: null };
  }
  let maxRangeKm: number | string | null;
  try {
    const found = maxRange(design, requiredMarginDb);
    maxRangeKm = found.status === 'found' && found.rangeM !== null ? found.rangeM / 1000 : found.status === 'not-achievable' ? 'not reached' : 'beyond 50 km';
  } catch {
    maxRangeKm = null;
  }
  let eyeClass: string | null = null;
  let nohdM: number | null = null;
  try {
    const safety = assessEyeSafety(eyeSafetyInputOf(design, budget));
    eyeClass = safety.indicativeClass;
    nohdM = safety.nohdUnaidedM;
  } catch {
    // outside the wavelengths the limits cover: the cell says "not assessed"
  }
  return { budget, maxRangeKm, eyeClass, nohdM };
}

export function compareDesigns(designs: readonly ComparedDesign[], requiredMarginDb: number): ComparisonRow[] {
  const evaluated = designs.map(({ design }) => evaluate(design, requiredMarginDb));
  const rows: ComparisonRow[] = [];
  const push = (row: Omit<ComparisonRow, 'best' | 'differs'>, rank?: (value: string) => number) =>
    rows.push({ ...row, best: bestColumns(row.values, row.preference, rank), differs: differsFromPrimary(row.values) });

  push({ key: 'wavelength', label: 'Wavelength', unit: 'nm', group: 'inputs', preference: null, values: designs.map(({ design }) => design.transmitter.wavelengthM * 1e9) });
  push({ key: 'power', label: 'Transmit power', unit: 'dBm', group: 'inputs', preference: null, values: designs.map(({ design }) => design.transmitter.powerDbm) });
  push({ key: 'waist', label: 'Transmit beam radius (1/e²)', unit: 'mm', group: 'inputs', preference: null, values: designs.map(({ design }) => design.transmitter.waistRadiusM * 1e3) });
  push({
    key: 'divergence',
    label: 'Divergence (half-angle, as used)',
    unit: 'mrad',
    group: 'inputs',
    preference: null,
    values: evaluated.map(({ budget }) => (budget ? budget.halfAngleDivergenceRad * 1e3 : null)),
  });
  push({ key: 'aperture', label: 'Receive aperture', unit: 'mm', group: 'inputs', preference: null, values: designs.map(({ design }) => design.receiver.apertureDiameterM * 1e3) });
  push({ key: 'range', label: 'Path length', unit: 'km', group: 'inputs', preference: null, values: designs.map(({ design }) => design.rangeM / 1000) });

  // every term any of the budgets carries, in the ledger's order
  const termKeys: string[] = [];
  const termLabels = new Map<string, string>();
  for (const { budget } of evaluated) {
    for (const term of budget?.terms ?? []) {
      if (!termLabels.has(term.key)) {
        termKeys.push(term.key);
        termLabels.set(term.key, term.label);
      }
    }
  }
  for (const key of termKeys) {
    push({
      key: `term.${key}`,
      label: termLabels.get(key)!,
      unit: key === 'transmitPower' ? 'dBm' : 'dB',
      group: 'budget',
      // a loss is negative in the ledger: the larger value is the smaller loss
      preference: 'higher',
      values: evaluated.map(({ budget }) => budget?.terms.find((term) => term.key === key)?.valueDb ?? (budget ? 0 : null)),
    });
  }
  push({ key: 'received', label: 'Received power', unit: 'dBm', group: 'results', preference: 'higher', values: evaluated.map(({ budget }) => budget?.receivedPowerDbm ?? null) });
  push({ key: 'fade', label: 'Fade margin (scintillation)', unit: 'dB', group: 'results', preference: 'lower', values: evaluated.map(({ budget }) => budget?.scintillationFadeMarginDb ?? null) });
  push({ key: 'margin', label: 'Link margin', unit: 'dB', group: 'results', preference: 'higher', values: evaluated.map(({ budget }) => budget?.linkMarginDb ?? null) });
  push({
    key: 'maxRange',
    label: `Maximum range at ${requiredMarginDb} dB`,
    unit: 'km',
    group: 'results',
    preference: 'higher',
    values: evaluated.map(({ maxRangeKm }) => maxRangeKm),
  }, (value) => (value === 'beyond 50 km' ? 1e9 : -1e9));
  push(
    { key: 'class', label: 'Indicative laser class', unit: '', group: 'eye safety', preference: 'lower', values: evaluated.map(({ eyeClass }) => eyeClass ?? 'not assessed') },
    (value) => {
      const index = CLASS_ORDER.indexOf(value);
      return index < 0 ? Number.NaN : index;
    },
  );
  push({ key: 'nohd', label: 'NOHD, naked eye', unit: 'm', group: 'eye safety', preference: 'lower', values: evaluated.map(({ nohdM }) => nohdM) });
  return rows;
}
