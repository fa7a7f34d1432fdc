/**
 * Parsing and formatting of physical quantities typed by users ("25 mm", "1.55 µm", "3 km",
 * "0.9 mrad", "17 dBm", "50 mW", "5e-14"). Unit arithmetic is done by mathjs (a minimal instance with
 * units only); dB and dBm, which mathjs does not know, are handled here.
 *
 * This module is published as the subpath `@beamwright/link-core/units` and is never imported by the
 * main entry, so that only screens that parse user input carry mathjs.
 */
import { create, unitDependencies } from 'mathjs';
import { dbmToWatts } from './decibels.js';

const math = create({ unitDependencies });

/** Kinds of quantity a field can hold, each with its SI unit. */
export type QuantityKind =
  | 'length' // m
  | 'angle' // rad
  | 'power' // W (also accepts dBm and dBW)
  | 'decibel' // dB (kept in dB: a ratio in decibels has no SI form)
  | 'time' // s
  | 'frequency' // Hz
  | 'fraction' // dimensionless (accepts %)
  | 'dimensionless' // plain number
  | 'structureConstant'; // Cn² in m^(−2/3)

/** SI (or canonical) unit of each kind, as written in results. */
export const SI_UNIT_BY_KIND: Readonly<Record<QuantityKind, string>> = {
  length: 'm',
  angle: 'rad',
  power: 'W',
  decibel: 'dB',
  time: 's',
  frequency: 'Hz',
  fraction: '',
  dimensionless: '',
  structureConstant: 'm^-2/3',
};

const KIND_LABEL: Readonly<Record<QuantityKind, string>> = {
  length: 'a length (e.g. "25 mm")',
  angle: 'an angle (e.g. "0.9 mrad")',
  power: 'a power (e.g. "50 mW" or "17 dBm")',
  decibel: 'a value in dB (e.g. "3 dB")',
  time: 'a time (e.g. "10 s")',
  frequency: 'a frequency (e.g. "0.5 Hz")',
  fraction: 'a fraction (e.g. "0.001" or "0.1 %")',
  dimensionless: 'a plain number',
  structureConstant: 'a Cn² value in m^-2/3 (e.g. "5e-14")',
};

/** Result of {@link parseQuantity}. */
export type ParsedQuantity =
  | { ok: true; /** Value in the kind's SI unit (dB for 'decibel'). */ valueSi: number; /** The unit as understood ('' for none). */ unit: string }
  | { ok: false; /** Why the text was rejected, to show next to the field. */ reason: string };

/** Options of {@link parseQuantity}. */
export interface ParseQuantityOptions {
  /** Unit applied to a plain number (default: the kind's SI unit), e.g. 'mm' for an aperture field. */
  defaultUnit?: string;
  /** Accept negative values (default false). */
  allowNegative?: boolean;
  /** Accept zero (default true). */
  allowZero?: boolean;
}

const NUMBER_PATTERN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const LEADING_NUMBER = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;

// Spellings users type that mathjs does not read: micro signs, the degree sign, typographic minus.
function normaliseText(text: string): string {
  return text
    .trim()
    .replace(/[\u2212\u2013]/g, '-')
    .replace(/[\u00b5\u03bc]/g, 'u')
    .replace(/°/g, 'deg')
    .replace(/\s+/g, ' ');
}

function dimensionReference(kind: QuantityKind): string | null {
  switch (kind) {
    case 'length':
      return 'm';
    case 'angle':
      return 'rad';
    case 'power':
      return 'W';
    case 'time':
      return 's';
    case 'frequency':
      return 'Hz';
    default:
      return null;
  }
}

function checkSign(value: number, options: ParseQuantityOptions): string | null {
  if (!Number.isFinite(value)) return 'must be a finite number';
  if (value < 0 && !options.allowNegative) return 'must not be negative';
  if (value === 0 && options.allowZero === false) return 'must be greater than zero';
  return null;
}

