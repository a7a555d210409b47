import { FIRST_READS_ID } from '../api/pageDrawing';

/** Longest the drawn page stays up while the app's own is still loading something. */
const MAX_WAIT_MS = 15_000;

/**
 * A page the server drew with the visitor's data (server/pages) stays on
 * screen, as it arrived, while the app starts; React does not adopt
 * (hydrate) it. Parts of the app arrive as scripts of their own and are
 * evaluated in steps, and React throws away markup it cannot adopt at once
 * when anything above it changes meanwhile, which showed the loading wheels
 * again over a page that was already drawn. Instead the app draws the page
 * in a hidden root of its own, from the reads the page came with (no API
 * call), and once nothing there is loading any more it takes the drawn
 * page's place between two frames: same text, same places, no shift. Until
 * then the drawn page is inert (a tap there would do nothing), which the
 * browser shows by not reacting at all, as a page whose code is on its way.
 *
 * Call it just before the app mounts. Answers whether it took over a drawn page.
 */
export function takeOverDrawnPage(): boolean {
  const drawn = document.getElementById('root');
  if (!drawn || !document.getElementById(FIRST_READS_ID)) return false;
  drawn.id = 'matwright-drawn';
  // It keeps the look #root gives it (index.html's reset) under its new id.
  drawn.style.cssText = 'display:flex;height:100%';
  drawn.inert = true;
  const root = document.createElement('div');
  root.id = 'root';
  // Laid out (screens measure themselves) but not painted until it takes over.
  root.style.cssText = 'position:absolute;inset:0;visibility:hidden';
  drawn.after(root);
  const started = performance.now();
  let quietFrames = 0;
  const check = () => {
    const loading = root.childElementCount === 0 || root.querySelector('[role="progressbar"]') !== null;
    quietFrames = loading ? 0 : quietFrames + 1;
    if (quietFrames >= 2 || performance.now() - started > MAX_WAIT_MS) {
      drawn.remove();
      root.style.cssText = '';
      return;
    }
    requestAnimationFrame(check);
  };
  requestAnimationFrame(check);
  return true;
}
