import { dehydrate, hydrate, QueryClient, type DehydratedState } from '@tanstack/react-query';
import { currentPageDrawing, FIRST_READS_ID } from './pageDrawing';

const newClient = () => new QueryClient({ defaultOptions: { queries: { staleTime: 15_000 } } });

/**
 * The query cache of a signed-in visit. A page the server drew with its data
 * carries the reads it was drawn with as a JSON block; the cache starts with
 * them, so the browser's first render draws exactly what the server drew,
 * React adopts that markup, and nothing is asked of the API again until the
 * reads grow stale. The block is taken once: a later sign-in starts empty.
 *
 * On the server, the drawing's cache is kept across the drawing's passes, and
 * the drawing is given the means to fill it (see server/pages/drawPage.ts).
 */
export function signedInQueryClient(): QueryClient {
  const drawing = currentPageDrawing();
  if (drawing) {
    const cached = clients.get(drawing);
    if (cached) return cached;
    const client = newClient();
    clients.set(drawing, client);
    const queries = () => client.getQueryCache().findAll();
    drawing.readPending = async () => {
      const missing = queries().filter((q) => q.state.status === 'pending' && q.state.fetchStatus === 'idle');
      await Promise.all(missing.map((q) => client.prefetchQuery({ ...q.options, queryKey: q.queryKey })));
      return missing.length;
    };
    drawing.anyFailed = () => queries().find((q) => q.state.status === 'error')?.state.error?.message ?? false;
    drawing.reads = () => dehydrate(client);
    return client;
  }
  const client = newClient();
  const reads = firstReads();
  if (typeof reads === 'object' && reads !== null) {
    try {
      hydrate(client, reads as DehydratedState);
    } catch {
      // Reads that cannot be taken in are read again from the API.
    }
  }
  return client;
}

let taken: { reads: unknown } | null = null;

/**
 * The page's reads, parsed once: React may start the frame's first render more than once
 * before keeping one (a render it set aside while code was still loading), and each start
 * must find the same reads.
 */
function firstReads(): unknown {
  if (taken === null) {
    const block = typeof document === 'undefined' ? null : document.getElementById(FIRST_READS_ID);
    let reads: unknown;
    try {
      reads = block ? JSON.parse(block.textContent ?? '') : undefined;
    } catch {
      reads = undefined;
    }
    block?.remove();
    taken = { reads };
  }
  return taken.reads;
}

/** Once the frame is on screen, the page's reads are spent: a later sign-in starts with an empty cache. */
export function forgetFirstReads(): void {
  taken = { reads: undefined };
}

const clients = new WeakMap<object, QueryClient>();
