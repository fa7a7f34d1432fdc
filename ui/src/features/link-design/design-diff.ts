// Field-by-field comparison of two stored designs, in words and units an engineer reads.
import type { LinkDesignInput } from '@beamwright/link-core';
import {
  ATMOSPHERE_MODEL_LABELS,
  CHOICE_FIELD_LABELS,
  QUANTITY_FIELDS,
  VISIBILITY_DEFINITION_LABELS,
  type QuantityFieldId,
} from '@/features/link-design/design-fields';
import { formatAngle, formatDb, formatDbm, formatDistance, formatLength, formatWavelength } from '@/lib/format';

export interface DesignChange {
  path: string;
  label: string;
  before: string;
  after: string;
}

function flatten(value: unknown, prefix = '', into: Record<string, unknown> = {}): Record<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [key, child] of Object.entries(value as Record<string, unknown>)) {
      flatten(child, prefix ? `${prefix}.${key}` : key, into);
    }
  } else if (prefix) {
    into[prefix] = value;
  }
  return into;
}

/** A stored value written for people: units for quantities, names for choices. */
export function describeDesignValue(path: string, value: unknown): string {
  if (value === undefined || value === null) return 'not set';
  if (path === 'atmosphere.model') return ATMOSPHERE_MODEL_LABELS[String(value)] ?? String(value);
  if (path === 'atmosphere.visibilityDefinition') return VISIBILITY_DEFINITION_LABELS[String(value)] ?? String(value);
  if (typeof value === 'boolean') return value ? 'included' : 'left out';
  if (typeof value !== 'number') return String(value);
  const field = (QUANTITY_FIELDS as Record<string, (typeof QUANTITY_FIELDS)[QuantityFieldId] | undefined>)[path];
  if (!field) return String(value);
  switch (field.id) {
    case 'rangeM':
    case 'atmosphere.visibilityM':
      return formatDistance(value);
    case 'transmitter.wavelengthM':
      return formatWavelength(value);
    case 'transmitter.waistRadiusM':
      return `${formatLength(value)} (1/e² radius)`;
    case 'transmitter.halfAngleDivergenceRad':
      return `${formatAngle(value)} (1/e² half angle)`;
    case 'receiver.apertureDiameterM':
      return formatLength(value);
    default:
      if (field.kind === 'power') return formatDbm(value, 2);
      if (field.kind === 'decibel') return formatDb(value, { digits: 2 });
      if (field.kind === 'angle') return formatAngle(value);
      return String(Number(value.toPrecision(6)));
  }
}

export function designFieldLabel(path: string): string {
  const field = (QUANTITY_FIELDS as Record<string, { label: string } | undefined>)[path];
  return field?.label ?? CHOICE_FIELD_LABELS[path] ?? path;
}

/** Every leaf that differs between `before` and `after`, in the order of the form. */
export function diffDesigns(before: LinkDesignInput | null | undefined, after: LinkDesignInput | null | undefined): DesignChange[] {
  const left = flatten(before ?? {});
  const right = flatten(after ?? {});
  const order = Object.keys(QUANTITY_FIELDS);
  const paths = [...new Set([...Object.keys(left), ...Object.keys(right)])].sort((a, b) => {
    const ia = order.indexOf(a);
    const ib = order.indexOf(b);
    return (ia === -1 ? 999 : ia) - (ib === -1 ? 999 : ib) || a.localeCompare(b);
  });
  return paths
    .filter((path) => left[path] !== right[path])
    .map((path) => ({
      path,
      label: designFieldLabel(path),
      before: describeDesignValue(path, left[path]),
      after: describeDesignValue(path, right[path]),
    }));
}

/** A change reported by the api (`{ path, from, to }`) in words and units. */
export function describeChange(change: { path: string; from: unknown; to: unknown }): DesignChange {
  return {
    path: change.path,
    label: designFieldLabel(change.path),
    before: describeDesignValue(change.path, change.from),
    after: describeDesignValue(change.path, change.to),
  };
}
