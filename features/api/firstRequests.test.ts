import { describe, expect, it } from 'vitest';
import { firstRequests } from './firstRequests';

const today = new Date(2026, 11, 3);
const layoutId = '0b5e1c2a-7d4f-4e8a-9c61-2f3a4b5c6d7e';

describe('the API reads a page starts with', () => {
  it('are none for the pages anyone may open', () => {
    for (const page of ['/sign-in', '/sign-up', '/join/abc', '/join/abc/']) expect(firstRequests(page, today), page).toEqual([]);
  });

  it('are who is signed in, and on the jobs list its first page of open work', () => {
    const [me, list, ...rest] = firstRequests('/', today);
    expect(me).toBe('/api/auth/me');
    expect(rest).toEqual([]);
    const url = new URL(list!, 'http://x');
    expect(url.pathname).toBe('/api/jobs');
    expect(url.searchParams.get('status')!.split(',')).not.toContain('shipped');
    expect(url.searchParams.get('offset')).toBe('0');
  });

  it("are the layout and the shop's settings in the designer, for a well-formed id only", () => {
    expect(firstRequests(`/layouts/${layoutId}`, today)).toEqual(['/api/auth/me', `/api/layouts/${layoutId}`, '/api/settings']);
    expect(firstRequests('/layouts/not-an-id', today)).toEqual(['/api/auth/me']);
    expect(firstRequests('/layouts/..%2F..%2Fapi', today)).toEqual(['/api/auth/me']);
  });

  it('are the job on its page, for a well-formed id only (not the new-job form)', () => {
    expect(firstRequests(`/jobs/${layoutId}`, today)).toEqual(['/api/auth/me', `/api/jobs/${layoutId}`]);
    expect(firstRequests('/jobs/new', today)).toEqual(['/api/auth/me']);
    expect(firstRequests('/jobs/not-an-id', today)).toEqual(['/api/auth/me']);
  });

  it('are who is signed in on every other signed-in page', () => {
    for (const page of ['/customers', '/jobs/new', '/settings']) expect(firstRequests(page, today), page).toEqual(['/api/auth/me']);
  });
});
