import type { SiteResponse } from '@beamwright/link-core/contracts';
import type { Site } from './site.entity.js';

export function toSiteResponse(site: Site): SiteResponse {
  return {
    id: site.id,
    name: site.name,
    latitudeDeg: site.latitudeDeg,
    longitudeDeg: site.longitudeDeg,
    groundElevationM: site.groundElevationM,
    mountHeightM: site.mountHeightM,
    notes: site.notes,
    createdAt: site.createdAt.toISOString(),
    updatedAt: site.updatedAt.toISOString(),
  };
}
