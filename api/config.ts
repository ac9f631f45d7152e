import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { parseCorsOrigins } from './security/cors';

export interface SignInLimits {
  windowMs: number;
  /** failed attempts allowed per e-mail address from one client address within the window */
  perAccount: number;
  /** failed attempts allowed per e-mail address from all client addresses together (higher) */
  perAccountAnyAddress: number;
  /** attempts allowed per client address within the window */
  perAddress: number;
}

export interface AppConfig {
  jwtSecret: string;
  tokenTtlSeconds: number;
  cookieName: string;
  /** Secure cookies need HTTPS; on plain http://127.0.0.1 the browser would drop them. */
  cookieSecure: boolean;
  /** Express "trust proxy": set behind a load balancer so rate limits see the client address. */
  trustProxy: boolean | number | string;
  jsonLimit: string;
  signInLimits: SignInLimits;
  /** Folder of the built client to serve with an SPA fallback; null serves the API only. */
  webDir: string | null;
  /** Unexpected errors are logged to stderr; tests turn this off when they provoke them. */
  logErrors: boolean;
  /** Other origins allowed to call the API from a browser (CORS_ORIGINS); none by default. */
  corsOrigins: string[];
}

export const SESSION_COOKIE = 'bindery_session';
const SEVEN_DAYS = 7 * 24 * 60 * 60;

export function defaultConfig(overrides: Partial<AppConfig> & { jwtSecret: string }): AppConfig {
  return {
    tokenTtlSeconds: SEVEN_DAYS,
    cookieName: SESSION_COOKIE,
    cookieSecure: false,
    trustProxy: false,
    jsonLimit: '600kb',
    signInLimits: { windowMs: 15 * 60 * 1000, perAccount: 10, perAccountAnyAddress: 100, perAddress: 50 },
    webDir: null,
    logErrors: true,
    corsOrigins: [],
    ...overrides,
  };
}

function positiveInt(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  const parsed = Number(value);
  if (!Number.isInteger(parsed) || parsed <= 0)
    throw new Error(`${name} must be a positive whole number, got "${value}"`);
  return parsed;
}

function trustProxyFrom(value: string | undefined): boolean | number | string {
  if (value === undefined || value === '' || value === 'false' || value === '0') return false;
  if (value === 'true') return true;
  return /^\d+$/.test(value) ? Number(value) : value;
}

// The secret outlives restarts so sessions survive them; kept beside the database
// files under .data/ and never committed.
export function loadOrCreateSecret(file: string): string {
  if (existsSync(file)) {
    const stored = readFileSync(file, 'utf8').trim();
    if (stored.length >= 32) return stored;
  }
  mkdirSync(path.dirname(file), { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

export function configFromEnv(env: NodeJS.ProcessEnv, options: { dataDir: string; webDir: string | null }): AppConfig {
  const jwtSecret =
    env.JWT_SECRET && env.JWT_SECRET.length > 0
      ? env.JWT_SECRET
      : loadOrCreateSecret(path.join(options.dataDir, 'jwt-secret'));
  if (jwtSecret.length < 32) throw new Error('JWT_SECRET must be at least 32 characters long');
  const base = defaultConfig({ jwtSecret });
  return {
    ...base,
    tokenTtlSeconds: positiveInt(env.SESSION_TTL_SECONDS, base.tokenTtlSeconds, 'SESSION_TTL_SECONDS'),
    cookieSecure: env.COOKIE_SECURE === 'true' || env.COOKIE_SECURE === '1',
    trustProxy: trustProxyFrom(env.TRUST_PROXY),
    signInLimits: {
      windowMs: positiveInt(env.SIGN_IN_WINDOW_MS, base.signInLimits.windowMs, 'SIGN_IN_WINDOW_MS'),
      perAccount: positiveInt(env.SIGN_IN_LIMIT_PER_ACCOUNT, base.signInLimits.perAccount, 'SIGN_IN_LIMIT_PER_ACCOUNT'),
      perAccountAnyAddress: positiveInt(
        env.SIGN_IN_LIMIT_PER_ACCOUNT_ANY_ADDRESS,
        base.signInLimits.perAccountAnyAddress,
        'SIGN_IN_LIMIT_PER_ACCOUNT_ANY_ADDRESS',
      ),
      perAddress: positiveInt(env.SIGN_IN_LIMIT_PER_ADDRESS, base.signInLimits.perAddress, 'SIGN_IN_LIMIT_PER_ADDRESS'),
    },
    webDir: options.webDir,
    corsOrigins: parseCorsOrigins(env.CORS_ORIGINS),
  };
}
