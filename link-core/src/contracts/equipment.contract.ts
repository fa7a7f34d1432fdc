/**
 * The organisation's equipment catalogue: transmitter and receiver models with the datasheet
 * figures a design needs, in SI units (metres, radians) with powers in dBm and losses in dB.
 * Datasheets state beam sizes and divergences in several conventions, so each figure carries its
 * definition; the planner converts to the design's 1/e² radius and half-angle.
 */
import { z } from 'zod';
import { IsoDateTimeSchema, numberField, textField } from './common.contract.js';

/** Width conventions found on datasheets: 1/e² (13.5 %) intensity, 1/e (36.8 %) intensity, FWHM (50 %). */
export const BEAM_WIDTH_DEFINITIONS = ['1/e2', '1/e', 'fwhm'] as const;
export const BeamWidthDefinitionSchema = z.enum(BEAM_WIDTH_DEFINITIONS, { error: `must be one of ${BEAM_WIDTH_DEFINITIONS.join(', ')}` });
export type BeamWidthDefinition = z.infer<typeof BeamWidthDefinitionSchema>;

export const DIVERGENCE_ANGLES = ['full', 'half'] as const;

export const EQUIPMENT_KINDS = ['transmitter', 'receiver'] as const;
export const EquipmentKindSchema = z.enum(EQUIPMENT_KINDS, { error: 'must be transmitter or receiver' });
export type EquipmentKind = z.infer<typeof EquipmentKindSchema>;

/** Beam size at the exit aperture: either the 1/e² radius directly, or a diameter with its definition. */
export const TransmitterBeamSizeSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('waist-radius'),
      /** 1/e² beam radius at the transmit aperture [m] */
      waistRadiusM: numberField({ min: 1e-6, max: 1 }),
    }),
    z.strictObject({
      kind: z.literal('exit-diameter'),
      /** beam diameter at the exit aperture [m], in `definition` */
      diameterM: numberField({ min: 1e-6, max: 2 }),
      definition: BeamWidthDefinitionSchema,
    }),
  ],
  { error: 'must be { kind: "waist-radius", waistRadiusM } or { kind: "exit-diameter", diameterM, definition }' },
);
export type TransmitterBeamSize = z.infer<typeof TransmitterBeamSizeSchema>;

export const DivergenceSpecSchema = z.strictObject({
  /** the datasheet angle [rad] */
  angleRad: numberField({ min: 1e-7, max: 0.2 }),
  /** whether the figure is the full cone angle or the half-angle */
  angle: z.enum(DIVERGENCE_ANGLES, { error: 'must be full or half' }),
  /** the width definition the angle is measured at */
  definition: BeamWidthDefinitionSchema,
});
export type DivergenceSpec = z.infer<typeof DivergenceSpecSchema>;

export const TransmitterSpecSchema = z.strictObject({
  /** vacuum wavelength [m] */
  wavelengthM: numberField({ min: 200e-9, max: 20e-6 }),
  /** average optical output power [dBm] */
  powerDbm: numberField({ min: -40, max: 50 }),
  beamSize: TransmitterBeamSizeSchema,
  /** far-field divergence as the datasheet gives it; absent = diffraction-limited */
  divergence: DivergenceSpecSchema.optional(),
  /** beam propagation ratio M² (ISO 11146-1) */
  m2: numberField({ min: 1, max: 100 }).default(1),
  /** transmit optics and window loss [dB] */
  opticsLossDb: numberField({ min: 0, max: 30 }),
});
export type TransmitterSpec = z.infer<typeof TransmitterSpecSchema>;

export const ReceiverSpecSchema = z
  .strictObject({
    /** clear receive aperture diameter [m] */
    apertureDiameterM: numberField({ min: 1e-4, max: 2 }),
    /** central obscuration as a ratio of diameters, in [0, 1) */
    obscurationRatio: numberField({ min: 0, max: 0.99 }).default(0),
    /** receive optics and window loss [dB] */
    opticsLossDb: numberField({ min: 0, max: 30 }),
    /** sensitivity (minimum mean optical power) at `dataRateBps` [dBm] */
    sensitivityDbm: numberField({ min: -90, max: 20 }),
    /** data rate the sensitivity applies to [bit/s] */
    dataRateBps: numberField({ min: 1, max: 1e12 }),
    /** maximum mean optical power before saturation [dBm] */
    overloadDbm: numberField({ min: -90, max: 40 }).optional(),
    /** half-angle field of view [rad] */
    fieldOfViewRad: numberField({ min: 1e-6, max: 0.5 }).optional(),
  })
  .refine((spec) => spec.overloadDbm === undefined || spec.overloadDbm > spec.sensitivityDbm, {
    message: 'must be greater than the sensitivity',
    path: ['overloadDbm'],
  });
export type ReceiverSpec = z.infer<typeof ReceiverSpecSchema>;

const commonFields = {
  name: textField({ min: 1, max: 200 }),
  /** maker or supplier as the organisation knows it */
  maker: textField({ max: 200 }).default(''),
  notes: textField({ max: 4000, multiline: true }).default(''),
};

export const CreateEquipmentRequestSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('transmitter'), ...commonFields, spec: TransmitterSpecSchema }),
    z.strictObject({ kind: z.literal('receiver'), ...commonFields, spec: ReceiverSpecSchema }),
  ],
  { error: 'kind must be transmitter or receiver' },
);
export type CreateEquipmentRequest = z.input<typeof CreateEquipmentRequestSchema>;

/** Changes to a model; `spec`, when given, replaces the whole spec and must fit the model's kind. */
export const UpdateEquipmentRequestSchema = z.strictObject({
  name: commonFields.name.optional(),
  maker: textField({ max: 200 }).optional(),
  notes: textField({ max: 4000, multiline: true }).optional(),
  spec: z.unknown().optional(),
});
export type UpdateEquipmentRequest = z.input<typeof UpdateEquipmentRequestSchema>;

const responseFields = {
  id: z.uuid(),
  name: z.string(),
  maker: z.string(),
  notes: z.string(),
  /** true for the demo's invented models whose figures are typical values, not a real datasheet */
  illustrative: z.boolean(),
  createdAt: IsoDateTimeSchema,
  updatedAt: IsoDateTimeSchema,
};

export const EquipmentResponseSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('transmitter'), ...responseFields, spec: TransmitterSpecSchema }),
  z.object({ kind: z.literal('receiver'), ...responseFields, spec: ReceiverSpecSchema }),
]);
export type EquipmentResponse = z.infer<typeof EquipmentResponseSchema>;

export const EquipmentListQuerySchema = z.object({ kind: EquipmentKindSchema.optional() });
export const EquipmentListResponseSchema = z.object({ items: z.array(EquipmentResponseSchema) });
export type EquipmentListResponse = z.infer<typeof EquipmentListResponseSchema>;