function withUnit(amount: number, unit: string, kind: QuantityKind): ParsedQuantity {
  const reference = dimensionReference(kind);
  if (reference === null) return { ok: false, reason: `expected ${KIND_LABEL[kind]}` };
  let parsed;
  try {
    parsed = math.unit(amount, unit);
  } catch {
    return { ok: false, reason: `unknown unit "${unit}"` };
  }
  if (!parsed.equalBase(math.unit(reference))) return { ok: false, reason: `"${unit}" is not a unit of ${kind}: expected ${KIND_LABEL[kind]}` };
  // Decimal prefixes are exact powers of ten: dividing by 10^n keeps "0.9 mrad" at 9e-4 exactly,
  // where multiplying by 1e-3 would give 9.000000000000001e-4.
  const factor = math.unit(1, unit).toNumber(reference);
  const inverse = Math.round(1 / factor);
  const valueSi = factor < 1 && Math.abs(inverse * factor - 1) < 1e-12 ? amount / inverse : parsed.toNumber(reference);
  return { ok: true, valueSi, unit: unit.replace(/^u(?=[a-zA-Z])/, 'µ') };
}

/**
 * Parses a user-typed quantity into the SI unit of its kind.
 *
 * Accepted: a number with a unit ("25 mm", "1.55 µm" or "1.55 um", "3 km", "0.9 mrad", "20 µrad",
 * "0.05°", "50 mW", "2 kHz"), dBm/dBW for powers ("17 dBm"), "dB" for decibel fields, "%" for fractions,
 * "m^-2/3" for Cn², and a plain number ("5e-14"), read in `options.defaultUnit` or the SI unit.
 * Rejected with a reason: empty text, decimal commas, unknown units, units of another kind, NaN or
 * infinite values, negative values (unless allowed).
 *
 * @param text the text typed by the user
 * @param kind the kind of quantity the field holds
 * @param options default unit for plain numbers, sign rules
 * @returns `{ ok: true, valueSi, unit }` or `{ ok: false, reason }`
 * @see BIPM, "The International System of Units (SI)", 9th ed. (2019) (units and prefixes);
 *   ITU-R V.574-5 (dB, dBm); mathjs 15 unit parser.
 */
export function parseQuantity(text: string, kind: QuantityKind, options: ParseQuantityOptions = {}): ParsedQuantity {
  if (typeof text !== 'string' || text.trim() === '') return { ok: false, reason: 'is empty' };
  const normalised = normaliseText(text);
  if (/^[+-]?\d+,\d+/.test(normalised)) return { ok: false, reason: 'use a point as the decimal separator (e.g. "1.5")' };
  const match = LEADING_NUMBER.exec(normalised);
  if (!match) {
    if (/^[+-]?(nan|inf|infinity)\b/i.test(normalised)) return { ok: false, reason: 'must be a finite number' };
    return { ok: false, reason: `is not a number: expected ${KIND_LABEL[kind]}` };
  }
  const amount = Number(match[1]);
  const unitText = (match[2] ?? '').trim();
  let result: ParsedQuantity;
  if (unitText === '') {
    const defaultUnit = options.defaultUnit ?? SI_UNIT_BY_KIND[kind];
    if (!NUMBER_PATTERN.test(match[1]!)) return { ok: false, reason: 'is not a number' };
    result = defaultUnit === '' || defaultUnit === SI_UNIT_BY_KIND[kind] ? { ok: true, valueSi: amount, unit: defaultUnit } : parseWithUnit(amount, defaultUnit, kind);
  } else {
    result = parseWithUnit(amount, unitText, kind);
  }
  if (!result.ok) return result;
  // A power in dBm may be negative: the sign rule applies to the linear value only.
  const signProblem = checkSign(result.valueSi, kind === 'decibel' ? { ...options, allowNegative: options.allowNegative ?? true } : options);
  if (signProblem) return { ok: false, reason: signProblem };
  return result;
}

