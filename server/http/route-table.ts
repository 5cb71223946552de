import express from 'express';
import type { RequestHandler, Router } from 'express';
import type { HttpMethod } from './define-route';

export interface TableRoute {
  method: HttpMethod;
  /** Express path: segments that are fixed text or one whole `:name` each (other routes are tried on every request). */
  path: string;
  handlers: RequestHandler[];
}

interface Branch {
  fixed: Map<string, Branch>;
  param?: Branch;
  /** Indexes of the routes whose path ends here. */
  ends: number[];
}

const branch = (): Branch => ({ fixed: new Map(), ends: [] });

// A path of fixed segments ([a-z0-9.-], Express compares them ignoring ASCII case) and whole
// `:name` parameters, nothing else (no optional part, wildcard or pattern).
const plainPath = /^(\/([a-z0-9.-]+|:[A-Za-z_][A-Za-z0-9_]*))+$/;

/** The path's segments, without the one trailing slash Express (not strict) lets a path have. */
function segmentsOf(path: string): string[] {
  const trimmed = path.length > 1 && path.endsWith('/') ? path.slice(0, -1) : path;
  return trimmed.slice(1).split('/');
}

/**
 * The API routes, dispatched by their path's shape. Registered one by one on the app
 * (`app.get(path, …)` for each), every request went through Express's router layer by layer: a
 * path match for each of the hundred routes declared before the one it wanted (40-70 µs a
 * request on this machine for the read mix's routes, a microbenchmark of the router alone; about
 * 3 % of node time in the read-mix profile of bench:load). Here a tree of the routes' segments
 * picks the few whose path can fit the request (fixed segments equal ignoring ASCII case, a
 * parameter any segment that is not empty), and those routes alone, in their declared order,
 * form an Express router made once for that set. Express still does the matching itself on
 * them (parameters decoded, 400 for a bad escape, HEAD served by GET, first route wins, next()
 * to the one after), so a request gets the route and params it got before; one no route fits
 * goes on to the next middleware (the API's 404). A route whose path has more than fixed
 * segments and whole parameters is in every set. OPTIONS goes on at once, as the app's router
 * did for API paths (no route handles it, and /api's 404 came before its automatic answer).
 */
export function routeTable(routes: TableRoute[]): RequestHandler & { router: Router } {
  const root = branch();
  const everywhere: number[] = [];
  routes.forEach((route, index) => {
    if (!plainPath.test(route.path)) {
      everywhere.push(index);
      return;
    }
    let at = root;
    for (const segment of segmentsOf(route.path)) {
      if (segment.startsWith(':')) at = at.param ??= branch();
      else {
        const key = segment.toLowerCase();
        let next = at.fixed.get(key);
        if (!next) at.fixed.set(key, (next = branch()));
        at = next;
      }
    }
    at.ends.push(index);
  });

  const routerOf = (indexes: number[]): Router => {
    const router = express.Router();
    for (const index of indexes) {
      const route = routes[index]!;
      router[route.method](route.path, ...route.handlers);
    }
    return router;
  };
  const routersBySet = new Map<string, Router | null>();

  /** Indexes of the routes whose path can fit these segments, in declared order. */
  const fitting = (segments: string[]): number[] => {
    const found = [...everywhere];
    const walk = (at: Branch, depth: number) => {
      if (depth === segments.length) {
        found.push(...at.ends);
        return;
      }
      const segment = segments[depth]!;
      const fixed = at.fixed.get(segment.toLowerCase());
      if (fixed) walk(fixed, depth + 1);
      if (at.param && segment.length > 0) walk(at.param, depth + 1);
    };
    walk(root, 0);
    return found.sort((a, b) => a - b);
  };

  const dispatch: RequestHandler = (req, res, next) => {
    if (req.method === 'OPTIONS') return next();
    const indexes = fitting(segmentsOf(req.path));
    const key = indexes.join(',');
    let router = routersBySet.get(key);
    if (router === undefined) {
      router = indexes.length ? routerOf(indexes) : null;
      routersBySet.set(key, router);
    }
    if (!router) return next();
    router(req, res, next);
  };
  return Object.assign(dispatch, { router: routerOf(routes.map((_route, index) => index)) });
}
