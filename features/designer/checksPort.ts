import type { ChecksPort } from './checksProtocol';
import { inPagePort } from './checksProtocol';

/** Away from the browser the checks run in the page, answered after the current task. */
export function openChecksPort(): ChecksPort {
  return inPagePort();
}
