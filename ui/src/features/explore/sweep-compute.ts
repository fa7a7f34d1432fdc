// The margins a sweep or a heat map plots, computed with link-core's own budget: every point is
// the design with the swept input(s) changed and everything else as designed. Pure and synchronous;
// the worker (worker/sweep.worker.ts) runs it off the main thread so typing never waits for it.
import { evaluateLink, type LinkDesignInput } from '@beamwright/link-core';
import type { ExploreFieldId } from '@/features/explore/explore-fields';

export interface SweepAxis {
  field: ExploreFieldId;
  /** first and last value, in the field's SI unit (dBm for power) */
  fromSi: number;
  toSi: number;
  /** number of samples, ends included */
  points: number;
  spacing: 'linear' | 'log';
}

export interface LineSweepResult {
  xSi: Float64Array;
  /** link margin at each x [dB]; NaN where the engine refused the point */
  marginDb: Float64Array;
  /** time the engine took in the worker [ms] */
  computeMs: number;
}

export interface GridSweepResult {
  xSi: Float64Array;
  ySi: Float64Array;
  /** row-major: marginDb[iy * xSi.length + ix] [dB]; NaN where the engine refused the point */
  marginDb: Float64Array;
  computeMs: number;
}

/** The sample values of an axis, linear or logarithmic, ends included. */
export function axisValuesSi(axis: SweepAxis): Float64Array {
  const values = new Float64Array(axis.points);
  const last = axis.points - 1;
  for (let i = 0; i < axis.points; i++) {
    const t = last === 0 ? 0 : i / last;
    values[i] = axis.spacing === 'log' ? axis.fromSi * (axis.toSi / axis.fromSi) ** t : axis.fromSi + (axis.toSi - axis.fromSi) * t;
  }
  return values;
}

/** A copy of the design with one input set (the copy is shallow per group, enough for the engine). */
export function withInput(design: LinkDesignInput, field: ExploreFieldId, valueSi: number): LinkDesignInput {
  if (field === 'rangeM') return { ...design, rangeM: valueSi };
  const [group, key] = field.split('.') as ['transmitter' | 'receiver' | 'pointing' | 'atmosphere', string];
  return { ...design, [group]: { ...(design[group] as object | undefined), [key]: valueSi } } as LinkDesignInput;
}

function marginOf(design: LinkDesignInput): number {
  try {
    return evaluateLink(design).linkMarginDb;
  } catch {
    return Number.NaN;
  }
}

export function computeLineSweep(design: LinkDesignInput, axis: SweepAxis): LineSweepResult {
  const started = performance.now();
  const xSi = axisValuesSi(axis);
  const marginDb = new Float64Array(xSi.length);
  for (let i = 0; i < xSi.length; i++) marginDb[i] = marginOf(withInput(design, axis.field, xSi[i]!));
  return { xSi, marginDb, computeMs: performance.now() - started };
}

export function computeGridSweep(design: LinkDesignInput, xAxis: SweepAxis, yAxis: SweepAxis): GridSweepResult {
  const started = performance.now();
  const xSi = axisValuesSi(xAxis);
  const ySi = axisValuesSi(yAxis);
  const marginDb = new Float64Array(xSi.length * ySi.length);
  for (let iy = 0; iy < ySi.length; iy++) {
    const row = withInput(design, yAxis.field, ySi[iy]!);
    for (let ix = 0; ix < xSi.length; ix++) marginDb[iy * xSi.length + ix] = marginOf(withInput(row, xAxis.field, xSi[ix]!));
  }
  return { xSi, ySi, marginDb, computeMs: performance.now() - started };
}
