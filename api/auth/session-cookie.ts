import type { CookieOptions, Response } from 'express';
import type { AppConfig } from '../config';

function cookieOptions(config: AppConfig): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, path: '/' };
}

export function setSessionCookie(res: Response, token: string, config: AppConfig): void {
  res.cookie(config.cookieName, token, { ...cookieOptions(config), maxAge: config.tokenTtlSeconds * 1000 });
}

export function clearSessionCookie(res: Response, config: AppConfig): void {
  res.clearCookie(config.cookieName, cookieOptions(config));
}
