import { VISIBILITY_CODE } from '@beamwright/link-core';

/** Weather names of visibility ranges (link-core's international visibility code), for the chart's bands. */
export const VISIBILITY_BANDS: readonly { label: string; fromM: number; toM: number }[] = VISIBILITY_CODE.map((row) => ({
  label: row.label,
  fromM: row.minVisibilityM,
  toM: row.maxVisibilityM,
}));
