import { Router, type Express, type RequestHandler } from 'express';
import { requireRole, type AccessRule } from './access';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * How the service limits what an allowed caller reaches: `none` (nothing to limit),
 * `self` (the caller's own account), `organization` (a manager's organization),
 * `unit` (a tenant's unit, or the unit's organization for a manager), `assignment`
 * (a contractor's dispatched work orders, or the organization for a manager).
 */
export type ScopeKind = 'none' | 'self' | 'organization' | 'unit' | 'assignment';

/** What every route must state; the access-matrix spec is generated from these. */
export interface RouteRule {
  access: AccessRule;
  scope: ScopeKind;
  summary: string;
}

export interface RouteRecord extends RouteRule {
  method: HttpMethod;
  /** The full path as Express matches it, e.g. `/api/users/:userId`. */
  path: string;
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

/**
 * The routes of one resource under one prefix. Each registration puts requireRole(access)
 * first, then the handlers it is given (validate(...), controller), and records the rule.
 */
export class RouteGroup {
  readonly router = Router();
  readonly records: RouteRecord[] = [];

  constructor(readonly prefix: string) {}

  get(path: string, rule: RouteRule, ...handlers: RequestHandler[]): this {
    return this.add('get', path, rule, handlers);
  }

  post(path: string, rule: RouteRule, ...handlers: RequestHandler[]): this {
    return this.add('post', path, rule, handlers);
  }

  put(path: string, rule: RouteRule, ...handlers: RequestHandler[]): this {
    return this.add('put', path, rule, handlers);
  }

  patch(path: string, rule: RouteRule, ...handlers: RequestHandler[]): this {
    return this.add('patch', path, rule, handlers);
  }

  delete(path: string, rule: RouteRule, ...handlers: RequestHandler[]): this {
    return this.add('delete', path, rule, handlers);
  }

  private add(method: HttpMethod, path: string, rule: RouteRule, handlers: RequestHandler[]): this {
    if (handlers.length === 0) throw new Error(`${method.toUpperCase()} ${joinPath(this.prefix, path)} has no handler`);
    this.records.push({ method, path: joinPath(this.prefix, path), ...rule });
    this.router[method](path, requireRole(rule.access), ...handlers);
    return this;
  }
}

/**
 * Every route of the app with its rule. createApp mounts groups through it (in the order
 * middleware needs) and it stays in app.locals for the access-matrix spec.
 */
export class RouteTable {
  private readonly groups: RouteGroup[] = [];

  get records(): RouteRecord[] {
    return this.groups.flatMap((group) => group.records);
  }

  mount(app: Express, ...groups: RouteGroup[]): this {
    for (const group of groups) {
      this.groups.push(group);
      app.use(group.prefix, group.router);
    }
    app.locals.routeTable = this;
    return this;
  }
}

export function routeTableOf(app: Express): RouteTable {
  const table = app.locals.routeTable;
  if (!(table instanceof RouteTable)) throw new Error('this app has no route table');
  return table;
}
