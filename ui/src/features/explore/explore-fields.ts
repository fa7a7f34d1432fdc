// The design inputs a sweep or a heat map can run along, with the unit each is shown in and a
// sensible default span around the design's own value. The engine works in SI; these are display
// units only (the factor converts a displayed number to the field's SI value).
import { designValueOf, type LinkDesignInput, type VariableDesignField } from '@beamwright/link-core';

export const EXPLORE_FIELD_IDS = [
  'rangeM',
  'atmosphere.visibilityM',
  'transmitter.waistRadiusM',
  'transmitter.halfAngleDivergenceRad',
  'pointing.jitterSigmaPerAxisRad',
  'atmosphere.cn2',
  'transmitter.powerDbm',
  'receiver.apertureDiameterM',
] as const satisfies readonly VariableDesignField[];
export type ExploreFieldId = (typeof EXPLORE_FIELD_IDS)[number];

export interface ExploreField {
  id: ExploreFieldId;
  label: string;
  /** the unit the axis and the inputs show */
  unit: string;
  /** SI value = displayed value × factor */
  factor: number;
  /** log spacing suits quantities that span decades (visibility, Cn², jitter) */
  defaultSpacing: 'linear' | 'log';
  /** default span as multiples of the design's value (or dB either side, for power) */
  span: { below: number; above: number; additive?: boolean };
  /** fallback when the design leaves the field to the engine (e.g. divergence from diffraction) */
  fallbackSi: number;
}

export const EXPLORE_FIELDS: Readonly<Record<ExploreFieldId, ExploreField>> = {
  rangeM: { id: 'rangeM', label: 'Path length', unit: 'km', factor: 1e3, defaultSpacing: 'linear', span: { below: 0.25, above: 2 }, fallbackSi: 1000 },
  'atmosphere.visibilityM': { id: 'atmosphere.visibilityM', label: 'Visibility', unit: 'km', factor: 1e3, defaultSpacing: 'log', span: { below: 0.05, above: 10 }, fallbackSi: 10_000 },
  'transmitter.waistRadiusM': { id: 'transmitter.waistRadiusM', label: 'Transmit beam radius (1/e²)', unit: 'mm', factor: 1e-3, defaultSpacing: 'linear', span: { below: 0.25, above: 3 }, fallbackSi: 0.02 },
  'transmitter.halfAngleDivergenceRad': { id: 'transmitter.halfAngleDivergenceRad', label: 'Divergence (1/e² half-angle)', unit: 'mrad', factor: 1e-3, defaultSpacing: 'log', span: { below: 0.1, above: 5 }, fallbackSi: 0.5e-3 },
  'pointing.jitterSigmaPerAxisRad': { id: 'pointing.jitterSigmaPerAxisRad', label: 'Jitter (rms per axis)', unit: 'µrad', factor: 1e-6, defaultSpacing: 'log', span: { below: 0.1, above: 10 }, fallbackSi: 20e-6 },
  'atmosphere.cn2': { id: 'atmosphere.cn2', label: 'Turbulence strength Cn²', unit: 'm⁻²ᐟ³', factor: 1, defaultSpacing: 'log', span: { below: 0.01, above: 100 }, fallbackSi: 1e-14 },
  'transmitter.powerDbm': { id: 'transmitter.powerDbm', label: 'Transmit power', unit: 'dBm', factor: 1, defaultSpacing: 'linear', span: { below: 10, above: 10, additive: true }, fallbackSi: 10 },
  'receiver.apertureDiameterM': { id: 'receiver.apertureDiameterM', label: 'Receive aperture diameter', unit: 'mm', factor: 1e-3, defaultSpacing: 'linear', span: { below: 0.25, above: 3 }, fallbackSi: 0.1 },
};

/** The design's own value of a field in SI (link-core's designValueOf; the engine's fallback where the design leaves it open). */
export function designValueSi(design: LinkDesignInput, field: ExploreFieldId): number {
  const value = designValueOf(design, field);
  if (value !== undefined && Number.isFinite(value)) return value;
  return field === 'atmosphere.cn2' ? 0 : EXPLORE_FIELDS[field].fallbackSi;
}

/** The default axis for a field, in display units, rounded to three significant figures. */
export function defaultAxisSpan(design: LinkDesignInput, field: ExploreFieldId): { from: number; to: number; spacing: 'linear' | 'log' } {
  const spec = EXPLORE_FIELDS[field];
  let value = designValueSi(design, field);
  if (field === 'atmosphere.cn2' && value <= 0) value = 1e-15;
  const round = (x: number) => Number(x.toPrecision(3));
  if (spec.span.additive) return { from: round(value - spec.span.below), to: round(value + spec.span.above), spacing: spec.defaultSpacing };
  return { from: round((value * spec.span.below) / spec.factor), to: round((value * spec.span.above) / spec.factor), spacing: spec.defaultSpacing };
}
