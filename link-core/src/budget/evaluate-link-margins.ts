/**
 * The batch margin kernel (METHODS.md §10.8): the link margin of many variations of one design, for
 * sweeps, heat maps and solvers, without building a budget object per point. Struct-of-arrays in
 * (one Float64Array per varied numeric field, the rest from a base design), a Float64Array of
 * margins out, each equal to `evaluateLink(design with that point's values).linkMarginDb`.
 */
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { LinkDesignSchema } from '../schemas/link-design.schema.js';
import { VISIBILITY_2_PERCENT_PER_MOR, VISIBILITY_REFERENCE_WAVELENGTH_M } from '../atmosphere/visibility-attenuation.js';
import { hasEveryRequiredNumber, invalidDesignError, sumOfInputs } from './evaluate-link.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { logMeanAnnularCapture } from '../capture/capture.js';
import { longTermBeamRadiusFastM } from '../turbulence/beam-wave.js';
import { DB_PER_NATURAL_LOG_POWER as DB_PER_NEPER } from '../units/constants.js';
import {
  alNaboulsiNumerator,
  centredGeometricLossDb,
  emptyResolvedDesign,
  evaluateChainInto,
  newChainResult,
  outageAngleRad,
  resolveDesignInto,
  specificAttenuationOfModelDbPerKm,
  type ResolvedDesign,
} from './link-chain.js';

/**
 * The numeric design fields a batch can vary, named by their path in the design (as in the API's
 * field errors). Units as in the design: metres, radians, dBm, dB, m^(−2/3), probabilities.
 */
export const LINK_MARGIN_FIELDS = [
  'rangeM',
  'transmitter.wavelengthM',
  'transmitter.powerDbm',
  'transmitter.waistRadiusM',
  'transmitter.halfAngleDivergenceRad',
  'transmitter.m2',
  'transmitter.opticsLossDb',
  'receiver.apertureDiameterM',
  'receiver.obscurationRatio',
  'receiver.sensitivityDbm',
  'receiver.opticsLossDb',
  'pointing.jitterSigmaPerAxisRad',
  'pointing.staticErrorRad',
  'pointing.outageProbability',
  'atmosphere.visibilityM',
  'atmosphere.cn2',
  'scintillation.probability',
  'systemMarginDb',
] as const;

/** A numeric design field a batch can vary. */
export type LinkMarginField = (typeof LINK_MARGIN_FIELDS)[number];

/**
 * The varied fields of a batch: per field one Float64Array with one value per point, all of the same
 * length. A field left out keeps the base design's value at every point.
 */
export type LinkMarginColumns = Partial<Record<LinkMarginField, Float64Array>>;

const KNOWN_FIELDS: ReadonlySet<string> = new Set(LINK_MARGIN_FIELDS);

/**
 * Link margins of variations of one design (METHODS.md §10.8): margin[i] is the margin evaluateLink
 * gives for the base design with every varied field set to its column's value i (to rounding: the
 * capture and pointing terms are summed in one logarithm, within 1e-12 dB of the budget's terms).
 *
 * The margin splits into a part that depends on the path (range, wavelength, beam, apertures,
 * pointing, Cn², fade probability: the capture, pointing and fade terms) and terms that enter it
 * linearly (power, optics losses, sensitivity, allowance) or through γ(V)·L. The kernel recomputes
 * the path part only where a path field differs from the previous point's, and γ only where the
 * wavelength or visibility does: a sweep of power or visibility, or a heat map whose inner axis is
 * one of them (range outer, visibility inner), computes the expensive part once per row. Designs
 * that differ in every field pay the full chain per point.
 *
 * `transmitter.halfAngleDivergenceRad` 0 means collimated (the field left out of a design).
 * `pointing.outageProbability` switches every point to outage-based pointing. The non-numeric
 * choices (models, visibility definition, whether the fade margin is included) come from the base.
 *
 * @param design the base design (complete: every required field present), as evaluateLink takes it
 * @param columns the varied fields, one Float64Array per field, all of one length (none: one point, the base)
 * @param into optional output array of that length to reuse (sweeps in a worker)
 * @returns margins [dB], one per point (`into` when given)
 * @throws RangeError naming the field when the base lacks a required field, a column is not a
 *   Float64Array of the common length, or a field cannot be varied; naming the point and field when
 *   a point's margin is not finite because that point's design is invalid (as evaluateLink would)
 * @see evaluateLink (METHODS.md §10.1); the terms' sources are in budget-terms.ts.
 */
