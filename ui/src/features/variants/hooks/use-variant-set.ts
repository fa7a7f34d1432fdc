// The alternatives the engineer keeps beside the design: saved with the next revision (the api
// stores only the variants a save sends), kept in this tab's session until then, like the draft.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { LinkDesignInput } from '@beamwright/link-core';
import { MAX_VARIANTS_PER_REVISION, uniqueVariantName, type RevisionVariant } from '@beamwright/link-core/contracts';

export interface VariantDraft {
  /** stable key for React and for error messages while the list changes */
  id: string;
  name: string;
  design: LinkDesignInput;
}

let nextId = 0;
const newId = () => `variant-${(nextId += 1)}`;

const fromStored = (stored: readonly RevisionVariant[] | undefined): VariantDraft[] =>
  (stored ?? []).map((variant) => ({ id: newId(), name: variant.name, design: variant.design }));

const sameList = (a: readonly { name: string; design: LinkDesignInput }[], b: readonly { name: string; design: LinkDesignInput }[]) =>
  a.length === b.length && a.every((item, index) => item.name === b[index]!.name && JSON.stringify(item.design) === JSON.stringify(b[index]!.design));

const storageKey = (linkId: string) => `beamwright.variants.${linkId}`;

export interface VariantSet {
  variants: VariantDraft[];
  /** the list differs from the stored revision's */
  changed: boolean;
  full: boolean;
  add: (name: string, design: LinkDesignInput) => void;
  addMany: (items: { name: string; design: LinkDesignInput }[]) => number;
  rename: (id: string, name: string) => void;
  remove: (id: string) => void;
  /** replaces one variant's design (used when it trades places with the form's design) */
  replaceDesign: (id: string, name: string, design: LinkDesignInput) => void;
  /** after a save or a promotion: the stored revision's variants become the list */
  reset: (stored: readonly RevisionVariant[] | undefined, revision: number) => void;
  /** the body of a save */
  toRequest: () => { name: string; design: LinkDesignInput }[];
  /** a name not yet taken (regardless of case) */
  freeName: (preferred: string) => string;
}

export function useVariantSet(linkId: string, stored: readonly RevisionVariant[] | undefined, revision: number): VariantSet {
  const [storedList, setStoredList] = useState(() => fromStored(stored));
  const [baseRevision, setBaseRevision] = useState(revision);
  const [variants, setVariants] = useState<VariantDraft[]>(() => {
    try {
      const raw = window.sessionStorage.getItem(storageKey(linkId));
      const kept = raw ? (JSON.parse(raw) as { revision: number; variants: { name: string; design: LinkDesignInput }[] }) : null;
      if (kept && kept.revision === revision && Array.isArray(kept.variants)) return kept.variants.map((item) => ({ id: newId(), name: item.name, design: item.design }));
    } catch {
      // unreadable session entry: start from the stored revision
    }
    return fromStored(stored);
  });
  const changed = useMemo(() => !sameList(variants, storedList), [variants, storedList]);

  const firstRender = useRef(true);
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      if (!changed) return;
    }
    try {
      if (changed) window.sessionStorage.setItem(storageKey(linkId), JSON.stringify({ revision: baseRevision, variants: variants.map(({ name, design }) => ({ name, design })) }));
      else window.sessionStorage.removeItem(storageKey(linkId));
    } catch {
      // storage full or disabled: the list in the page still holds the alternatives
    }
  }, [changed, linkId, baseRevision, variants]);

  const freeName = useCallback((preferred: string) => uniqueVariantName(preferred, variants.map((variant) => variant.name)), [variants]);

  const add = useCallback((name: string, design: LinkDesignInput) => {
    setVariants((current) => (current.length >= MAX_VARIANTS_PER_REVISION ? current : [...current, { id: newId(), name: uniqueVariantName(name, current.map((item) => item.name)), design }]));
  }, []);
  const addMany = useCallback(
    (items: { name: string; design: LinkDesignInput }[]) => {
      const next = [...variants];
      for (const item of items) {
        if (next.length >= MAX_VARIANTS_PER_REVISION) break;
        next.push({ id: newId(), name: uniqueVariantName(item.name, next.map((variant) => variant.name)), design: item.design });
      }
      setVariants(next);
      return next.length - variants.length;
    },
    [variants],
  );
  const rename = useCallback((id: string, name: string) => setVariants((current) => current.map((item) => (item.id === id ? { ...item, name } : item))), []);
  const remove = useCallback((id: string) => setVariants((current) => current.filter((item) => item.id !== id)), []);
  const replaceDesign = useCallback((id: string, name: string, design: LinkDesignInput) => setVariants((current) => current.map((item) => (item.id === id ? { ...item, name, design } : item))), []);
  const reset = useCallback((next: readonly RevisionVariant[] | undefined, nextRevision: number) => {
    const list = fromStored(next);
    setStoredList(list);
    setVariants(list);
    setBaseRevision(nextRevision);
  }, []);
  const toRequest = useCallback(() => variants.map(({ name, design }) => ({ name: name.trim(), design })), [variants]);

  return { variants, changed, full: variants.length >= MAX_VARIANTS_PER_REVISION, add, addMany, rename, remove, replaceDesign, reset, toRequest, freeName };
}
