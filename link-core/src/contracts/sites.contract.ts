/** Sites: the rooftops and masts that carry terminals, per organisation. */
import { z } from 'zod';
import { parseDegreesMinutesSeconds } from '../geometry/geodesy.js';
import { IsoDateTimeSchema, numberField, textField } from './common.contract.js';

/**
 * A latitude or longitude [degrees]: a number, or text in decimal degrees or degrees-minutes-seconds
 * read by `parseDegreesMinutesSeconds` (ISO 6709 sexagesimal forms: "56°00′47.8″N", "10 01 09.2 E",
 * "-37.95"). The hemisphere letter must fit the axis (N/S for a latitude, E/W for a longitude).
 */
export function coordinateField(axis: 'latitude' | 'longitude') {
  const limit = axis === 'latitude' ? 90 : 180;
  const letters = axis === 'latitude' ? /[EWew]\s*$/ : /[NSns]\s*$/;
  const example = axis === 'latitude' ? '56°00′47.8″N or 56.0133' : '10°01′09.2″E or 10.0192';
  return z
    .union([z.number(), z.string()], { error: (issue) => (issue.input === undefined ? 'is required' : 'must be a number or an angle as text') })
    .transform((value, context) => {
      if (typeof value === 'string') {
        const text = value.trim();
        if (text === '') {
          context.addIssue({ code: 'custom', message: 'is required' });
          return z.NEVER;
        }
        const parsed = letters.test(text) ? null : parseDegreesMinutesSeconds(text);
        if (parsed === null) {
          context.addIssue({ code: 'custom', message: `is not an angle in decimal degrees or degrees, minutes and seconds (e.g. ${example})` });
          return z.NEVER;
        }
        value = parsed;
      }
      if (!Number.isFinite(value)) {
        context.addIssue({ code: 'custom', message: 'must be a finite number' });
        return z.NEVER;
      }
      // the same words as numberField's bounds, so a number and a text read alike
      if (value < -limit || value > limit) {
        context.addIssue({ code: 'custom', message: value < -limit ? `must be at least -${limit}` : `must be at most ${limit}` });
        return z.NEVER;
      }
      return value;
    });
}

const siteFields = {
  name: textField({ min: 1, max: 200 }),
  /** WGS 84 geodetic latitude [degrees], north positive; decimal degrees or DMS text */
  latitudeDeg: coordinateField('latitude'),
  /** WGS 84 longitude [degrees], east positive; decimal degrees or DMS text */
  longitudeDeg: coordinateField('longitude'),
  /** ground (or roof base) elevation above mean sea level [m] */
  groundElevationM: numberField({ min: -500, max: 9000 }),
  /** height of the terminal mount above the ground elevation [m] */
  mountHeightM: numberField({ min: 0, max: 1000 }),
  notes: textField({ max: 4000, multiline: true }).default(''),
};

export const CreateSiteRequestSchema = z.strictObject(siteFields);
export type CreateSiteRequest = z.input<typeof CreateSiteRequestSchema>;

export const UpdateSiteRequestSchema = z.strictObject({
  name: siteFields.name.optional(),
  latitudeDeg: siteFields.latitudeDeg.optional(),
  longitudeDeg: siteFields.longitudeDeg.optional(),
  groundElevationM: siteFields.groundElevationM.optional(),
  mountHeightM: siteFields.mountHeightM.optional(),
  notes: textField({ max: 4000, multiline: true }).optional(),
});
export type UpdateSiteRequest = z.input<typeof UpdateSiteRequestSchema>;

export const SiteResponseSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  groundElevationM: z.number(),
  mountHeightM: z.number(),
  notes: z.string(),
  createdAt: IsoDateTimeSchema,
  updatedAt: IsoDateTimeSchema,
});
export type SiteResponse = z.infer<typeof SiteResponseSchema>;

/**
 * Height of a site's terminal above sea level [m]: the ground elevation plus the mount height
 * (both metres; the mount height is the aperture's height above the ground or roof the site's
 * ground elevation names). One rule for the path geometry, the link sheet and the site plan.
 */
export function siteTerminalHeightM(site: Pick<SiteResponse, 'groundElevationM' | 'mountHeightM'>): number {
  return site.groundElevationM + site.mountHeightM;
}

/** A site as one end of link-core's `linkGeometry` (latitude and longitude in degrees, height in metres). */
export function siteTerminalOf(site: Pick<SiteResponse, 'latitudeDeg' | 'longitudeDeg' | 'groundElevationM' | 'mountHeightM'>): { latDeg: number; lonDeg: number; heightM: number } {
  return { latDeg: site.latitudeDeg, lonDeg: site.longitudeDeg, heightM: siteTerminalHeightM(site) };
}

export const SiteListResponseSchema = z.object({ items: z.array(SiteResponseSchema) });
export type SiteListResponse = z.infer<typeof SiteListResponseSchema>;

/** A link that holds a site (either end), as a refused delete names it. */
export const SiteUserLinkSchema = z.object({ id: z.uuid(), name: z.string() });
export type SiteUserLink = z.infer<typeof SiteUserLinkSchema>;

/** The 409 of `DELETE /api/sites/:id` while links use the site: which links, so the user can move them first. */
export const SiteInUseBodySchema = z.object({
  statusCode: z.literal(409),
  error: z.string(),
  message: z.string(),
  links: z.array(SiteUserLinkSchema).min(1),
});
export type SiteInUseBody = z.infer<typeof SiteInUseBodySchema>;
