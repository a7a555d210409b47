import { screenInSteps } from '../ui/screenInSteps';
import { FrameWaiting } from './FrameWaiting';

/**
 * The signed-in frame with its query cache, its code (zod and the shared
 * schemas, the query library, the frame) evaluated a group per task before it
 * is first drawn, with the frame's own wheel meanwhile.
 */
export const ShopFrameInSteps = screenInSteps(
  [
    () => require('../api/zodCore'),
    () => require('../api/zodJitless'),
    () => require('../text/schema'),
    () => require('./schema'),
    () => require('../api/client'),
    () => require('../api/queryClient'),
    () => require('./queries'),
    () => require('./SignedInFrame'),
  ],
  () => (require('./ShopFrame') as typeof import('./ShopFrame')).ShopFrame,
  FrameWaiting,
);
