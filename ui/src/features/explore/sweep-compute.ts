// The margins a sweep or a heat map plots: link-core's own samplers (marginSweep, marginGrid), so
// every point is the engine's budget of the design with the swept input(s) changed. Synchronous;
// the worker (worker/sweep.worker.ts) runs it off the main thread so typing never waits for it.
import { marginGrid, marginSweep, type LinkDesignInput, type SweepAxis as EngineAxis } from '@beamwright/link-core';
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
  /** link margin at each x [dB] */
  marginDb: Float64Array;
  /** time the engine took [ms] */
  computeMs: number;
}

export interface GridSweepResult {
  xSi: Float64Array;
  ySi: Float64Array;
  /** row-major: marginDb[iy * xSi.length + ix] [dB] */
  marginDb: Float64Array;
  computeMs: number;
}

const engineAxis = (axis: SweepAxis): EngineAxis => ({ field: axis.field, from: axis.fromSi, to: axis.toSi, points: axis.points, spacing: axis.spacing });

export function computeLineSweep(design: LinkDesignInput, axis: SweepAxis): LineSweepResult {
  const started = performance.now();
  const sweep = marginSweep(design, engineAxis(axis));
  return { xSi: sweep.axis.values, marginDb: sweep.linkMarginDb, computeMs: performance.now() - started };
}

export function computeGridSweep(design: LinkDesignInput, xAxis: SweepAxis, yAxis: SweepAxis): GridSweepResult {
  const started = performance.now();
  const grid = marginGrid(design, { x: engineAxis(xAxis), y: engineAxis(yAxis) });
  return { xSi: grid.x.values, ySi: grid.y.values, marginDb: grid.linkMarginDb, computeMs: performance.now() - started };
}
