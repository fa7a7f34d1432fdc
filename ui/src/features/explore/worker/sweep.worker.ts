// The sweep worker: link-core's budget off the main thread, so a heat map of thousands of budgets
// never stalls typing. zod must be told to skip its `new Function` probe before link-core loads
// (the page's Content-Security-Policy applies here too): hence the first import.
import '@/features/explore/worker/zod-jitless';
import { expose, transfer } from 'comlink';
import { solveDesign, type LinkDesignInput, type SolveDesignOptions } from '@beamwright/link-core';
import { computeGridSweep, computeLineSweep, type SweepAxis } from '@/features/explore/sweep-compute';

const api = {
  line(design: LinkDesignInput, axis: SweepAxis) {
    const result = computeLineSweep(design, axis);
    return transfer(result, [result.xSi.buffer, result.marginDb.buffer]);
  },
  solve(design: LinkDesignInput, options: SolveDesignOptions) {
    return solveDesign(design, options);
  },
  grid(design: LinkDesignInput, xAxis: SweepAxis, yAxis: SweepAxis) {
    const result = computeGridSweep(design, xAxis, yAxis);
    return transfer(result, [result.xSi.buffer, result.ySi.buffer, result.marginDb.buffer]);
  },
};
export type SweepWorkerApi = typeof api;
expose(api);
