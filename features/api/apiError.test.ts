import { afterEach, describe, expect, it } from 'vitest';
import { ApiError, callApi } from './apiError';

/** The browser's fetch replaced by one answering as the test says; the request it got is kept. */
function answerWith(answer: () => Promise<Response>) {
  const seen: { url: string; init: RequestInit }[] = [];
  globalThis.fetch = ((url: string, init: RequestInit) => {
    seen.push({ url, init });
    return answer();
  }) as typeof fetch;
  return seen;
}
const browserFetch = globalThis.fetch;
afterEach(() => {
  globalThis.fetch = browserFetch;
});

describe('calling the API without a schema library', () => {
  it('sends JSON to /api with the session cookie and returns the answer', async () => {
    const seen = answerWith(async () => Response.json({ ok: true }));
    expect(await callApi('POST', '/auth/sign-in', { email: 'a@b.example' })).toEqual({ status: 200, payload: { ok: true } });
    expect(seen[0]!.url).toBe('/api/auth/sign-in');
    expect(seen[0]!.init).toMatchObject({ method: 'POST', credentials: 'same-origin', headers: { 'Content-Type': 'application/json' }, body: '{"email":"a@b.example"}' });
  });

  it("throws the server's code, message and named fields for a refused request", async () => {
    const body = { error: { code: 'invalid_input', message: 'Check the highlighted fields', fields: { email: 'Enter your e-mail address', odd: 3 }, requestId: 'r1' } };
    answerWith(async () => Response.json(body, { status: 400 }));
    const error = await callApi('POST', '/auth/sign-in', {}).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'invalid_input', message: 'Check the highlighted fields', fields: { email: 'Enter your e-mail address' }, body });
  });

  it('says the status when the answer is not an error body, and that the server is out of reach when the fetch fails', async () => {
    answerWith(async () => new Response('<html>proxy error</html>', { status: 502 }));
    await expect(callApi('GET', '/auth/me')).rejects.toMatchObject({ status: 502, code: 'unexpected', message: 'The server answered 502' });
    answerWith(async () => {
      throw new TypeError('Failed to fetch');
    });
    await expect(callApi('GET', '/auth/me')).rejects.toMatchObject({ status: 0, code: 'offline' });
  });

  it('sends a file form as it is, leaving its Content-Type to the browser', async () => {
    const seen = answerWith(async () => Response.json({ photo: { id: 'p1' } }, { status: 201 }));
    const form = new FormData();
    form.append('photo', new Blob(['x']), 'a.jpg');
    await callApi('POST', '/pieces/1/photos', form);
    expect(seen[0]!.init.body).toBe(form);
    expect(seen[0]!.init.headers).toEqual({});
  });
});
