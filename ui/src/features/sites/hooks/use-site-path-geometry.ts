import { useMemo } from 'react';
import { linkGeometry, type LinkGeometry } from '@beamwright/link-core';
import { siteTerminalOf, type SiteResponse } from '@beamwright/link-core/contracts';
import { useSites } from '@/features/sites/api/get-sites';

export interface SitePathGeometry {
  a: SiteResponse;
  b: SiteResponse;
  geometry: LinkGeometry;
}

/**
 * The path between two of the organisation's sites (slant range, bearings, elevations), from their
 * coordinates and terminal heights; null until both are chosen and loaded, when they are the same
 * site, or when the geometry cannot be computed.
 */
export function useSitePathGeometry(siteAId: string | null | undefined, siteBId: string | null | undefined): SitePathGeometry | null {
  const sites = useSites();
  return useMemo(() => {
    const a = sites.data?.find((site) => site.id === siteAId);
    const b = sites.data?.find((site) => site.id === siteBId);
    if (!a || !b || a.id === b.id) return null;
    try {
      return { a, b, geometry: linkGeometry({ a: siteTerminalOf(a), b: siteTerminalOf(b) }) };
    } catch {
      return null;
    }
  }, [sites.data, siteAId, siteBId]);
}