function parseWithUnit(amount: number, unit: string, kind: QuantityKind): ParsedQuantity {
  const compact = unit.replace(/\s+/g, '');
  switch (kind) {
    case 'power':
      if (/^dBm$/i.test(compact)) return { ok: true, valueSi: dbmToWatts(amount), unit: 'dBm' };
      if (/^dBW$/i.test(compact)) return { ok: true, valueSi: Math.pow(10, amount / 10), unit: 'dBW' };
      return withUnit(amount, unit, kind);
    case 'decibel':
      if (/^dB$/i.test(compact)) return { ok: true, valueSi: amount, unit: 'dB' };
      return { ok: false, reason: `expected ${KIND_LABEL[kind]}` };
    case 'fraction':
      if (compact === '%') return { ok: true, valueSi: amount / 100, unit: '%' };
      return { ok: false, reason: `expected ${KIND_LABEL[kind]}` };
    case 'structureConstant':
      if (/^m\^?\(?-2\/3\)?$/.test(compact)) return { ok: true, valueSi: amount, unit: 'm^-2/3' };
      return { ok: false, reason: `expected ${KIND_LABEL[kind]}` };
    case 'dimensionless':
      return { ok: false, reason: `expected ${KIND_LABEL[kind]}` };
    default:
      return withUnit(amount, unit, kind);
  }
}

/** Options of {@link formatQuantity}. */
export interface FormatQuantityOptions {
  /** Display unit (mathjs spelling, or 'dBm'/'dBW' for powers, '%' for fractions); default: chosen by magnitude. */
  unit?: string;
  /** Significant digits (default 4). */
  significantDigits?: number;
}

const AUTO_UNITS: Partial<Record<QuantityKind, ReadonlyArray<readonly [number, string]>>> = {
  length: [[1000, 'km'], [1, 'm'], [1e-3, 'mm'], [1e-6, 'um'], [0, 'nm']],
  angle: [[0.1, 'rad'], [1e-4, 'mrad'], [0, 'urad']],
  power: [[1, 'W'], [1e-3, 'mW'], [1e-6, 'uW'], [0, 'nW']],
  time: [[1, 's'], [1e-3, 'ms'], [0, 'us']],
  frequency: [[1e6, 'MHz'], [1e3, 'kHz'], [0, 'Hz']],
};

function formatNumber(value: number, significantDigits: number): string {
  if (value === 0) return '0';
  const rounded = Number(value.toPrecision(significantDigits));
  const magnitude = Math.abs(rounded);
  return magnitude >= 1e-4 && magnitude < 1e9 ? String(rounded) : rounded.toExponential(significantDigits - 1).replace(/\.?0+e/, 'e');
}

/**
 * Formats an SI value for display with a unit chosen by magnitude (or the given one), using µ for micro.
 *
 * @param valueSi value in the kind's SI unit (W for power, rad for angle, …)
 * @param kind quantity kind
 * @param options display unit and significant digits
 * @returns e.g. "25 mm", "0.9 mrad", "17 dBm", "5e-14 m^-2/3"
 * @see BIPM SI Brochure, 9th ed. (2019), §5.4 (a space between number and unit).
 */
export function formatQuantity(valueSi: number, kind: QuantityKind, options: FormatQuantityOptions = {}): string {
  const digits = options.significantDigits ?? 4;
  if (!Number.isFinite(valueSi)) return String(valueSi);
  const unit = options.unit ?? (AUTO_UNITS[kind]?.find(([threshold]) => Math.abs(valueSi) >= threshold)?.[1] ?? SI_UNIT_BY_KIND[kind]);
  let display: number;
  if (unit === 'dBm') display = 10 * Math.log10(valueSi / 1e-3);
  else if (unit === 'dBW') display = 10 * Math.log10(valueSi);
  else if (unit === '%') display = valueSi * 100;
  else if (unit === '' || unit === SI_UNIT_BY_KIND[kind] || dimensionReference(kind) === null) display = valueSi;
  else display = math.unit(valueSi, dimensionReference(kind)!).toNumber(unit);
  const shownUnit = unit.replace(/^u(?=[a-zA-Z])/, 'µ');
  return shownUnit === '' ? formatNumber(display, digits) : unit === '%' ? `${formatNumber(display, digits)} %` : `${formatNumber(display, digits)} ${shownUnit}`;
}
