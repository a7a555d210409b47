import { FrameWaiting } from '../../features/auth/FrameWaiting';
import { screenInSteps } from '../../features/ui/screenInSteps';

/**
 * The signed-in area's layout. Expo Router loads every layout's script as the
 * app starts, on every page, so this one holds almost nothing: the frame and
 * everything it needs (zod, the shared schemas, the query cache) arrive as a
 * script of their own when the area is first shown. On the server (the build's
 * pre-rendering and the per-request drawing of signed-in pages) the frame is
 * part of the bundle and drawn at once; `process.env.EXPO_SERVER` is a
 * constant in each build, so the browser's script keeps only the `import()`.
 */
export default screenInSteps(
  [],
  process.env.EXPO_SERVER
    ? () => (require('../../features/auth/ShopFrameInSteps') as typeof import('../../features/auth/ShopFrameInSteps')).ShopFrameInSteps
    : () => import('../../features/auth/ShopFrameInSteps').then((m) => m.ShopFrameInSteps),
  FrameWaiting,
);
