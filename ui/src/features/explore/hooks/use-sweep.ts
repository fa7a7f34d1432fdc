// Runs sweeps in the sweep worker with one request in flight at a time: while it computes, only
// the newest request waits (older ones are dropped), and the last finished result stays on screen.
import { useEffect, useRef, useState } from 'react';
import { wrap, type Remote } from 'comlink';
import type { LinkDesignInput } from '@beamwright/link-core';
import { computeGridSweep, computeLineSweep, type GridSweepResult, type LineSweepResult, type SweepAxis } from '@/features/explore/sweep-compute';
import type { SweepWorkerApi } from '@/features/explore/worker/sweep.worker';

export type SweepRequest =
  | { kind: 'line'; design: LinkDesignInput; axis: SweepAxis }
  | { kind: 'grid'; design: LinkDesignInput; xAxis: SweepAxis; yAxis: SweepAxis };

export type SweepResult = ({ kind: 'line' } & LineSweepResult) | ({ kind: 'grid' } & GridSweepResult);

export interface SweepState {
  result: SweepResult | null;
  /** the request the result answers (to label the chart with what it shows) */
  resultRequest: SweepRequest | null;
  computing: boolean;
  error: string | null;
  /** counts the results shown (a browser test times a redraw by it) */
  serial: number;
}

type Runner = (request: SweepRequest) => Promise<SweepResult>;

/** In a browser the worker; where there is none (component tests) the same code on this thread. */
function createRunner(): { run: Runner; dispose: () => void } {
  if (typeof Worker === 'undefined') {
    return {
      run: async (request) => (request.kind === 'line' ? { kind: 'line', ...computeLineSweep(request.design, request.axis) } : { kind: 'grid', ...computeGridSweep(request.design, request.xAxis, request.yAxis) }),
      dispose: () => {},
    };
  }
  const worker = new Worker(new URL('../worker/sweep.worker.ts', import.meta.url), { type: 'module', name: 'sweeps' });
  const remote: Remote<SweepWorkerApi> = wrap<SweepWorkerApi>(worker);
  return {
    run: async (request) =>
      request.kind === 'line'
        ? { kind: 'line', ...(await remote.line(request.design, request.axis)) }
        : { kind: 'grid', ...(await remote.grid(request.design, request.xAxis, request.yAxis)) },
    dispose: () => worker.terminate(),
  };
}

export function useSweep(request: SweepRequest | null): SweepState {
  const [state, setState] = useState<SweepState>({ result: null, resultRequest: null, computing: false, error: null, serial: 0 });
  const runner = useRef<{ run: Runner; dispose: () => void } | null>(null);
  const inFlight = useRef(false);
  const waiting = useRef<SweepRequest | null>(null);
  const latest = useRef<SweepRequest | null>(null);
  // reads refs only, so one function serves both effects
  const pump = useRef(() => {});
  pump.current = () => {
    const next = waiting.current;
    const active = runner.current;
    if (inFlight.current || !next || !active) return;
    waiting.current = null;
    inFlight.current = true;
    setState((previous) => ({ ...previous, computing: true }));
    active
      .run(next)
      .then((result) => {
        if (runner.current === active) setState((previous) => ({ result, resultRequest: next, computing: waiting.current !== null, error: null, serial: previous.serial + 1 }));
      })
      .catch((error: unknown) => {
        if (runner.current === active) setState((previous) => ({ ...previous, computing: false, error: error instanceof Error ? error.message : String(error) }));
      })
      .finally(() => {
        if (runner.current !== active) return;
        inFlight.current = false;
        pump.current();
      });
  };

  useEffect(() => {
    const created = createRunner();
    runner.current = created;
    inFlight.current = false;
    // a worker replaced mid-request (development remounts) takes the newest request again
    waiting.current = waiting.current ?? latest.current;
    pump.current();
    return () => {
      created.dispose();
      runner.current = null;
    };
  }, []);

  useEffect(() => {
    if (!request) return;
    latest.current = request;
    waiting.current = request;
    pump.current();
  }, [request]);

  return state;
}
