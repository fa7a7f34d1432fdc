// Field-by-field comparison of two stored designs, in words and units an engineer reads.
import type { LinkDesignInput } from '@beamwright/link-core';
import { diffDesigns as diffDesignLeaves } from '@beamwright/link-core/contracts';
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

/** Every leaf that differs between `before` and `after` (link-core's shared diff), in the order of the form. */
export function diffDesigns(before: LinkDesignInput | null | undefined, after: LinkDesignInput | null | undefined): DesignChange[] {
  const order = Object.keys(QUANTITY_FIELDS);
  const rank = (path: string) => {
    const index = order.indexOf(path);
    return index === -1 ? order.length : index;
  };
  return diffDesignLeaves(before, after)
    .sort((a, b) => rank(a.path) - rank(b.path) || a.path.localeCompare(b.path))
    .map(describeChange);
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
