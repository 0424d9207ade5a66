// Peak-simulation worker: a thin adapter that runs engine calls off the main thread.
// Compiled with the WebWorker library only (tsconfig.worker.json): no DOM here.
import { runRequest, type SimRequest } from './simProtocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<SimRequest>) => {
  runRequest(event.data, (message, transfer) => scope.postMessage(message, transfer ?? []));
};
