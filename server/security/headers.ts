import type { RequestHandler } from 'express';
import helmet from 'helmet';

/**
 * The Content-Security-Policy the exported web app runs under (checked by the
 * browser tests): scripts, fonts and data only from this origin. react-native-web
 * writes <style> elements at run time, so styles keep 'unsafe-inline'; photos
 * previewed before upload are blob: URLs.
 */
export function contentSecurityPolicy(https: boolean, imageOrigins: readonly string[] = []): Record<string, string[]> {
  const directives: Record<string, string[]> = {
    'default-src': ["'self'"],
    'script-src': ["'self'"],
    'style-src': ["'self'", "'unsafe-inline'"],
    // Photos come from the bucket's presigned addresses when storage is S3.
    'img-src': ["'self'", 'data:', 'blob:', ...imageOrigins],
    'font-src': ["'self'", 'data:'],
    'connect-src': ["'self'"],
    'worker-src': ["'self'", 'blob:'],
    'object-src': ["'none'"],
    'base-uri': ["'self'"],
    'form-action': ["'self'"],
    'frame-ancestors': ["'none'"],
  };
  // Only where the site is served over https; on plain http (loopback) it would break every request.
  if (https) directives['upgrade-insecure-requests'] = [];
  return directives;
}

/** One year, the usual value for sites that are always https (and the minimum for browsers' preload lists). */
export const HSTS_MAX_AGE_S = 365 * 24 * 60 * 60;

/** helmet's headers on every response: app, API and photos alike. */
export function securityHeaders(https: boolean, imageOrigins: readonly string[] = []): RequestHandler {
  return helmet({
    contentSecurityPolicy: { useDefaults: false, directives: contentSecurityPolicy(https, imageOrigins) },
    strictTransportSecurity: https ? { maxAge: HSTS_MAX_AGE_S, includeSubDomains: true } : false,
    referrerPolicy: { policy: 'strict-origin-when-cross-origin' },
    xFrameOptions: { action: 'deny' },
    xContentTypeOptions: true,
    crossOriginEmbedderPolicy: false,
  });
}
