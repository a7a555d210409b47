import { useSyncExternalStore } from 'react';

const noSubscription = () => () => {};

/**
 * False while React is adopting a pre-rendered page (and when the page is drawn at build
 * time), true once the page is alive; a screen the app draws in the browser is alive from
 * its first render, so nothing flickers there.
 */
export function usePageAlive(): boolean {
  return useSyncExternalStore(noSubscription, () => true, () => false);
}
