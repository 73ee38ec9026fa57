import type { RequestHandler } from 'express';
import { ForbiddenError } from './errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(value: string | undefined): string | null {
  if (!value) return null;
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * Refuses state-changing requests whose Origin (or, lacking it, Referer) is not
 * the app's own origin: the Host the request was sent to, or one of `allowed`.
 * An Origin header, when sent, alone decides: `Origin: null` (sandboxed frames, some redirects)
 * is refused whatever the Referer says. Only a request without Origin falls back to the Referer.
 */
export function sameOriginOnly(allowed: readonly string[]): RequestHandler {
  const extra = new Set(allowed.map((a) => originOf(a)).filter((a): a is string => !!a));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    const claimed = origin ? originOf(origin) : originOf(req.get('referer'));
    const host = req.get('host');
    const own = host ? [`http://${host}`, `https://${host}`] : [];
    if (claimed && (own.includes(claimed) || extra.has(claimed))) return next();
    next(new ForbiddenError('cross-origin request refused: send it from the Dubito app (Origin header)', 'cross_origin'));
  };
}
