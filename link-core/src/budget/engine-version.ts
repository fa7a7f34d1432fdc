/**
 * Results tied to their engine. A stored revision keeps the design and budget its engine computed,
 * and is never rewritten; these helpers read it as that engine meant it (a versioned read) and put
 * the current engine's figures beside it.
 */
import type { LinkDesign, LinkDesignInput } from '../schemas/link-design.schema.js';
import { LINK_CORE_VERSION } from '../version.js';
import { evaluateLink } from './evaluate-link.js';

/** The first engine version with the Gaussian-beam turbulence model (absent model = Gaussian beam). */
export const GAUSSIAN_BEAM_DEFAULT_SINCE = '0.2.0';

/** Margin a link is expected to keep [dB] (common practice: 3 dB; the workspace's thin-margin line). */
export const REQUIRED_LINK_MARGIN_DB = 3;

/**
 * Compares two `major.minor.patch` versions.
 * @returns negative, 0 or positive as `a` is older than, equal to or newer than `b`
 */
export function compareEngineVersions(a: string, b: string): number {
  const pa = a.split('.').map((part) => Number.parseInt(part, 10) || 0);
  const pb = b.split('.').map((part) => Number.parseInt(part, 10) || 0);
  for (let i = 0; i < 3; i++) if ((pa[i] ?? 0) !== (pb[i] ?? 0)) return (pa[i] ?? 0) - (pb[i] ?? 0);
  return 0;
}

/**
 * A stored design as the engine that stored it read it: a design from an engine before 0.2.0 has
 * no `atmosphere.turbulenceModel` and was computed with the spherical wave, so it is read as
 * `'spherical-wave'`. Returns a new object; the stored row is never changed.
 *
 * @param design the design as stored
 * @param linkCoreVersion the engine version stored with it
 * @returns the design to evaluate with the current engine
 */
export function readStoredDesign<T extends LinkDesign | LinkDesignInput>(design: T, linkCoreVersion: string): T {
  if (design.atmosphere.turbulenceModel !== undefined || compareEngineVersions(linkCoreVersion, GAUSSIAN_BEAM_DEFAULT_SINCE) >= 0) return design;
  return { ...design, atmosphere: { ...design.atmosphere, turbulenceModel: 'spherical-wave' } };
}

/** The current engine's figures beside a revision computed by an older one. */
export interface CurrentEngineFigures {
  linkCoreVersion: string;
  linkMarginDb: number;
  receivedPowerDbm: number;
  /** current minus stored margin [dB] */
  marginChangeDb: number;
  /** the current engine's margin is below REQUIRED_LINK_MARGIN_DB */
  belowRequiredMargin: boolean;
}

/**
 * The current engine's margin for a stored revision, or null when the revision was computed by the
 * current engine (nothing to compare). The design is read as its engine meant it (readStoredDesign).
 *
 * @param design the stored design
 * @param linkCoreVersion the stored engine version
 * @param storedLinkMarginDb the stored budget's margin [dB]
 * @returns the current figures and the change [dB], or null
 */
export function currentEngineFigures(design: LinkDesign | LinkDesignInput, linkCoreVersion: string, storedLinkMarginDb: number): CurrentEngineFigures | null {
  if (linkCoreVersion === LINK_CORE_VERSION) return null;
  const budget = evaluateLink(readStoredDesign(design, linkCoreVersion));
  return {
    linkCoreVersion: LINK_CORE_VERSION,
    linkMarginDb: budget.linkMarginDb,
    receivedPowerDbm: budget.receivedPowerDbm,
    marginChangeDb: budget.linkMarginDb - storedLinkMarginDb,
    belowRequiredMargin: budget.linkMarginDb < REQUIRED_LINK_MARGIN_DB,
  };
}
