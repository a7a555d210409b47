import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client, type S3ClientConfig } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { Readable } from 'node:stream';
import { assertStorageKey, LIST_LIMIT, type ListedObject, type Storage } from './storage';

export interface S3Settings {
  /** e.g. https://s3.eu-central-1.example.com or http://127.0.0.1:9000 for a local fake; empty for AWS itself. */
  endpoint?: string;
  /** The address browsers use for presigned downloads when it differs from `endpoint` (a fake behind a proxy, a CDN). */
  publicEndpoint?: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/**
 * Client options that work with AWS and with S3-compatible stores: checksums
 * only when an operation requires them (otherwise a streamed put is stored with
 * its chunk framing by some stores), and bucket-in-path addressing so a
 * loopback endpoint needs no wildcard DNS.
 */
function clientConfig(settings: S3Settings, endpoint: string | undefined): S3ClientConfig {
  return {
    region: settings.region,
    ...(endpoint ? { endpoint } : {}),
    forcePathStyle: true,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
  };
}

const isMissing = (err: unknown) => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

/** Photos and files in one bucket of any S3-compatible store; keys are the same as the local folder's paths. */
export function s3Storage(settings: S3Settings): Storage & { client: S3Client } {
  const client = new S3Client(clientConfig(settings, settings.endpoint));
  const signer = settings.publicEndpoint ? new S3Client(clientConfig(settings, settings.publicEndpoint)) : client;
  const Bucket = settings.bucket;
  const browserEndpoint = settings.publicEndpoint ?? settings.endpoint;

  return {
    client,
    downloadOrigins: browserEndpoint ? [new URL(browserEndpoint).origin] : [`https://${Bucket}.s3.${settings.region}.amazonaws.com`, `https://s3.${settings.region}.amazonaws.com`],

    async put(key, bytes, contentType) {
      assertStorageKey(key);
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length }));
    },

    async get(key) {
      assertStorageKey(key);
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        return { body: out.Body as Readable, bytes: Number(out.ContentLength ?? 0) };
      } catch (err) {
        if (isMissing(err)) return null;
        throw err;
      }
    },

    async delete(key) {
      assertStorageKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },

    async list(prefix = '') {
      const found: ListedObject[] = [];
      let token: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix || undefined, ContinuationToken: token }));
        for (const item of page.Contents ?? []) if (item.Key) found.push({ key: item.Key, bytes: Number(item.Size ?? 0) });
        if (found.length > LIST_LIMIT) throw new Error(`More than ${LIST_LIMIT} stored objects; list a narrower prefix`);
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
      return found.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
    },

    async downloadUrl(key, options) {
      assertStorageKey(key);
      const command = new GetObjectCommand({
        Bucket,
        Key: key,
        ResponseContentType: options.contentType,
        ResponseContentDisposition: 'inline',
        ResponseCacheControl: `private, max-age=${options.expiresInS}`,
      });
      return getSignedUrl(signer, command, { expiresIn: options.expiresInS });
    },
  };
}
