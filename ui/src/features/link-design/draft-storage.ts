// Unsaved edits survive a reload or an accidental close of the tab: the draft is kept in the
// browser session (sessionStorage: this tab only, gone when it closes) until it is saved or discarded.
import type { LinkDesignInput } from '@beamwright/link-core';
import type { DesignDraft } from '@/features/link-design/design-draft';

interface StoredDraft {
  baseRevision: number;
  base: LinkDesignInput;
  draft: DesignDraft;
}

const keyOf = (linkId: string) => `beamwright.draft.${linkId}`;

export function loadStoredDraft(linkId: string): StoredDraft | null {
  try {
    const raw = window.sessionStorage.getItem(keyOf(linkId));
    if (!raw) return null;
    const stored = JSON.parse(raw) as StoredDraft;
    if (typeof stored.baseRevision !== 'number' || !stored.draft?.text || !stored.base) return null;
    return stored;
  } catch {
    return null;
  }
}

export function storeDraft(linkId: string, value: StoredDraft) {
  try {
    window.sessionStorage.setItem(keyOf(linkId), JSON.stringify(value));
  } catch {
    // storage full or disabled: the in-page draft still holds the edits
  }
}

export function clearStoredDraft(linkId: string) {
  window.sessionStorage.removeItem(keyOf(linkId));
}
