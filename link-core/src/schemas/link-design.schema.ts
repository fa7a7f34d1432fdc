/**
 * The link design: everything the budget of METHODS.md §10.1 needs, in SI units (metres, radians), with
 * powers in dBm and losses in dB named as such. The UI's form, the API's validation pipe and the
 * stored revisions all use this one schema.
 *
 * Unknown keys are rejected at every level (`z.strictObject`): a typo such as `wavelenghtM` must
 * fail loudly with its path rather than silently fall back to a default.
 */
import { z } from 'zod';
import { boundedNumber, boundedProbability, lossDb, probabilityMessage, REQUIRED_MESSAGE } from './fields.js';

/** Defaults applied when a field is absent; evaluateLink applies the same values with `??`. */
export const LINK_DESIGN_DEFAULTS = {
  /** embedded-Gaussian beam quality, ISO 11146-1; 1 = ideal TEM00 */
  m2: 1,
  /** central obscuration of the receive aperture as a diameter ratio; 0 = unobscured */
  obscurationRatio: 0,
  /** Kim et al. 2001 is the preferred visibility model (METHODS.md §5.2–5.3) */
  atmosphereModel: 'kim',
  /** Kim and Kruse are defined on the 2 % contrast visibility (METHODS.md §5.1) */
  visibilityDefinition: 'contrast-2-percent',
  /** the scintillation fade margin is part of the budget unless switched off */
  scintillationInclude: true,
  /** fade probability 1e-3: METHODS.md §6.9 [common practice] */
  scintillationProbability: 1e-3,
  /**
   * turbulence of the launched Gaussian beam (long-term spread, beam-wave scintillation); a stored
   * design without the field was computed with the spherical wave and is read as such (versioned read)
   */
  turbulenceModel: 'gaussian-beam',
  /** no ageing/dirt allowance unless the engineer sets one (1–3 dB is common practice, METHODS.md §10.1) */
  systemMarginDb: 0,
} as const;

/**
 * Where each probability of a design means something. Both laws are fitted to the body of measured
 * statistics: below 1e-9 (about 0.03 s a year) the fade or pointing tail is an extrapolation no
 * measurement supports, and the engine's numbers there would only look precise; above 0.5 the
 * value is no longer a rare event to hold margin against (common practice: FSO designs use
 * 1e-2 … 1e-6). The engine itself stays finite far beyond these bounds (fade-tail.test.ts).
 */
export const PROBABILITY_BOUNDS = {
  fade: {
    min: 1e-9,
    max: 0.5,
    reason: 'below 1e-9 (about 0.03 s a year) the gamma-gamma tail is far beyond the fade statistics the model was fitted to, and above 0.5 it is no longer a fade',
  },
  pointingOutage: {
    min: 1e-9,
    max: 0.5,
    reason: 'below 1e-9 (about 0.03 s a year) the Gaussian jitter tail says nothing about a real mount, and above 0.5 the loss is no longer an outage allowance',
  },
} as const;

export const FADE_PROBABILITY_MESSAGE = probabilityMessage(PROBABILITY_BOUNDS.fade);
export const POINTING_OUTAGE_PROBABILITY_MESSAGE = probabilityMessage(PROBABILITY_BOUNDS.pointingOutage);

/**
 * Visibility-to-attenuation models available to the budget: Kim (default) and Kruse for haze and
 * fog (METHODS.md §5.2–5.3), and Al Naboulsi's fog models by fog type, stated for 50 m–1 km visibility
 * and 0.69–1.55 µm (METHODS.md §5.4).
 */
export const ATMOSPHERE_MODELS = ['kim', 'kruse', 'al-naboulsi-advection', 'al-naboulsi-radiation'] as const;
export type AtmosphereModel = (typeof ATMOSPHERE_MODELS)[number];

/** Turbulence models of the budget (see AtmosphereSchema.turbulenceModel). */
export const TURBULENCE_MODELS = ['gaussian-beam', 'spherical-wave'] as const;
export type TurbulenceModel = (typeof TURBULENCE_MODELS)[number];

