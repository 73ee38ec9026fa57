import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { can, type Action } from '../../shared/policy/policy';
import { ForbiddenError, UnauthenticatedError } from './errors';
import type { SessionUser } from './request-user';

/** Who may reach a route before the service applies its own rules. */
export type Access = Action | 'public' | 'signed-in';
export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteInfo {
  method: Method;
  path: string;
  access: Access;
}

function authorize(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next();
    if (!req.user) return next(new UnauthenticatedError());
    if (access !== 'signed-in' && !can(req.user.role, access)) return next(new ForbiddenError());
    next();
  };
}

/** The signed-in user of a route that is not public. */
export function userOf(req: Request): SessionUser {
  if (!req.user) throw new UnauthenticatedError();
  const { id, email, name, role } = req.user;
  return { id, email, name, role };
}

type Handler = (req: Request, res: Response, next: NextFunction) => unknown;

/** Registers routes with their access rule and keeps a catalog of them (the tests walk it). */
export class RouteTable {
  readonly routes: RouteInfo[] = [];

  constructor(private readonly router: Router) {}

  add(method: Method, path: string, access: Access, ...handlers: Handler[]): void {
    this.routes.push({ method, path, access });
    this.router[method](path, authorize(access), ...(handlers as RequestHandler[]));
  }
}
