import { jobListPath, initialJobFilters, jobListQueryFor } from '../jobs/listRequest';

/**
 * The API reads a signed-in page starts with, by the page's path, so the
 * server can name them in the page's response (a `Link: rel=preload`
 * header) and the browser fetches them while the app's code is still on
 * its way, instead of one after the other once it runs. Every path here is
 * exactly what the page's own queries ask for (same builders), or the
 * preloaded answer would go unused.
 */

const ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Pages anyone may open; they read nothing that needs a session. */
const PUBLIC = /^\/(sign-in|sign-up|join\/[^/]+)\/?$/;

export function firstRequests(pagePath: string, today: Date): string[] {
  if (PUBLIC.test(pagePath) || pagePath.startsWith('/api/')) return [];
  const me = '/auth/me';
  if (pagePath === '/' || pagePath === '') return [me, jobListPath(jobListQueryFor(initialJobFilters, today), 0)].map(api);
  const designer = /^\/layouts\/([^/]+)\/?$/.exec(pagePath);
  if (designer) {
    const id = designer[1]!;
    return ID.test(id) ? [me, `/layouts/${id}`, '/settings'].map(api) : [api(me)];
  }
  const job = /^\/jobs\/([^/]+)\/?$/.exec(pagePath);
  if (job && ID.test(job[1]!)) return [me, `/jobs/${job[1]}`].map(api);
  return [api(me)];
}

const api = (path: string) => `/api${path}`;