export function evaluateLinkMargins(design: LinkDesignInput, columns: LinkMarginColumns, into?: Float64Array): Float64Array {
  const base = resolveDesignInto(emptyResolvedDesign(), design);
  if (!hasEveryRequiredNumber(base)) throw invalidDesignError(design, 'evaluateLinkMargins');
  if (!Number.isFinite(sumOfInputs(base)) && !LinkDesignSchema.safeParse(design).success) throw invalidDesignError(design, 'evaluateLinkMargins');
  const count = columnLength(columns);
  if (into !== undefined && (!(into instanceof Float64Array) || into.length !== count)) {
    throw new RangeError(`evaluateLinkMargins: into must be a Float64Array of length ${count} (one margin per point)`);
  }
  // A NaN or an infinity in a column names its point and field before any model sees it
  // (x − x is 0 for a finite x, NaN otherwise: one subtraction and one addition per value).
  for (const field of LINK_MARGIN_FIELDS) {
    const column = columns[field];
    if (column === undefined) continue;
    let finite = 0;
    for (let i = 0; i < count; i++) finite += column[i]! - column[i]!;
    if (finite !== 0) for (let i = 0; i < count; i++) if (!Number.isFinite(column[i]!)) refuseInvalidPoint(design, columns, i);
  }
  const margins = into ?? new Float64Array(count);
  const firstNotFinite = new BatchRun(design, base, columns, count).evaluate(margins);
  if (firstNotFinite >= 0) refuseInvalidPoint(design, columns, firstNotFinite);
  return margins;
}

/** Points per block: the block's columns and intermediate results stay in the processor's caches. */
const BLOCK_SIZE = 512;

// Field indices, in the order of LINK_MARGIN_FIELDS.
const RANGE = 0;
const WAVELENGTH = 1;
const POWER = 2;
const WAIST = 3;
const DIVERGENCE = 4;
const M2 = 5;
const TRANSMIT_OPTICS = 6;
const APERTURE = 7;
const OBSCURATION = 8;
const SENSITIVITY = 9;
const RECEIVE_OPTICS = 10;
const JITTER = 11;
const BIAS = 12;
const OUTAGE_PROBABILITY = 13;
const VISIBILITY = 14;
const CN2 = 15;
const FADE_PROBABILITY = 16;
const SYSTEM_MARGIN = 17;
/** Fields of the path part: the capture, pointing and fade terms depend on these (and not on the others). */
const PATH_FIELDS = [RANGE, WAVELENGTH, WAIST, DIVERGENCE, M2, APERTURE, OBSCURATION, JITTER, BIAS, OUTAGE_PROBABILITY, CN2, FADE_PROBABILITY];
const PATH_FIELD_NAMES: ReadonlySet<string> = new Set(PATH_FIELDS.map((index) => LINK_MARGIN_FIELDS[index]));

/**
 * True for a field of the margin's path part (range, wavelength, beam, apertures, pointing, Cn², fade
 * probability), false for those that enter the margin linearly or through γ(V)·L (power, optics
 * losses, sensitivity, allowance, visibility). A sweep or a grid is cheapest with its path axis outer.
 *
 * @param field a field path
 * @returns whether the kernel recomputes the path part when this field changes
 * @see evaluateLinkMargins
 */
export function isLinkMarginPathField(field: string): boolean {
  return PATH_FIELD_NAMES.has(field);
}

/**
 * One batch, evaluated block by block in stages (beam radii, capture and pointing, fade margin,
 * attenuation and sums): each stage is a loop over the block's arrays around one small function
 * of the engine, which the JIT compiles inline, so the numbers stay unboxed. Points whose path
 * fields equal the previous point's copy its path results.
 */
class BatchRun {
  private readonly columns: (Float64Array | undefined)[];
  /** per field, this block's values: a view of the varied column, or the base value repeated */
  private readonly block: Float64Array[];
  private readonly variedPath: Float64Array[];
  private readonly length: number;
  private readonly blockLength: number;
  /** path results with the previous point's in slot 0 */
  private readonly samePath: Uint8Array;
  private readonly beamRadiusM: Float64Array;
  private readonly longTermBeamRadiusM: Float64Array;
  private readonly captureAndPointingLossDb: Float64Array;
  private readonly fadeMarginDb: Float64Array;
  private readonly work: ResolvedDesign;
  private readonly chain = newChainResult();
  private readonly viaChain: boolean;

