/// <reference lib="webworker" />
/**
 * The board's sweep worker: runs runSweep off the main thread so a drag keeps its frame
 * rate. The page sends at most one request at a time (see useSweepRunner), so no backlog
 * can build up here.
 */
import { computeSweep, type SweepRequest } from './sweep.protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (e: MessageEvent<SweepRequest>) => {
  scope.postMessage(computeSweep(e.data));
};
