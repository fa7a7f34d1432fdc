import { useCallback, useDeferredValue, useMemo, useRef, useState } from 'react';
import { evaluateLink, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';
import {
  draftFromDesign,
  evaluateDraft,
  readDraftValues,
  type DesignDraft,
} from '@/features/link-design/design-draft';
import { QUANTITY_FIELD_IDS, type QuantityFieldId } from '@/features/link-design/design-fields';

export interface DesignWorkspace {
  draft: DesignDraft;
  /** the design the draft started from (the stored revision) */
  base: LinkDesignInput;
  errors: Partial<Record<string, string>>;
  /** the design as typed, when every field is valid */
  design: LinkDesignInput | null;
  /** the last valid design: what the results show while a field is being fixed */
  shownDesign: LinkDesignInput;
  /** true while the results show an older valid design because some field is invalid */
  showingLastValid: boolean;
  budget: LinkBudget | null;
  budgetError: string | null;
  /** a slightly lagging copy of shownDesign for the charts, so typing never waits for them */
  chartDesign: LinkDesignInput;
  /** the fields whose value differs from the base */
  changedFieldIds: string[];
  setText: (id: QuantityFieldId, text: string) => void;
  update: (changes: Partial<Omit<DesignDraft, 'text'>>) => void;
  replaceDraft: (draft: DesignDraft, base?: LinkDesignInput) => void;
}

function safeEvaluate(design: LinkDesignInput): { budget: LinkBudget | null; error: string | null } {
  try {
    return { budget: evaluateLink(design), error: null };
  } catch (error) {
    return { budget: null, error: error instanceof Error ? error.message : String(error) };
  }
}

/** The engineer's working copy of a design with its budget recomputed in the browser on every edit. */
export function useDesignWorkspace(initialDesign: LinkDesignInput): DesignWorkspace {
  const [base, setBase] = useState(initialDesign);
  const [draft, setDraft] = useState(() => draftFromDesign(initialDesign));
  const lastValid = useRef<LinkDesignInput>(initialDesign);

  const evaluation = useMemo(() => evaluateDraft(draft, base), [draft, base]);
  if (evaluation.design) lastValid.current = evaluation.design;
  const shownDesign = evaluation.design ?? lastValid.current;
  const { budget, error: budgetError } = useMemo(() => safeEvaluate(shownDesign), [shownDesign]);
  const chartDesign = useDeferredValue(shownDesign);

  const baseReadings = useMemo(() => readDraftValues(draftFromDesign(base)), [base]);
  const changedFieldIds = useMemo(() => {
    const readings = readDraftValues(draft);
    const changed: string[] = QUANTITY_FIELD_IDS.filter((id) => {
      const now = readings[id];
      const before = baseReadings[id];
      if (!now.ok || !before.ok) return true;
      if (now.value === undefined || before.value === undefined) return now.value !== before.value;
      return Math.abs(now.value - before.value) > 1e-9 * Math.max(Math.abs(now.value), Math.abs(before.value));
    });
    const original = draftFromDesign(base);
    if (draft.atmosphereModel !== original.atmosphereModel) changed.push('atmosphere.model');
    if (draft.visibilityDefinition !== original.visibilityDefinition) changed.push('atmosphere.visibilityDefinition');
    if (draft.scintillationInclude !== original.scintillationInclude) changed.push('scintillation.include');
    return changed;
  }, [draft, base, baseReadings]);

  const setText = useCallback((id: QuantityFieldId, text: string) => {
    setDraft((current) => ({ ...current, text: { ...current.text, [id]: text } }));
  }, []);
  const update = useCallback((changes: Partial<Omit<DesignDraft, 'text'>>) => {
    setDraft((current) => ({ ...current, ...changes }));
  }, []);
  const replaceDraft = useCallback((next: DesignDraft, nextBase?: LinkDesignInput) => {
    if (nextBase) setBase(nextBase);
    setDraft(next);
  }, []);

  return {
    draft,
    base,
    errors: evaluation.errors,
    design: evaluation.design,
    shownDesign,
    showingLastValid: evaluation.design === null,
    budget,
    budgetError,
    chartDesign,
    changedFieldIds,
    setText,
    update,
    replaceDraft,
  };
}