  constructor(
    design: LinkDesignInput,
    private readonly base: ResolvedDesign,
    columns: LinkMarginColumns,
    count: number,
  ) {
    this.length = count;
    this.blockLength = Math.min(BLOCK_SIZE, count);
    this.columns = LINK_MARGIN_FIELDS.map((field) => columns[field]);
    const outage = this.columns[OUTAGE_PROBABILITY] !== undefined || !Number.isNaN(base.pointingOutageProbability);
    const baseValues = [
      base.rangeM,
      base.wavelengthM,
      base.powerDbm,
      base.apertureBeamRadiusM,
      base.halfAngleDivergenceRad,
      base.m2,
      base.transmitOpticsLossDb,
      base.apertureDiameterM,
      base.obscurationRatio,
      base.sensitivityDbm,
      base.receiveOpticsLossDb,
      base.jitterSigmaPerAxisRad,
      base.staticErrorRad,
      base.pointingOutageProbability,
      design.atmosphere.visibilityM,
      base.cn2,
      base.fadeProbability,
      base.systemMarginDb,
    ];
    this.block = baseValues.map((value) => new Float64Array(this.blockLength).fill(value));
    this.variedPath = PATH_FIELDS.map((field) => this.columns[field]).filter((column): column is Float64Array => column !== undefined);
    this.samePath = new Uint8Array(this.blockLength);
    this.beamRadiusM = new Float64Array(this.blockLength + 1);
    this.longTermBeamRadiusM = new Float64Array(this.blockLength + 1);
    this.captureAndPointingLossDb = new Float64Array(this.blockLength + 1);
    this.fadeMarginDb = new Float64Array(this.blockLength + 1);
    this.work = resolveDesignInto(emptyResolvedDesign(), design);
    // Mean-loss pointing without the fade margin runs in the stages; the fade margin and the
    // outage quantile (microseconds each) go through the chain point by point.
    this.viaChain = outage || base.includeScintillation;
  }

  /** Writes the margins; returns the first point whose margin is not finite, or −1. */
  evaluate(margins: Float64Array): number {
    let firstNotFinite = -1;
    for (let start = 0; start < this.length; start += this.blockLength) {
      const size = Math.min(this.blockLength, this.length - start);
      // the block's view of each varied column (no copy); the constant ones stay filled with the base value
      for (let field = 0; field < this.columns.length; field++) {
        const column = this.columns[field];
        if (column !== undefined) this.block[field] = column.subarray(start, start + size);
      }
      this.markSamePath(start, size);
      this.beamRadii(size);
      if (this.viaChain) this.pathThroughChain(size);
      else this.meanCapture(size);
      const notFinite = this.sums(start, size, margins);
      if (firstNotFinite < 0 && notFinite >= 0) firstNotFinite = start + notFinite;
      // carry the block's last path results into slot 0 for the next block
      this.beamRadiusM[0] = this.beamRadiusM[size]!;
      this.longTermBeamRadiusM[0] = this.longTermBeamRadiusM[size]!;
      this.captureAndPointingLossDb[0] = this.captureAndPointingLossDb[size]!;
      this.fadeMarginDb[0] = this.fadeMarginDb[size]!;
    }
    return firstNotFinite;
  }

  /** samePath[j]: every varied path field equals the previous point's (never for the first point). */
  private markSamePath(start: number, size: number): void {
    const same = this.samePath;
    const varied = this.variedPath;
    for (let j = 0; j < size; j++) {
      const i = start + j;
      let equal = i > 0;
      for (let k = 0; equal && k < varied.length; k++) equal = varied[k]![i] === varied[k]![i - 1];
      same[j] = equal ? 1 : 0;
    }
  }

  /** Free-space W(L) and the long-term W_LT (the Gaussian-beam model with Cn² > 0; W otherwise). */
  private beamRadii(size: number): void {
    const range = this.block[RANGE]!;
    const wavelength = this.block[WAVELENGTH]!;
    const waist = this.block[WAIST]!;
    const divergence = this.block[DIVERGENCE]!;
    const m2 = this.block[M2]!;
    const cn2 = this.block[CN2]!;
    const same = this.samePath;
    const free = this.beamRadiusM;
    const longTerm = this.longTermBeamRadiusM;
    const gaussianBeam = this.base.gaussianBeam;
    for (let j = 0; j < size; j++) {
      if (same[j] === 1) {
        free[j + 1] = free[j]!;
        longTerm[j + 1] = longTerm[j]!;
        continue;
      }
      const beamRadius = launchBeamRadiusAtRangeM(wavelength[j]!, waist[j]!, divergence[j]!, m2[j]!, range[j]!);
      free[j + 1] = beamRadius;
      longTerm[j + 1] = gaussianBeam && cn2[j]! > 0 ? longTermBeamRadiusFastM(wavelength[j]!, waist[j]!, divergence[j]!, m2[j]!, range[j]!, cn2[j]!, beamRadius) : beamRadius;
    }
  }

