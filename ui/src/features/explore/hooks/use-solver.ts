// "Size it for me": link-core's solveDesign in the sweep worker (a solve may take a second on an
// awkward design), started on demand; without a Worker (jsdom) on this thread.
import { useCallback, useEffect, useRef, useState } from 'react';
import { wrap, type Remote } from 'comlink';
import { solveDesign, type LinkDesignInput, type SolveDesignOptions, type SolveDesignResult } from '@beamwright/link-core';
import type { SweepWorkerApi } from '@/features/explore/worker/sweep.worker';

export interface SolverState {
  result: SolveDesignResult | null;
  solving: boolean;
  error: string | null;
}

export function useSolver() {
  const [state, setState] = useState<SolverState>({ result: null, solving: false, error: null });
  const worker = useRef<{ remote: Remote<SweepWorkerApi>; terminate: () => void } | null>(null);
  useEffect(() => () => worker.current?.terminate(), []);

  const solve = useCallback(async (design: LinkDesignInput, options: SolveDesignOptions) => {
    setState({ result: null, solving: true, error: null });
    try {
      let result: SolveDesignResult;
      if (typeof Worker === 'undefined') {
        result = solveDesign(design, options);
      } else {
        if (!worker.current) {
          const created = new Worker(new URL('../worker/sweep.worker.ts', import.meta.url), { type: 'module', name: 'solver' });
          worker.current = { remote: wrap<SweepWorkerApi>(created), terminate: () => created.terminate() };
        }
        result = await worker.current.remote.solve(design, options);
      }
      setState({ result, solving: false, error: null });
    } catch (error) {
      setState({ result: null, solving: false, error: error instanceof Error ? error.message : String(error) });
    }
  }, []);

  return { ...state, solve, clear: () => setState({ result: null, solving: false, error: null }) };
}
