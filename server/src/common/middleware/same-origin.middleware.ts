import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { ApiErrorBody } from '@ladderwright/shared/api';

const STATE_CHANGING_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The origin a browser states for the request: the Origin header, else the Referer's origin; null when neither. */
function statedOrigin(request: Request): string | null {
  const origin = request.headers.origin;
  if (typeof origin === 'string' && origin !== '') return origin;
  const referer = request.headers.referer;
  if (typeof referer !== 'string' || referer === '') return null;
  try {
    return new URL(referer).origin;
  } catch {
    return 'null';
  }
}

function hostOf(origin: string): string | null {
  try {
    const url = new URL(origin);
    return url.protocol === 'http:' || url.protocol === 'https:' ? url.host.toLowerCase() : null;
  } catch {
    return null;
  }
}

/**
 * Refuses a state-changing request (POST, PUT, PATCH, DELETE) that a browser sent from another origin: the
 * stated origin (Origin, else Referer) must name the host the request was sent to, `publicUrl`, or one of
 * `corsOrigins`. SameSite=Strict does not separate ports or sibling subdomains of one site, so the cookie
 * alone does not stop a page on another port from posting with it (OWASP CSRF prevention cheat sheet,
 * "verifying origin with standard headers"). A request that states no origin at all comes from a program,
 * not a page (browsers send Origin on every cross-origin POST), and passes.
 */
export function sameOriginOnly(options: { publicUrl: string; corsOrigins: readonly string[] }): RequestHandler {
  const trustedHosts = new Set(
    [options.publicUrl, ...options.corsOrigins].map(hostOf).filter((host): host is string => host !== null),
  );
  return (request: Request, response: Response, next: NextFunction) => {
    if (!STATE_CHANGING_METHODS.has(request.method)) return next();
    const origin = statedOrigin(request);
    if (origin === null) return next();
    const host = hostOf(origin);
    const requestHost = request.headers.host?.toLowerCase();
    if (host !== null && (host === requestHost || trustedHosts.has(host))) return next();
    const body: ApiErrorBody = {
      statusCode: 403,
      code: 'cross_origin',
      message: `A ${request.method} from the origin ${origin} is refused: changes are accepted only from this site's own pages`,
    };
    response.status(403).json(body);
  };
}
