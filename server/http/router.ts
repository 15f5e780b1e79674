import express, { type NextFunction, type Request, type Response } from 'express';
import type { Deps } from '../deps';
import { enforce, type Policy } from './policy';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export interface RouteDef {
  method: Method;
  path: string;
  policy: Policy;
}
export type Handler = (req: Request, res: Response, next: NextFunction) => unknown;

/**
 * The only way to add an API route: each one declares its policy here, and the policy is enforced
 * before the handler runs. `defs` lists every route for the route-coverage and matrix tests.
 */
export class ApiRouter {
  readonly router = express.Router();
  readonly defs: RouteDef[] = [];

  constructor(readonly deps: Deps) {}

  route(method: Method, path: string, policy: Policy, ...handlers: Handler[]): void {
    this.defs.push({ method, path, policy });
    this.router[method](path, enforce(this.deps, policy), ...handlers);
  }
}
