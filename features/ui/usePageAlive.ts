import { startTransition, useEffect, useState } from 'react';

/** Set once the first screen has been committed; every later mount starts alive. */
let pageAlive = false;

/**
 * False while React is adopting a pre-rendered page (and when the page is drawn at build
 * time), true once the page is alive; a screen the app draws in the browser afterwards is
 * alive from its first render, so nothing flickers there.
 *
 * Plain state rather than an external store: a store whose build-time value differs from the
 * browser's makes React redo the whole page synchronously right after adopting it (measured:
 * about 290 ms on a phone-speed CPU); this re-renders only the few components that ask.
 */
export function usePageAlive(): boolean {
  const [alive, setAlive] = useState(pageAlive);
  useEffect(() => {
    pageAlive = true;
    // As a transition: drawn in slices apart from the framework's own update right after mounting
    // (its navigation state), not added to that update's single task.
    if (!alive) startTransition(() => setAlive(true));
  }, [alive]);
  return alive;
}
