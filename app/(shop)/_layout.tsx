import { FrameWaiting } from '../../features/auth/FrameWaiting';
import { screenInSteps } from '../../features/ui/screenInSteps';

/**
 * The signed-in area's layout. Expo Router loads every layout's script as the
 * app starts, on every page, so this one holds almost nothing: the frame and
 * everything it needs (zod, the shared schemas, the query cache) arrive as a
 * script of their own when the area is first shown. The build pre-renders the
 * frame's wheel, and the first render here draws the same.
 */
export default screenInSteps(
  [],
  () => import('../../features/auth/ShopFrameInSteps').then((m) => m.ShopFrameInSteps),
  FrameWaiting,
);
