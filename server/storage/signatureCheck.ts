import { createHash, createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Checks an S3 request's AWS Signature Version 4, written from AWS's published
 * description ("Authenticating Requests: AWS Signature Version 4", Amazon S3 API
 * reference), for both forms: the Authorization header the SDK sends and the
 * query-string form of a presigned URL, including its X-Amz-Date + X-Amz-Expires
 * lifetime. The local S3 fake (s3rver) checks neither, so the fake puts this in
 * front of it and refuses what a real store would refuse.
 */
export interface SignedRequest {
  method: string;
  /** Path and query exactly as received, e.g. /bucket/photos/a.jpg?X-Amz-Date=... */
  url: string;
  headers: Record<string, string | string[] | undefined>;
}

export type SignatureVerdict = { ok: true } | { ok: false; code: 'AccessDenied' | 'SignatureDoesNotMatch' | 'InvalidAccessKeyId'; message: string };

/** Longest lifetime S3 accepts for a presigned URL: seven days. */
const MAX_EXPIRES_S = 7 * 24 * 3600;
/** Clock difference S3 tolerates between the signer and itself: fifteen minutes. */
const CLOCK_SKEW_MS = 15 * 60 * 1000;

// RFC 3986 unreserved characters stay; everything else is percent-encoded, as SigV4 requires.
const encodeRfc3986 = (text: string) => encodeURIComponent(text).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const sha256Hex = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');
const hmac = (key: Buffer | string, text: string) => createHmac('sha256', key).update(text, 'utf8').digest();

function parseAmzDate(value: string): number | null {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(value);
  return m ? Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!) : null;
}

function canonicalQuery(pairs: [string, string][]): string {
  return pairs
    .map(([k, v]) => [encodeRfc3986(k), encodeRfc3986(v)] as const)
    .sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
}

function canonicalPath(rawPath: string): string {
  // S3 signs each segment encoded once; decoding first makes %2F-style input and plain input agree.
  return rawPath.split('/').map((s) => encodeRfc3986(decodeURIComponent(s))).join('/') || '/';
}

function headerValue(headers: SignedRequest['headers'], name: string): string | undefined {
  const v = headers[name];
  return Array.isArray(v) ? v.join(',') : v;
}

interface Credential {
  accessKeyId: string;
  scope: string;
  date: string;
  region: string;
  service: string;
}

function parseCredential(value: string): Credential | null {
  const parts = value.split('/');
  if (parts.length !== 5 || parts[4] !== 'aws4_request') return null;
  return { accessKeyId: parts[0]!, date: parts[1]!, region: parts[2]!, service: parts[3]!, scope: parts.slice(1).join('/') };
}

interface Parsed {
  credential: Credential;
  amzDate: string;
  signedHeaders: string[];
  signature: string;
  payloadHash: string;
  query: [string, string][];
  expiresS: number | null;
}

function parseRequest(req: SignedRequest, url: URL): Parsed | null {
  const all = [...url.searchParams.entries()];
  const presigned = url.searchParams.get('X-Amz-Algorithm');
  if (presigned !== null) {
    const credential = parseCredential(url.searchParams.get('X-Amz-Credential') ?? '');
    const expires = Number(url.searchParams.get('X-Amz-Expires'));
    if (presigned !== 'AWS4-HMAC-SHA256' || !credential || !Number.isInteger(expires)) return null;
    return {
      credential,
      amzDate: url.searchParams.get('X-Amz-Date') ?? '',
      signedHeaders: (url.searchParams.get('X-Amz-SignedHeaders') ?? '').split(';'),
      signature: url.searchParams.get('X-Amz-Signature') ?? '',
      payloadHash: 'UNSIGNED-PAYLOAD',
      query: all.filter(([k]) => k !== 'X-Amz-Signature'),
      expiresS: expires,
    };
  }
  const auth = /^AWS4-HMAC-SHA256 Credential=([^,]+), ?SignedHeaders=([^,]+), ?Signature=([0-9a-f]+)$/.exec(headerValue(req.headers, 'authorization') ?? '');
  const credential = auth ? parseCredential(auth[1]!) : null;
  if (!auth || !credential) return null;
  return {
    credential,
    amzDate: headerValue(req.headers, 'x-amz-date') ?? '',
    signedHeaders: auth[2]!.split(';'),
    signature: auth[3]!,
    payloadHash: headerValue(req.headers, 'x-amz-content-sha256') ?? 'UNSIGNED-PAYLOAD',
    query: all,
    expiresS: null,
  };
}

function expectedSignature(req: SignedRequest, url: URL, p: Parsed, secret: string): string {
  const headers = p.signedHeaders.map((name) => `${name}:${(headerValue(req.headers, name) ?? '').trim().replace(/\s+/g, ' ')}\n`).join('');
  const canonicalRequest = [req.method, canonicalPath(url.pathname), canonicalQuery(p.query), headers, p.signedHeaders.join(';'), p.payloadHash].join('\n');
  const stringToSign = ['AWS4-HMAC-SHA256', p.amzDate, p.credential.scope, sha256Hex(canonicalRequest)].join('\n');
  const key = ['aws4_request'].reduce(
    (k, part) => hmac(k, part),
    hmac(hmac(hmac(`AWS4${secret}`, p.credential.date), p.credential.region), p.credential.service),
  );
  return hmac(key, stringToSign).toString('hex');
}

const denied = (code: Exclude<SignatureVerdict, { ok: true }>['code'], message: string): SignatureVerdict => ({ ok: false, code, message });

/** Whether `req` carries a valid, unexpired signature by the holder of `secret` for `accessKeyId`. */
export function checkSignature(req: SignedRequest, keys: { accessKeyId: string; secretAccessKey: string }, now = Date.now()): SignatureVerdict {
  const url = new URL(req.url, 'http://signature.check');
  const p = parseRequest(req, url);
  if (!p) return denied('AccessDenied', 'The request is not signed with AWS Signature Version 4');
  if (p.credential.accessKeyId !== keys.accessKeyId) return denied('InvalidAccessKeyId', 'The access key is not known here');
  const signedAt = parseAmzDate(p.amzDate);
  if (signedAt === null || !p.signedHeaders.includes('host') || p.credential.date !== p.amzDate.slice(0, 8)) {
    return denied('AccessDenied', 'The signature is missing its date, scope or host');
  }
  if (p.expiresS !== null) {
    if (p.expiresS < 1 || p.expiresS > MAX_EXPIRES_S) return denied('AccessDenied', 'X-Amz-Expires must be between 1 and 604800 seconds');
    if (now > signedAt + p.expiresS * 1000) return denied('AccessDenied', 'Request has expired');
  } else if (Math.abs(now - signedAt) > CLOCK_SKEW_MS) {
    return denied('AccessDenied', 'The difference between the request time and the current time is too large');
  }
  if (signedAt - now > CLOCK_SKEW_MS) return denied('AccessDenied', 'The request is dated in the future');
  const want = Buffer.from(expectedSignature(req, url, p, keys.secretAccessKey));
  const got = Buffer.from(p.signature);
  if (want.length !== got.length || !timingSafeEqual(want, got)) return denied('SignatureDoesNotMatch', 'The request signature does not match');
  return { ok: true };
}
