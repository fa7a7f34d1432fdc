// After a save conflict: the latest stored design with the engineer's own edits re-applied on top,
// and which of those edits the other save had touched too.
import type { LinkDesignInput } from '@beamwright/link-core';
import { QUANTITY_FIELD_IDS } from '@/features/link-design/design-fields';
import { draftFromDesign, readDraftValues, type DesignDraft, type FieldReading } from '@/features/link-design/design-draft';

function sameNumber(a: number | undefined, b: number | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

export interface RebaseResult {
  /** the latest design with the engineer's own edits applied on top */
  draft: DesignDraft;
  /** fields the engineer had changed, now re-applied */
  reapplied: string[];
  /** of those, the fields the other save had changed too (the engineer's value is kept) */
  overlapping: string[];
}

/**
 * After a save conflict: start again from the latest stored design and re-apply every field the
 * engineer had changed relative to the revision they started from. Text that does not parse counts
 * as an edit and is kept as typed, so nothing typed is lost.
 */
export function rebaseDraft(mine: DesignDraft, myBase: LinkDesignInput, latest: LinkDesignInput): RebaseResult {
  const baseDraft = draftFromDesign(myBase);
  const next = draftFromDesign(latest);
  const mineReadings = readDraftValues(mine);
  const baseReadings = readDraftValues(baseDraft);
  const latestReadings = readDraftValues(next);
  const differs = (a: FieldReading, b: FieldReading) => !(a.ok && b.ok && sameNumber(a.value, b.value));
  const reapplied: string[] = [];
  const overlapping: string[] = [];

  for (const id of QUANTITY_FIELD_IDS) {
    if (!differs(mineReadings[id], baseReadings[id])) continue;
    next.text[id] = mine.text[id];
    if (id === 'transmitter.waistRadiusM') next.beamSize = { ...mine.beamSize };
    if (id === 'transmitter.halfAngleDivergenceRad') next.divergence = { ...mine.divergence };
    reapplied.push(id);
    if (differs(baseReadings[id], latestReadings[id])) overlapping.push(id);
  }

  const choices = [
    ['atmosphereModel', 'atmosphere.model'],
    ['visibilityDefinition', 'atmosphere.visibilityDefinition'],
    ['turbulenceModel', 'atmosphere.turbulenceModel'],
    ['scintillationInclude', 'scintillation.include'],
  ] as const;
  for (const [key, path] of choices) {
    if (mine[key] === baseDraft[key]) continue;
    (next as unknown as Record<string, unknown>)[key] = mine[key];
    reapplied.push(path);
    if (draftFromDesign(latest)[key] !== baseDraft[key]) overlapping.push(path);
  }
  return { draft: next, reapplied, overlapping };
}
