/**
 * The organisation's settings: its name and the defaults a new link starts from. Every member
 * reads them (the new-link form uses the defaults); an admin changes them.
 */
import { z } from 'zod';
import { boundedProbability } from '../schemas/fields.js';
import { LINK_DESIGN_DEFAULTS, PROBABILITY_BOUNDS, VISIBILITY_DEFINITIONS } from '../schemas/link-design.schema.js';
import { numberField, textField } from './common.contract.js';

/** Units a path length is typed and shown in by default: metres, kilometres, statute miles. */
export const DISTANCE_UNITS = ['m', 'km', 'mi'] as const;
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];
export type VisibilityDefinitionName = (typeof VISIBILITY_DEFINITIONS)[number];

/** What a new organisation starts with: the engine's own defaults, so nothing changes until an admin says so. */
export const ORGANISATION_DEFAULTS = {
  // the engine's REQUIRED_LINK_MARGIN_DB (not imported: it would pull the budget into the contracts; a test keeps them equal)
  requiredMarginDb: 3,
  fadeProbability: LINK_DESIGN_DEFAULTS.scintillationProbability,
  visibilityDefinition: LINK_DESIGN_DEFAULTS.visibilityDefinition,
  distanceUnit: 'km',
} as const;

const settingsFields = {
  name: textField({ min: 1, max: 200 }),
  /** the margin a link is expected to keep above the receiver's sensitivity [dB] */
  requiredMarginDb: numberField({ min: 0, max: 40 }),
  /** the scintillation fade probability a new design holds margin against (1e-9 … 0.5) */
  fadeProbability: boundedProbability(PROBABILITY_BOUNDS.fade),
  /** which contrast threshold visibility figures use (2 % contrast or 5 % MOR) */
  visibilityDefinition: z.enum(VISIBILITY_DEFINITIONS, { error: `must be one of ${VISIBILITY_DEFINITIONS.join(', ')}` }),
  /** the unit a path length is typed in when no unit is given, and shown in */
  distanceUnit: z.enum(DISTANCE_UNITS, { error: `must be one of ${DISTANCE_UNITS.join(', ')}` }),
};

export const OrganisationSettingsSchema = z.object({
  id: z.uuid(),
  ...settingsFields,
});
export type OrganisationSettings = z.infer<typeof OrganisationSettingsSchema>;

/** `PATCH /api/organisation/settings`: any subset of the fields. */
export const UpdateOrganisationSettingsRequestSchema = z.strictObject({
  name: settingsFields.name.optional(),
  requiredMarginDb: settingsFields.requiredMarginDb.optional(),
  fadeProbability: settingsFields.fadeProbability.optional(),
  visibilityDefinition: settingsFields.visibilityDefinition.optional(),
  distanceUnit: settingsFields.distanceUnit.optional(),
});
export type UpdateOrganisationSettingsRequest = z.input<typeof UpdateOrganisationSettingsRequestSchema>;
