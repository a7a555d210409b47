import type { ChecksPort, ChecksRequest } from './checksProtocol';
import { inPagePort } from './checksProtocol';

/**
 * In the browser the checks run in a Web Worker (bundled from
 * checksWorker.ts as a file of its own), so a drag's checks never hold up
 * the page. Where a worker cannot start or fails, the same checks run in
 * the page and the question in hand is asked again there.
 */
export function openChecksPort(): ChecksPort {
  let inPage: ChecksPort | null = null;
  let worker: Worker | null = null;
  let last: ChecksRequest | null = null;
  const port: ChecksPort = {
    onmessage: null,
    postMessage: (message) => {
      last = message;
      if (worker) worker.postMessage(message);
      else inPage?.postMessage(message);
    },
    close: () => {
      worker?.terminate();
      inPage?.close();
    },
  };
  const fallBack = () => {
    worker?.terminate();
    worker = null;
    inPage = inPagePort();
    inPage.onmessage = (event) => port.onmessage?.(event);
    if (last) inPage.postMessage(last);
  };
  if (typeof Worker === 'undefined') fallBack();
  else {
    try {
      worker = new Worker(new URL('./checksWorker', import.meta.url));
      worker.onmessage = (event: MessageEvent) => port.onmessage?.(event);
      worker.onerror = fallBack;
    } catch {
      fallBack();
    }
  }
  return port;
}
