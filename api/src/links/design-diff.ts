import type { DesignChange } from '@beamwright/link-core/contracts';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** Leaf values of a JSON document by dotted path (`transmitter.powerDbm`); arrays count as leaves. */
export function flattenLeaves(value: unknown, prefix = '', into = new Map<string, unknown>()): Map<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [key, child] of Object.entries(value as Record<string, Json>)) flattenLeaves(child, prefix ? `${prefix}.${key}` : key, into);
    return into;
  }
  into.set(prefix, value);
  return into;
}

function sameValue(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * Field-by-field difference of two designs: every leaf path whose value differs, with `null` on
 * the side where the field is absent, sorted by path so the order is stable.
 */
export function diffDesigns(from: unknown, to: unknown): DesignChange[] {
  const before = flattenLeaves(from);
  const after = flattenLeaves(to);
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  const changes: DesignChange[] = [];
  for (const path of paths) {
    const oldValue = before.has(path) ? before.get(path) : null;
    const newValue = after.has(path) ? after.get(path) : null;
    if (!sameValue(oldValue, newValue)) changes.push({ path, from: oldValue ?? null, to: newValue ?? null });
  }
  return changes;
}
