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
import {
  alNaboulsiNumerator,
  emptyResolvedDesign,
  evaluateChainInto,
  newChainResult,
  outageAngleRad,
  resolveDesignInto,
  specificAttenuationDbPerKm,
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
  const count = columnLength(columns);
  if (into !== undefined && (!(into instanceof Float64Array) || into.length !== count)) {
    throw new RangeError(`evaluateLinkMargins: into must be a Float64Array of length ${count} (one margin per point)`);
  }
  const margins = into ?? new Float64Array(count);

  const range = columns.rangeM;
  const wavelength = columns['transmitter.wavelengthM'];
  const power = columns['transmitter.powerDbm'];
  const waist = columns['transmitter.waistRadiusM'];
  const divergence = columns['transmitter.halfAngleDivergenceRad'];
  const m2 = columns['transmitter.m2'];
  const transmitOptics = columns['transmitter.opticsLossDb'];
  const aperture = columns['receiver.apertureDiameterM'];
  const obscuration = columns['receiver.obscurationRatio'];
  const sensitivity = columns['receiver.sensitivityDbm'];
  const receiveOptics = columns['receiver.opticsLossDb'];
  const jitter = columns['pointing.jitterSigmaPerAxisRad'];
  const bias = columns['pointing.staticErrorRad'];
  const outageProbability = columns['pointing.outageProbability'];
  const visibility = columns['atmosphere.visibilityM'];
  const cn2 = columns['atmosphere.cn2'];
  const fadeProbability = columns['scintillation.probability'];
  const systemMargin = columns.systemMarginDb;
  const outageMode = outageProbability !== undefined || !Number.isNaN(base.pointingOutageProbability);
  const fogModel = base.fogNumeratorPerKm > 0;

  if (!Number.isFinite(sumOfInputs(base)) && !LinkDesignSchema.safeParse(design).success) throw invalidDesignError(design, 'evaluateLinkMargins');
  // A NaN or an infinity in a column names its point and field before any model sees it.
  for (const field of LINK_MARGIN_FIELDS) {
    const column = columns[field];
    if (column === undefined) continue;
    for (let i = 0; i < count; i++) if (!Number.isFinite(column[i]!)) refuseInvalidPoint(design, columns, i);
  }
  const work = resolveDesignInto(emptyResolvedDesign(), design);
  const chain = newChainResult();
  let captureAndPointingLossDb = Number.NaN;
  let fadeMarginDb = Number.NaN;
  let attenuationDbPerKm = Number.NaN;
  for (let i = 0; i < count; i++) {
    // Set this point's values; note whether the path part or γ must be recomputed.
    let pathChanged = i === 0;
    let attenuationChanged = i === 0;
    if (range !== undefined && range[i] !== work.rangeM) {
      work.rangeM = range[i]!;
      pathChanged = true;
    }
    if (wavelength !== undefined && wavelength[i] !== work.wavelengthM) {
      work.wavelengthM = wavelength[i]!;
      work.logWavelengthRatio = Math.log(work.wavelengthM / VISIBILITY_REFERENCE_WAVELENGTH_M);
      if (fogModel) work.fogNumeratorPerKm = alNaboulsiNumerator(work.atmosphereModel, work.wavelengthM);
      pathChanged = true;
      attenuationChanged = true;
    }
    if (waist !== undefined && waist[i] !== work.apertureBeamRadiusM) {
      work.apertureBeamRadiusM = waist[i]!;
      pathChanged = true;
    }
    if (divergence !== undefined && divergence[i] !== work.halfAngleDivergenceRad) {
      work.halfAngleDivergenceRad = divergence[i]!;
      pathChanged = true;
    }
    if (m2 !== undefined && m2[i] !== work.m2) {
      work.m2 = m2[i]!;
      pathChanged = true;
    }
    if (aperture !== undefined && aperture[i] !== work.apertureDiameterM) {
      work.apertureDiameterM = aperture[i]!;
      pathChanged = true;
    }
    if (obscuration !== undefined && obscuration[i] !== work.obscurationRatio) {
      work.obscurationRatio = obscuration[i]!;
      pathChanged = true;
    }
    let pointingChanged = false;
    if (jitter !== undefined && jitter[i] !== work.jitterSigmaPerAxisRad) {
      work.jitterSigmaPerAxisRad = jitter[i]!;
      pointingChanged = true;
    }
    if (bias !== undefined && bias[i] !== work.staticErrorRad) {
      work.staticErrorRad = bias[i]!;
      pointingChanged = true;
    }
    if (outageProbability !== undefined && outageProbability[i] !== work.pointingOutageProbability) {
      work.pointingOutageProbability = outageProbability[i]!;
      pointingChanged = true;
    }
    if (pointingChanged || (i === 0 && outageMode)) {
      // the outage angle is range-free, solved once per distinct bias, jitter and probability
      if (outageMode) work.pointingOutageAngleRad = outageAngleRad(work.jitterSigmaPerAxisRad, work.staticErrorRad, work.pointingOutageProbability);
      pathChanged = true;
    }
    if (cn2 !== undefined && cn2[i] !== work.cn2) {
      work.cn2 = cn2[i]!;
      pathChanged = true;
    }
    if (fadeProbability !== undefined && fadeProbability[i] !== work.fadeProbability) {
      work.fadeProbability = fadeProbability[i]!;
      pathChanged = true;
    }
    if (visibility !== undefined) {
      // as resolveDesignInto converts it (MOR to the 2 % visibility first)
      const visibility2PercentKm = (base.morInput ? visibility[i]! * VISIBILITY_2_PERCENT_PER_MOR : visibility[i]!) / 1000;
      if (visibility2PercentKm !== work.visibility2PercentKm) {
        work.visibility2PercentKm = visibility2PercentKm;
        attenuationChanged = true;
      }
    }
    if (power !== undefined) work.powerDbm = power[i]!;
    if (transmitOptics !== undefined) work.transmitOpticsLossDb = transmitOptics[i]!;
    if (receiveOptics !== undefined) work.receiveOpticsLossDb = receiveOptics[i]!;
    if (sensitivity !== undefined) work.sensitivityDbm = sensitivity[i]!;
    if (systemMargin !== undefined) work.systemMarginDb = systemMargin[i]!;

    if (pathChanged) {
      evaluateChainInto(chain, work, work.rangeM, 0, work.includeScintillation, 'margin');
      captureAndPointingLossDb = chain.captureAndPointingLossDb;
      fadeMarginDb = chain.scintillationFadeMarginDb;
    }
    if (attenuationChanged) attenuationDbPerKm = specificAttenuationDbPerKm(work, work.visibility2PercentKm);
    // the chain's own sums, in its order (link-chain.ts, detail 'margin')
    const atmosphericLossDb = (attenuationDbPerKm * work.rangeM) / 1000;
    const receivedPowerDbm = work.powerDbm - work.transmitOpticsLossDb - captureAndPointingLossDb - atmosphericLossDb - work.receiveOpticsLossDb;
    const margin = receivedPowerDbm - work.sensitivityDbm - fadeMarginDb - work.systemMarginDb;
    if (!Number.isFinite(margin)) refuseInvalidPoint(design, columns, i);
    margins[i] = margin;
  }
  return margins;
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
