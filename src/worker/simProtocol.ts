// Messages between the main thread and the peak-simulation worker (engine peak runs and the spectrum module's
// verdict fit), and the request runner the worker uses.
// Pure: no DOM and no worker globals, so it is unit-tested in Node and compiled for both sides.
import {
  InputRangeError,
  PeakCancelledError,
  peakProfileProgressive,
  transmission,
  transmissionVsResolution,
  type PeakProfile,
  type PeakProfileParams,
  type TransmissionParams,
  type TransmissionResult,
  type TransmissionVsResolution,
  type TransmissionVsResolutionParams,
} from '../engine/index';
import { fitPeak, type PeakFitRequest, type PeakFitResult } from '../spectrum/index';

export interface SimKinds {
  transmission: { params: TransmissionParams; result: TransmissionResult };
  peakProfile: { params: PeakProfileParams; result: PeakProfile };
  transmissionVsResolution: { params: TransmissionVsResolutionParams; result: TransmissionVsResolution };
  /** The verdict fit of one measured peak (src/spectrum/peakFit.ts). */
  peakFit: { params: PeakFitRequest; result: PeakFitResult };
}
export type SimKind = keyof SimKinds;

export interface SimRequest<K extends SimKind = SimKind> {
  id: number;
  kind: K;
  params: SimKinds[K]['params'];
}

/** A refusal or failure, flattened so it survives structured cloning; field/range set for bad input. */
export interface SimErrorInfo {
  name: string;
  message: string;
  field?: string;
  range?: string;
  /** The refused value when it is a number or string. */
  value?: number | string;
}

export type SimResponse =
  | { id: number; type: 'progress'; fraction: number }
  /** A complete but coarse result ahead of the final one (peakProfile: error bound ≤ 1 % of the peak height). */
  | { id: number; type: 'partial'; coarse: true; result: unknown }
  | { id: number; type: 'result'; result: unknown }
  | { id: number; type: 'error'; error: SimErrorInfo };

/** Every ArrayBuffer behind a typed array in the result (transferred, not copied). */
export function transferables(result: unknown): ArrayBuffer[] {
  const buffers: ArrayBuffer[] = [];
  if (result && typeof result === 'object') {
    for (const value of Object.values(result as Record<string, unknown>)) {
      if (ArrayBuffer.isView(value) && value.buffer instanceof ArrayBuffer && !buffers.includes(value.buffer)) buffers.push(value.buffer);
    }
  }
  return buffers;
}

export function errorInfo(error: unknown): SimErrorInfo {
  if (error instanceof InputRangeError) {
    const value = typeof error.value === 'number' || typeof error.value === 'string' ? error.value : undefined;
    return { name: error.name, message: error.message, field: error.field, range: error.range, value };
  }
  if (error instanceof Error) return { name: error.name, message: error.message };
  return { name: 'Error', message: String(error) };
}

/**
 * Run one request and report through `post` (progress at most every 1 % or 100 ms; for peakProfile a coarse
 * 'partial' result first; then one result or error).
 * `post` receives the transfer list for result messages.
 */
export function runRequest(request: SimRequest, post: (message: SimResponse, transfer?: ArrayBuffer[]) => void, now: () => number = Date.now): void {
  const { id } = request;
  let lastFraction = -1;
  let lastTime = -Infinity;
  const onProgress = (fraction: number): void => {
    const t = now();
    if (fraction >= 1 || fraction - lastFraction >= 0.01 || t - lastTime >= 100) {
      lastFraction = fraction;
      lastTime = t;
      post({ id, type: 'progress', fraction });
    }
  };
  try {
    let result: unknown;
    switch (request.kind) {
      case 'transmission':
        result = transmission(request.params as TransmissionParams);
        onProgress(1);
        break;
      case 'peakProfile':
        // Coarse complete profile first (posted as 'partial'), then the refined one.
        result = peakProfileProgressive(request.params as PeakProfileParams, {
          onProgress,
          onCoarse: (coarse) => post({ id, type: 'partial', coarse: true, result: coarse }, transferables(coarse)),
        });
        break;
      case 'transmissionVsResolution':
        result = transmissionVsResolution(request.params as TransmissionVsResolutionParams, { onProgress });
        break;
      case 'peakFit':
        result = fitPeak(request.params as PeakFitRequest, { onProgress });
        break;
      default:
        throw new Error(`Unknown simulation kind: ${String((request as { kind: unknown }).kind)}`);
    }
    post({ id, type: 'result', result }, transferables(result));
  } catch (error) {
    if (error instanceof PeakCancelledError) return;
    post({ id, type: 'error', error: errorInfo(error) });
  }
}
