/** One kind of request the load sends, and the status it should get. */
export type RequestKind = 'read' | 'save' | 'upload';

export interface LoadTarget {
  url: string;
  cookie: string;
  jobId: string;
  pieceId: string;
  photo: Buffer;
}

export interface Outcome {
  kind: RequestKind;
  ok: boolean;
  status: number;
  ms: number;
  error?: string;
}

const expected: Record<RequestKind, number> = { read: 200, save: 200, upload: 201 };

/** Six reads, three saves and one upload in every ten requests, in a fixed order. */
export function kindOf(n: number): RequestKind {
  const slot = n % 10;
  return slot < 6 ? 'read' : slot < 9 ? 'save' : 'upload';
}

function requestFor(kind: RequestKind, t: LoadTarget, n: number): [string, RequestInit] {
  const headers = { cookie: t.cookie };
  if (kind === 'read') return [n % 2 ? `${t.url}/api/jobs` : `${t.url}/api/jobs/${t.jobId}`, { headers }];
  if (kind === 'save') {
    return [`${t.url}/api/jobs/${t.jobId}`, { method: 'PATCH', headers: { ...headers, 'content-type': 'application/json' }, body: JSON.stringify({ notes: `Restart check note ${n}` }) }];
  }
  const form = new FormData();
  form.append('photo', new Blob([new Uint8Array(t.photo)], { type: 'image/png' }), `board-${n}.png`);
  return [`${t.url}/api/jobs/${t.jobId}/pieces/${t.pieceId}/photos`, { method: 'POST', headers, body: form }];
}

/** Sends request number `n` and reports whether it got the answer it should. */
export async function sendOne(t: LoadTarget, n: number): Promise<Outcome> {
  const kind = kindOf(n);
  const started = performance.now();
  try {
    const [url, init] = requestFor(kind, t, n);
    const res = await fetch(url, { ...init, signal: AbortSignal.timeout(30_000) });
    const text = await res.text();
    const ok = res.status === expected[kind];
    return { kind, ok, status: res.status, ms: performance.now() - started, ...(ok ? {} : { error: text.slice(0, 200) }) };
  } catch (err) {
    return { kind, ok: false, status: 0, ms: performance.now() - started, error: err instanceof Error ? `${err.message} ${String((err as { cause?: unknown }).cause ?? '')}` : String(err) };
  }
}

/**
 * Runs `concurrency` request loops until `keepGoing()` says stop (after at
 * least the minimum) or the hard cap is reached; bounded in count and in
 * requests at once.
 */
export async function runLoad(t: LoadTarget, options: { concurrency: number; cap: number; keepGoing: (sent: number) => boolean }): Promise<Outcome[]> {
  const outcomes: Outcome[] = [];
  let sent = 0;
  const loop = async () => {
    while (sent < options.cap && options.keepGoing(sent)) {
      const n = sent++;
      outcomes.push(await sendOne(t, n));
    }
  };
  await Promise.all(Array.from({ length: options.concurrency }, loop));
  return outcomes;
}

export function percentile(values: number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}