  /** Mean-loss pointing: −10·log10 E[C(R; W_LT)], the capture and pointing terms together (link-chain.ts). */
  private meanCapture(size: number): void {
    const range = this.block[RANGE]!;
    const aperture = this.block[APERTURE]!;
    const obscuration = this.block[OBSCURATION]!;
    const jitter = this.block[JITTER]!;
    const bias = this.block[BIAS]!;
    const same = this.samePath;
    const longTerm = this.longTermBeamRadiusM;
    const loss = this.captureAndPointingLossDb;
    const fade = this.fadeMarginDb;
    for (let j = 0; j < size; j++) {
      fade[j + 1] = 0;
      if (same[j] === 1) {
        loss[j + 1] = loss[j]!;
        continue;
      }
      const apertureRadiusM = aperture[j]! / 2;
      const jitterM = jitter[j]! * range[j]!;
      const biasM = bias[j]! * range[j]!;
      // as the chain sums them (link-chain.ts): the centred loss where there is no pointing error at all
      loss[j + 1] =
        jitterM === 0 && biasM === 0
          ? centredGeometricLossDb(longTerm[j + 1]!, apertureRadiusM, apertureRadiusM * obscuration[j]!)
          : -DB_PER_NEPER * logMeanAnnularCapture(longTerm[j + 1]!, apertureRadiusM, apertureRadiusM * obscuration[j]!, jitterM, biasM);
    }
  }

  /** Outage pointing or the fade margin: the chain at detail 'margin', point by point. */
  private pathThroughChain(size: number): void {
    const block = this.block;
    const work = this.work;
    const outage = !Number.isNaN(work.pointingOutageProbability) || this.columns[OUTAGE_PROBABILITY] !== undefined;
    const same = this.samePath;
    const loss = this.captureAndPointingLossDb;
    const fade = this.fadeMarginDb;
    for (let j = 0; j < size; j++) {
      if (same[j] === 1) {
        loss[j + 1] = loss[j]!;
        fade[j + 1] = fade[j]!;
        continue;
      }
      const pointingChanged =
        block[JITTER]![j] !== work.jitterSigmaPerAxisRad || block[BIAS]![j] !== work.staticErrorRad || block[OUTAGE_PROBABILITY]![j] !== work.pointingOutageProbability;
      work.rangeM = block[RANGE]![j]!;
      if (block[WAVELENGTH]![j] !== work.wavelengthM) {
        work.wavelengthM = block[WAVELENGTH]![j]!;
        work.logWavelengthRatio = Math.log(work.wavelengthM / VISIBILITY_REFERENCE_WAVELENGTH_M);
      }
      work.apertureBeamRadiusM = block[WAIST]![j]!;
      work.halfAngleDivergenceRad = block[DIVERGENCE]![j]!;
      work.m2 = block[M2]![j]!;
      work.apertureDiameterM = block[APERTURE]![j]!;
      work.obscurationRatio = block[OBSCURATION]![j]!;
      work.jitterSigmaPerAxisRad = block[JITTER]![j]!;
      work.staticErrorRad = block[BIAS]![j]!;
      work.pointingOutageProbability = block[OUTAGE_PROBABILITY]![j]!;
      // the outage angle is range-free: solved again only when bias, jitter or probability change
      if (outage && (pointingChanged || Number.isNaN(work.pointingOutageAngleRad))) {
        work.pointingOutageAngleRad = outageAngleRad(work.jitterSigmaPerAxisRad, work.staticErrorRad, work.pointingOutageProbability);
      }
      work.cn2 = block[CN2]![j]!;
      work.fadeProbability = block[FADE_PROBABILITY]![j]!;
      evaluateChainInto(this.chain, work, work.rangeM, 0, work.includeScintillation, 'margin');
      loss[j + 1] = this.chain.captureAndPointingLossDb;
      fade[j + 1] = this.chain.scintillationFadeMarginDb;
    }
  }

