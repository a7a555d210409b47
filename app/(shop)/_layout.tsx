import { startTransition, useEffect, useState, type ComponentType } from 'react';
import { FrameWaiting } from '../../features/auth/FrameWaiting';

/**
 * The signed-in area's layout. Expo Router loads every layout's script as the
 * app starts, on every page, so this one holds almost nothing: the frame and
 * everything it needs (zod, the shared schemas, the query cache) arrive as a
 * script of their own when the area is first shown. The build pre-renders the
 * frame's wheel, and the first render here draws the same.
 */
let loaded: ComponentType | null = null;

export default function ShopLayout() {
  const [Frame, setFrame] = useState<ComponentType | null>(() => loaded);
  const [failure, setFailure] = useState<{ error: unknown } | null>(null);
  useEffect(() => {
    if (Frame) return;
    let live = true;
    import('../../features/auth/ShopFrameInSteps').then(
      ({ ShopFrameInSteps }) => {
        loaded = ShopFrameInSteps;
        if (live) startTransition(() => setFrame(() => ShopFrameInSteps));
      },
      (error: unknown) => live && setFailure({ error }),
    );
    return () => {
      live = false;
    };
  }, [Frame]);
  // A script that cannot be fetched (offline) is the page's error, with a way to try again.
  if (failure) throw failure.error;
  return Frame ? <Frame /> : <FrameWaiting />;
}
