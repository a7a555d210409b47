import type { ChecksReply, ChecksRequest } from './checksProtocol';
import { createChecksResponder } from './checksProtocol';

/**
 * The designer's checks off the page's thread: a Web Worker that answers
 * each layout with its findings (checksProtocol.ts). The engine is the same
 * pure geometry the page and the server use.
 */
interface WorkerScope {
  onmessage: ((event: { data: ChecksRequest }) => void) | null;
  postMessage(message: ChecksReply): void;
}

const scope = globalThis as unknown as WorkerScope;
const respond = createChecksResponder();
scope.onmessage = (event) => scope.postMessage(respond(event.data));
