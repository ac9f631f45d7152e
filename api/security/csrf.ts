import type { Request, RequestHandler } from 'express';
import { Forbidden } from '../errors';

// Cross-site request forgery guard, by origin (no tokens to keep in step):
// a request with an unsafe method is refused with 403 `csrf-refused` when the browser
// says it comes from another site. Browsers mark every request with
// `Sec-Fetch-Site`; it must be `same-origin` (or `none`, a request the user typed
// in). Browsers too old for that header still send `Origin` on every cross-origin
// POST/PUT/PATCH/DELETE, which must then be the app's own origin (the scheme and
// host the request was addressed to) or one listed in CORS_ORIGINS. A request with
// neither header is not from a browser's page (curl, scripts, the tests) and goes on.
// Requests carrying `Authorization` are exempt: the session cookie is not used for
// them (authenticate takes the header first), and no page can attach that header to
// another site's request without a CORS grant. This also covers sign-in: a forged
// sign-in into the attacker's account from another site is refused the same way.
// Form posts (x-www-form-urlencoded) are refused besides by the accepted body types.

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const ACCEPTED_FETCH_SITES = new Set(['same-origin', 'none']);

/** The origin this request was addressed to, as the browser saw it (proxy headers when trusted). */
export function ownOrigin(req: Request): string {
  return `${req.protocol}://${req.host}`.toLowerCase();
}

function refused(reason: string, details: Record<string, unknown>): Forbidden {
  return new Forbidden(
    `This change was sent from another site (${reason}); Bindery accepts changes only from its own pages.`,
    { code: 'csrf-refused', details },
  );
}

export function csrfGuard(options: { trustedOrigins: readonly string[] }): RequestHandler {
  const trusted = new Set(options.trustedOrigins.map((origin) => origin.toLowerCase()));
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || req.get('authorization') !== undefined) return next();
    const fetchSite = req.get('sec-fetch-site')?.toLowerCase();
    const origin = req.get('origin')?.toLowerCase();
    if (fetchSite !== undefined && !ACCEPTED_FETCH_SITES.has(fetchSite)) {
      // A listed origin is another site by definition; CORS_ORIGINS lets it in.
      if (origin === undefined || !trusted.has(origin))
        throw refused(`Sec-Fetch-Site: ${fetchSite}`, { sec_fetch_site: fetchSite, origin: origin ?? null });
      return next();
    }
    if (fetchSite === undefined && origin !== undefined && origin !== ownOrigin(req) && !trusted.has(origin)) {
      throw refused(`Origin: ${origin}`, { origin });
    }
    next();
  };
}