  /** γ(V)·L and the margin, in the chain's order of the sums (link-chain.ts, detail 'margin'); the first j whose margin is not finite, or −1. */
  private sums(start: number, size: number, margins: Float64Array): number {
    let notFinite = -1;
    const block = this.block;
    const range = block[RANGE]!;
    const wavelength = block[WAVELENGTH]!;
    const power = block[POWER]!;
    const transmitOptics = block[TRANSMIT_OPTICS]!;
    const sensitivity = block[SENSITIVITY]!;
    const receiveOptics = block[RECEIVE_OPTICS]!;
    const visibility = block[VISIBILITY]!;
    const systemMargin = block[SYSTEM_MARGIN]!;
    const loss = this.captureAndPointingLossDb;
    const fade = this.fadeMarginDb;
    const base = this.base;
    const wavelengthVaries = this.columns[WAVELENGTH] !== undefined;
    const fog = base.fogNumeratorPerKm > 0;
    const mor = base.morInput;
    for (let j = 0; j < size; j++) {
      // as resolveDesignInto converts them (MOR to the 2 % visibility; the model's wavelength terms)
      const visibility2PercentKm = (mor ? visibility[j]! * VISIBILITY_2_PERCENT_PER_MOR : visibility[j]!) / 1000;
      const logWavelengthRatio = wavelengthVaries ? Math.log(wavelength[j]! / VISIBILITY_REFERENCE_WAVELENGTH_M) : base.logWavelengthRatio;
      const fogNumeratorPerKm = fog ? (wavelengthVaries ? alNaboulsiNumerator(base.atmosphereModel, wavelength[j]!) : base.fogNumeratorPerKm) : 0;
      const atmosphericLossDb = (specificAttenuationOfModelDbPerKm(fogNumeratorPerKm, base.kruse, logWavelengthRatio, visibility2PercentKm) * range[j]!) / 1000;
      const receivedPowerDbm = power[j]! - transmitOptics[j]! - loss[j + 1]! - atmosphericLossDb - receiveOptics[j]!;
      const margin = receivedPowerDbm - sensitivity[j]! - fade[j + 1]! - systemMargin[j]!;
      margins[start + j] = margin;
      if (margin - margin !== 0 && notFinite < 0) notFinite = j;
    }
    return notFinite;
  }
}

/** The common length of the columns (1 without columns), after checking each of them. */
function columnLength(columns: LinkMarginColumns): number {
  let count = -1;
  for (const field of Object.keys(columns)) {
    const column = (columns as Record<string, unknown>)[field];
    if (column === undefined) continue;
    if (!KNOWN_FIELDS.has(field)) throw new RangeError(`evaluateLinkMargins: ${field}: not a numeric design field a batch can vary (see LINK_MARGIN_FIELDS)`);
    if (!(column instanceof Float64Array)) throw new RangeError(`evaluateLinkMargins: ${field}: must be a Float64Array (one value per point)`);
    if (count === -1) count = column.length;
    else if (column.length !== count) throw new RangeError(`evaluateLinkMargins: ${field}: has ${column.length} values where the other columns have ${count}`);
  }
  return count === -1 ? 1 : count;
}

/**
 * A point whose margin is not finite: when its design is invalid, the error names the point and the
 * field (as evaluateLink does for one design); otherwise the margin stands as computed.
 */
function refuseInvalidPoint(design: LinkDesignInput, columns: LinkMarginColumns, index: number): void {
  const point = designAtPoint(design, columns, index);
  if (!LinkDesignSchema.safeParse(point).success) throw invalidDesignError(point, `evaluateLinkMargins: point ${index}`);
}

/**
 * The design of one point of a batch as a plain design object (for error messages and tests).
 *
 * @param design the base design
 * @param columns the varied fields
 * @param index the point, 0 … length − 1
 * @returns a new design with that point's values; `transmitter.halfAngleDivergenceRad` 0 is left out (collimated)
 * @see evaluateLinkMargins
 */
export function linkMarginPointDesign(design: LinkDesignInput, columns: LinkMarginColumns, index: number): LinkDesignInput {
  return designAtPoint(design, columns, index);
}

function designAtPoint(design: LinkDesignInput, columns: LinkMarginColumns, index: number): LinkDesignInput {
  const point = structuredClone(design) as unknown as Record<string, Record<string, unknown> | unknown>;
  for (const field of LINK_MARGIN_FIELDS) {
    const column = columns[field];
    if (column === undefined) continue;
    const value = column[index];
    const [group, name] = field.includes('.') ? field.split('.') : [undefined, field];
    if (group === undefined) {
      point[name!] = value;
    } else {
      const target = ((point[group] as Record<string, unknown> | undefined) ?? (point[group] = {})) as Record<string, unknown>;
      if (field === 'transmitter.halfAngleDivergenceRad' && value === 0) delete target[name!];
      else target[name!] = value;
    }
  }
  return point as unknown as LinkDesignInput;
}
