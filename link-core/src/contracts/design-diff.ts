/**
 * Field-by-field difference of two designs, shared by the API (the revision diff route) and the
 * UI (pending edits and save conflicts), so both list exactly the same changed fields. Pure.
 */
import type { DesignChange } from './links.contract.js';

/** Leaf values of a JSON document by dotted path (`transmitter.powerDbm`); arrays count as leaves. */
function flattenLeaves(value: unknown, prefix = '', into = new Map<string, unknown>()): Map<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [key, child] of Object.entries(value as Record<string, unknown>)) flattenLeaves(child, prefix ? `${prefix}.${key}` : key, into);
    return into;
  }
  if (prefix) into.set(prefix, value);
  return into;
}

function sameValue(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * Every leaf path whose value differs between two designs, with `null` on the side where the
 * field is absent (an absent field and an undefined one are the same), sorted by path.
 *
 * @param from the earlier design (any JSON object; null or undefined reads as empty)
 * @param to the later design
 * @returns the changes `{ path, from, to }`, sorted by path
 */
export function diffDesigns(from: unknown, to: unknown): DesignChange[] {
  const before = flattenLeaves(from ?? {});
  const after = flattenLeaves(to ?? {});
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  const changes: DesignChange[] = [];
  for (const path of paths) {
    const oldValue = before.get(path) ?? null;
    const newValue = after.get(path) ?? null;
    if (!sameValue(oldValue, newValue)) changes.push({ path, from: oldValue, to: newValue });
  }
  return changes;
}
