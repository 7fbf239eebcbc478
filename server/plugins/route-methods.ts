import type { FastifyInstance } from "fastify";

/** A route's path pattern (`/v1/correlations/:id`, `/docs/*`) as a regular expression over request paths. */
const patternOf = (url: string): RegExp =>
  new RegExp(
    `^${url
      .split("/")
      .map((part) => (part.startsWith(":") ? "[^/]+" : part === "*" ? ".*" : part.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")))
      .join("/")}$`,
  );

/**
 * Records every route as it is added, and answers which methods a path has: the not-found handler uses it to
 * tell a wrong method (405 with `Allow`, RFC 9110 §15.5.6) from a path that does not exist (404).
 * Call before the routes are registered.
 */
export const trackRouteMethods = (app: FastifyInstance): ((path: string) => string[]) => {
  const routes: { pattern: RegExp; methods: string[] }[] = [];
  app.addHook("onRoute", (route) => {
    const methods = Array.isArray(route.method) ? route.method : [route.method];
    routes.push({ pattern: patternOf(route.url), methods: methods.map((m) => m.toUpperCase()) });
  });
  return (path: string) => [...new Set(routes.filter((route) => route.pattern.test(path)).flatMap((route) => route.methods))].sort();
};
