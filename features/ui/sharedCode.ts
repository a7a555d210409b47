/**
 * The pages shown before sign-in come without the script of code the
 * signed-in screens share (zod, the query cache, the schemas): the build
 * leaves it out of a page's HTML when nothing on that page needs it, and names
 * it in <meta name="matwright-shared-code">, with the scripts that can do
 * without it (scripts/webBuildFinish.mjs). Here, once the framework's script
 * loader is set up (by the `expo` package), any other script fetched later is
 * fetched together with the shared one, so signing in and going on to the
 * jobs list needs no page reload.
 */
type LoadScript = (path: string) => Promise<void>;

export function loadSharedCodeWithScreens(): void {
  if (typeof document === 'undefined') return;
  const meta = document.querySelector('meta[name="matwright-shared-code"]');
  const url = meta?.getAttribute('content');
  if (!url) return;
  const notNeededBy = new Set((meta?.getAttribute('data-not-needed-by') ?? '').split(' ').filter(Boolean));
  const loader = globalThis as { __loadBundleAsync?: LoadScript };
  const load = loader.__loadBundleAsync;
  if (!load) throw new Error('The web build has no script loader to bring in the shared code; the page cannot go on to a signed-in screen');
  let shared: Promise<void> | null = null;
  loader.__loadBundleAsync = (path) => {
    if (notNeededBy.has(path)) return load(path);
    // A failed fetch (offline) is tried again with the next script that needs it.
    shared ??= load(url).catch((error: unknown) => {
      shared = null;
      throw error;
    });
    return Promise.all([shared, load(path)]).then(() => undefined);
  };
}