/**
 * Which contrast threshold the visibility figure uses: 2 % (classical, what Kim and Kruse assume)
 * or 5 % (WMO meteorological optical range, what airport sensors and METAR/SYNOP report).
 */
export const VISIBILITY_DEFINITIONS = ['contrast-2-percent', 'mor-5-percent'] as const;
export type VisibilityDefinition = (typeof VISIBILITY_DEFINITIONS)[number];

function section<Shape extends z.core.$ZodLooseShape>(shape: Shape) {
  return z.strictObject(shape, {
    error: (issue) =>
      issue.code === 'invalid_type' ? (issue.input === undefined ? REQUIRED_MESSAGE : 'must be an object') : undefined,
  });
}

export const TransmitterSchema = section({
  /** vacuum wavelength [m]; FSO terminals use 785, 850, 1310 or 1550 nm */
  wavelengthM: boundedNumber({ atLeast: 200e-9, atMost: 20e-6, unitNote: { lower: '200 nm', upper: '20 µm' } }),
  /** average optical output power [dBm] (−40 dBm = 0.1 µW … 50 dBm = 100 W) */
  powerDbm: boundedNumber({ atLeast: -40, atMost: 50, unitNote: { lower: '−40 dBm', upper: '50 dBm (100 W)' } }),
  /** 1/e² beam radius at the transmit aperture [m] (W0 of METHODS.md §1.4) */
  waistRadiusM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1e-4, text: '0.1 mm' }, atMost: 1, unitNote: { upper: '1 m' } }),
  /**
   * measured far-field half-angle divergence, 1/e² [rad]. When it exceeds the diffraction limit
   * M²λ/(πW0) the beam is the defocused launch of METHODS.md §1.5; otherwise it is collimated.
   */
  halfAngleDivergenceRad: boundedNumber({ greaterThan: 0, atMost: 0.1, unitNote: { upper: '0.1 rad (100 mrad)' } }).optional(),
  /** beam propagation ratio M² ≥ 1 (ISO 11146-1) */
  m2: boundedNumber({ atLeast: 1, atMost: 100 }).default(LINK_DESIGN_DEFAULTS.m2),
  /** transmit optics and window loss [dB] */
  opticsLossDb: lossDb(30),
});

export const ReceiverSchema = section({
  /** clear receive aperture diameter [m] */
  apertureDiameterM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1e-3, text: '1 mm' }, atMost: 2, unitNote: { upper: '2 m' } }),
  /** minimum mean optical power for the target BER at the receiver's reference plane [dBm] */
  sensitivityDbm: boundedNumber({ atLeast: -90, atMost: 20, unitNote: { lower: '−90 dBm', upper: '20 dBm' } }),
  /** receive optics and window loss [dB] */
  opticsLossDb: lossDb(30),
  /** maximum mean optical power before the receiver saturates [dBm]; must exceed the sensitivity */
  overloadDbm: boundedNumber({ atLeast: -90, atMost: 40, unitNote: { lower: '−90 dBm', upper: '40 dBm' } }).optional(),
  /** central obscuration as a ratio of diameters, in [0, 1) */
  obscurationRatio: boundedNumber({ atLeast: 0, lessThan: 1 }).default(LINK_DESIGN_DEFAULTS.obscurationRatio),
  /** receiver half-angle field of view [rad] (METHODS.md §3.5) */
  fieldOfViewRad: boundedNumber({ greaterThan: 0, atMost: 0.5, unitNote: { upper: '0.5 rad' } }).optional(),
}).refine((receiver) => receiver.overloadDbm === undefined || receiver.overloadDbm > receiver.sensitivityDbm, {
  message: 'must be greater than the sensitivity',
  path: ['overloadDbm'],
});

