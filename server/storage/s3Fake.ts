import fs from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import { checkSignature } from './signatureCheck';
import type { S3Settings } from './s3Storage';

export interface S3Fake {
  /** Settings for `s3Storage`, pointing at the signature-checking front of the fake. */
  settings: S3Settings;
  close(): Promise<void>;
}

export interface S3FakeOptions {
  /** Where the fake keeps objects; a fresh temporary folder when left out (deleted on close). */
  directory?: string;
  /** Port of the front browsers and the SDK talk to; 0 picks a free one. */
  port?: number;
  bucket?: string;
}

// s3rver's one built-in account; the gate checks signatures against the same pair.
const LOCAL_KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

function refuse(res: http.ServerResponse, code: string, message: string) {
  res.writeHead(403, { 'Content-Type': 'application/xml' });
  res.end(`<?xml version="1.0" encoding="UTF-8"?><Error><Code>${code}</Code><Message>${message}</Message></Error>`);
}

/**
 * A signature gate in front of s3rver: s3rver stores and serves objects like
 * S3 but accepts any signature and any expired presigned URL, so every request
 * is checked here first (signatureCheck.ts) and only a valid one is passed on.
 */
function startGate(target: number, port: number): Promise<http.Server> {
  const gate = http.createServer((req, res) => {
    const verdict = checkSignature({ method: req.method ?? 'GET', url: req.url ?? '/', headers: req.headers }, LOCAL_KEYS);
    if (!verdict.ok) {
      req.resume();
      return refuse(res, verdict.code, verdict.message);
    }
    const upstream = http.request({ host: '127.0.0.1', port: target, method: req.method, path: req.url, headers: req.headers }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on('error', () => {
      if (!res.headersSent) res.writeHead(502);
      res.end();
    });
    req.pipe(upstream);
  });
  gate.keepAliveTimeout = 5000;
  return new Promise((resolve, reject) => {
    gate.once('error', reject);
    gate.listen(port, '127.0.0.1', () => resolve(gate));
  });
}

/** Settings for a fake another process on this machine already serves on `port` (same keys and bucket). */
export function runningS3FakeSettings(port: number, bucket = 'matwright-local'): S3Settings {
  return { endpoint: `http://127.0.0.1:${port}`, bucket, region: 'us-east-1', ...LOCAL_KEYS };
}

/** Starts s3rver on loopback behind the signature gate, with the bucket created. */
export async function startS3Fake(options: S3FakeOptions = {}): Promise<S3Fake> {
  const bucket = options.bucket ?? 'matwright-local';
  const ownFolder = !options.directory;
  const directory = options.directory ?? (await fs.mkdtemp(path.join(os.tmpdir(), 'matwright-s3-')));
  await fs.mkdir(directory, { recursive: true });
  const store = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory, configureBuckets: [{ name: bucket }] });
  const inner = (await store.run()) as AddressInfo;
  const gate = await startGate(inner.port, options.port ?? 0).catch(async (err: unknown) => {
    await store.close();
    throw err;
  });
  const endpoint = `http://127.0.0.1:${(gate.address() as AddressInfo).port}`;
  return {
    settings: { endpoint, bucket, region: 'us-east-1', ...LOCAL_KEYS },
    async close() {
      gate.closeAllConnections();
      await new Promise<void>((resolve) => gate.close(() => resolve()));
      await store.close();
      if (ownFolder) await fs.rm(directory, { recursive: true, force: true });
    },
  };
}
