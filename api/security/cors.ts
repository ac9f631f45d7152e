import type { RequestHandler } from 'express';

// Cross-origin access exists only for origins an operator lists in CORS_ORIGINS (a
// separate client on another host). With none listed this middleware is not mounted
// at all: the browser's same-origin rule then keeps every other site out.

const ALLOWED_METHODS = 'GET, HEAD, POST, PATCH, DELETE';
const ALLOWED_HEADERS = 'Content-Type, Authorization, Accept';

/** Validates CORS_ORIGINS: a comma-separated list of http(s) origins (scheme, host and port only). */
export function parseCorsOrigins(value: string | undefined): string[] {
  if (value === undefined || value.trim() === '') return [];
  return value.split(',').map((entry) => {
    const raw = entry.trim();
    let url: URL;
    try {
      url = new URL(raw);
    } catch {
      throw new Error(`CORS_ORIGINS must list origins like https://club.example, got "${raw}"`);
    }
    if (
      (url.protocol !== 'http:' && url.protocol !== 'https:') ||
      url.origin !== raw.replace(/\/+$/, '').toLowerCase()
    ) {
      throw new Error(`CORS_ORIGINS must list bare http(s) origins (no path), got "${raw}"`);
    }
    return url.origin;
  });
}

/** The CORS middleware for the listed origins, or null when none are configured. */
export function corsIfConfigured(origins: readonly string[]): RequestHandler | null {
  if (origins.length === 0) return null;
  const allowed = new Set(origins.map((origin) => origin.toLowerCase()));
  return (req, res, next) => {
    res.vary('Origin');
    const origin = req.get('origin');
    if (origin === undefined || !allowed.has(origin.toLowerCase())) return next();
    res.set('Access-Control-Allow-Origin', origin);
    res.set('Access-Control-Allow-Credentials', 'true');
    if (req.method === 'OPTIONS' && req.get('access-control-request-method') !== undefined) {
      res.set('Access-Control-Allow-Methods', ALLOWED_METHODS);
      res.set('Access-Control-Allow-Headers', ALLOWED_HEADERS);
      res.set('Access-Control-Max-Age', '600');
      res.status(204).end();
      return;
    }
    next();
  };
}
