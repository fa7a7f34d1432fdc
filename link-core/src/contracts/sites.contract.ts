/** Sites: the rooftops and masts that carry terminals, per organisation. */
import { z } from 'zod';
import { IsoDateTimeSchema, numberField, textField } from './common.contract.js';

const siteFields = {
  name: textField({ min: 1, max: 200 }),
  /** WGS 84 geodetic latitude [degrees], north positive */
  latitudeDeg: numberField({ min: -90, max: 90 }),
  /** WGS 84 longitude [degrees], east positive */
  longitudeDeg: numberField({ min: -180, max: 180 }),
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
