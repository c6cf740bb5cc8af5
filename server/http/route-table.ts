import { Router, type RequestHandler } from 'express';
import type { z } from 'zod';
import type { Role } from '../../shared/roles';
import type { Schemas } from './validate';

/** Who may call a route: anyone, any signed-in user, or members of the team in the path with one of the roles. */
export type Access = { kind: 'public' } | { kind: 'signed-in' } | { kind: 'team'; roles: readonly Role[] };

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDoc {
  summary: string;
  /** Request body media type when it is not JSON (uploads). */
  bodyType?: 'multipart/form-data' | 'text/csv';
  /** Response media type when it is not JSON (frames, exports). */
  produces?: string;
  /** Status of the success response (default 200). */
  status?: number;
  /** The JSON body of the success response, from shared/schemas (the OpenAPI document and the contract test use it). */
  response?: z.ZodType;
  /** Worked examples of the request and response bodies, shown in the API reference. */
  example?: { request?: unknown; response?: unknown };
}

export interface RouteSpec extends RouteDoc {
  method: Method;
  path: string;
  tag: string;
  access: Access;
  schemas: Schemas;
}

type Tagged = RequestHandler & { access?: Access; schemas?: Schemas };

/**
 * Every API route is declared through this table: its chain (auth → role →
 * validate → handler) runs in Express, and its metadata feeds the OpenAPI
 * document and the generated role-matrix test.
 */
export class RouteTable {
  readonly router = Router();
  readonly specs: RouteSpec[] = [];
  private tag = 'general';

  section(tag: string): this {
    this.tag = tag;
    return this;
  }

  get(path: string, doc: string | RouteDoc, ...chain: RequestHandler[]) {
    return this.add('get', path, doc, chain);
  }
  post(path: string, doc: string | RouteDoc, ...chain: RequestHandler[]) {
    return this.add('post', path, doc, chain);
  }
  put(path: string, doc: string | RouteDoc, ...chain: RequestHandler[]) {
    return this.add('put', path, doc, chain);
  }
  patch(path: string, doc: string | RouteDoc, ...chain: RequestHandler[]) {
    return this.add('patch', path, doc, chain);
  }
  delete(path: string, doc: string | RouteDoc, ...chain: RequestHandler[]) {
    return this.add('delete', path, doc, chain);
  }

  private add(method: Method, path: string, doc: string | RouteDoc, chain: RequestHandler[]): this {
    const tagged = chain as Tagged[];
    const accessParts = tagged.filter((h) => h.access).map((h) => h.access!);
    if (accessParts.length === 0 || !tagged[0].access) {
      throw new Error(`${method.toUpperCase()} ${path}: the chain must start with open, signedIn or teamRole(...)`);
    }
    const access = accessParts.find((a) => a.kind === 'team') ?? accessParts[accessParts.length - 1];
    const schemas = Object.assign({}, ...tagged.filter((h) => h.schemas).map((h) => h.schemas)) as Schemas;
    const routeDoc = typeof doc === 'string' ? { summary: doc } : doc;
    this.specs.push({ method, path, tag: this.tag, access, schemas, ...routeDoc });
    this.router[method](path, ...chain);
    return this;
  }
}