export const PointingSchema = section({
  /** zero-mean Gaussian jitter, standard deviation per axis [rad] (METHODS.md §4.1) */
  jitterSigmaPerAxisRad: boundedNumber({ atLeast: 0, atMost: 0.1, unitNote: { upper: '0.1 rad' } }),
  /** fixed pointing bias [rad] */
  staticErrorRad: boundedNumber({ atLeast: 0, atMost: 0.1, unitNote: { upper: '0.1 rad' } }),
  /**
   * outage-based design (METHODS.md §4.2, §10.1): budget the pointing loss that is exceeded only with this
   * probability (1e-9 … 0.5, PROBABILITY_BOUNDS.pointingOutage) instead of the mean loss. Absent: mean loss.
   */
  outageProbability: boundedProbability(PROBABILITY_BOUNDS.pointingOutage).optional(),
});

export const AtmosphereSchema = section({
  model: z.enum(ATMOSPHERE_MODELS, { error: `must be one of ${ATMOSPHERE_MODELS.join(', ')}` }).default(LINK_DESIGN_DEFAULTS.atmosphereModel),
  /** visibility [m], in the definition given by visibilityDefinition */
  visibilityM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1, text: '1 m' }, atMost: 1e6, unitNote: { upper: '1000 km' } }),
  visibilityDefinition: z
    .enum(VISIBILITY_DEFINITIONS, { error: `must be one of ${VISIBILITY_DEFINITIONS.join(', ')}` })
    .default(LINK_DESIGN_DEFAULTS.visibilityDefinition),
  /** refractive-index structure parameter Cn² [m^(−2/3)], uniform along the path; 0 = no turbulence */
  cn2: boundedNumber({ atLeast: 0, atMost: 1e-10, unitNote: { lower: '0 m^(−2/3)', upper: '1e-10 m^(−2/3)' } }),
  /**
   * 'gaussian-beam' (the launched beam: long-term spread with wander, beam-wave scintillation) or
   * 'spherical-wave' (the earlier model: no spread, spherical-wave scintillation). Absent means
   * 'gaussian-beam' (LINK_DESIGN_DEFAULTS); no schema default, so a stored design keeps its absence
   * and the api can read it as the model it was computed with.
   */
  turbulenceModel: z.enum(TURBULENCE_MODELS, { error: `must be one of ${TURBULENCE_MODELS.join(', ')}` }).optional(),
});

export const ScintillationSchema = section({
  /** subtract the gamma-gamma fade margin (spherical wave, aperture averaged, METHODS.md §6.6–6.9) */
  include: z.boolean({ error: 'must be true or false' }).default(LINK_DESIGN_DEFAULTS.scintillationInclude),
  /** probability that the irradiance falls below the margin's threshold, 1e-9 … 0.5 (PROBABILITY_BOUNDS.fade) */
  probability: boundedProbability(PROBABILITY_BOUNDS.fade).default(LINK_DESIGN_DEFAULTS.scintillationProbability),
});

export const LinkDesignSchema = section({
  /** path length between the terminals [m] */
  rangeM: boundedNumber({ greaterThan: 0, practicalMinimum: { value: 1, text: '1 m' }, atMost: 100_000, unitNote: { upper: '100 km' } }),
  transmitter: TransmitterSchema,
  receiver: ReceiverSchema,
  pointing: PointingSchema,
  atmosphere: AtmosphereSchema,
  scintillation: ScintillationSchema.default({
    include: LINK_DESIGN_DEFAULTS.scintillationInclude,
    probability: LINK_DESIGN_DEFAULTS.scintillationProbability,
  }),
  /** ageing, window dirt and other allowances subtracted from the margin [dB] */
  systemMarginDb: lossDb(60).default(LINK_DESIGN_DEFAULTS.systemMarginDb),
});

/** A validated design, defaults applied. */
export type LinkDesign = z.output<typeof LinkDesignSchema>;
/** A design as a user or client sends it: fields with defaults may be absent. */
export type LinkDesignInput = z.input<typeof LinkDesignSchema>;
export type TransmitterDesign = z.output<typeof TransmitterSchema>;
export type ReceiverDesign = z.output<typeof ReceiverSchema>;
export type PointingDesign = z.output<typeof PointingSchema>;
export type AtmosphereDesign = z.output<typeof AtmosphereSchema>;
export type ScintillationDesign = z.output<typeof ScintillationSchema>;
