import helmet from "@fastify/helmet";
import type { FastifyInstance } from "fastify";
import fp from "fastify-plugin";

/**
 * The Content-Security-Policy that the API reference at /docs (Swagger UI, served from /docs/static) works under:
 * it loads its scripts and styles from this origin only and runs no inline script; its images are this
 * origin's or `data:` URIs (its logo and the icons in its style sheet); it fetches /docs/json from this origin.
 * Styles allow 'unsafe-inline' because Markdown tables in descriptions are rendered with `style` attributes.
 */
export const DOCS_CONTENT_SECURITY_POLICY = {
  "default-src": ["'self'"],
  "base-uri": ["'self'"],
  "connect-src": ["'self'"],
  "font-src": ["'self'", "data:"],
  "form-action": ["'self'"],
  "frame-ancestors": ["'none'"],
  "img-src": ["'self'", "data:"],
  "object-src": ["'none'"],
  "script-src": ["'self'"],
  "script-src-attr": ["'none'"],
  "style-src": ["'self'", "'unsafe-inline'"],
};

/** Paths of the HTML reference and its assets, the pages a browser renders. */
const isDocsPage = (url: string): boolean => url === "/docs" || url.startsWith("/docs/") || url.startsWith("/docs?");

/**
 * Security headers (@fastify/helmet) on the HTML pages (the reference at /docs and its assets), where a browser
 * renders what it gets. API answers are JSON, CSV, LAS or Arrow read by programs: they get only
 * `X-Content-Type-Options: nosniff`, since helmet's dozen headers on every answer cost measurable throughput
 * on single-point requests and protect nothing a program reads.
 */
async function securityHeadersPlugin(app: FastifyInstance): Promise<void> {
  await app.register(helmet, {
    global: false,
    contentSecurityPolicy: { useDefaults: false, directives: DOCS_CONTENT_SECURITY_POLICY },
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "no-referrer" },
    // TLS ends at the ingress in front of the pods, which is where HSTS belongs; from a plain-HTTP
    // process it would only mislead. upgrade-insecure-requests is left out of the policy for the same
    // reason: on a plain-HTTP address other than localhost it would send /docs's assets to an HTTPS port nobody serves.
    strictTransportSecurity: false,
  });
  app.addHook("onRequest", async (request, reply) => {
    if (isDocsPage(request.url)) await reply.helmet();
    else reply.header("x-content-type-options", "nosniff");
  });
}

export const securityHeaders = fp(securityHeadersPlugin, { fastify: "5.x", name: "elastilog-security-headers" });
