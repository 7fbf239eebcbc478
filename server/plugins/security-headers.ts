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

/**
 * Security headers (@fastify/helmet) for HTML pages (the reference at /docs and its assets), where a browser
 * renders what it gets. Registered in the encapsulated context that holds those pages only (`referencePages`): helmet runs two hooks on every request of its context, and API answers (JSON, CSV, LAS or Arrow,
 * read by programs) would pay for them on every single-point request while gaining nothing a program reads.
 */
async function pageSecurityHeadersPlugin(app: FastifyInstance): Promise<void> {
  await app.register(helmet, {
    global: true,
    contentSecurityPolicy: { useDefaults: false, directives: DOCS_CONTENT_SECURITY_POLICY },
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "no-referrer" },
    // TLS ends at the ingress in front of the pods, which is where HSTS belongs; from a plain-HTTP
    // process it would only mislead. upgrade-insecure-requests is left out of the policy for the same
    // reason: on a plain-HTTP address other than localhost it would send /docs's assets to an HTTPS port nobody serves.
    strictTransportSecurity: false,
  });
}

/** fastify-plugin: the headers reach the routes of the context it is registered in, not just its own. */
export const pageSecurityHeaders = fp(pageSecurityHeadersPlugin, { fastify: "5.x", name: "elastilog-page-security-headers" });

/**
 * `X-Content-Type-Options: nosniff` on every answer, problems and 404s included, so that no browser guesses a
 * JSON, CSV or LAS answer to be HTML. A callback hook: an async one costs a promise on every request.
 */
async function securityHeadersPlugin(app: FastifyInstance): Promise<void> {
  app.addHook("onRequest", (_request, reply, done) => {
    reply.header("x-content-type-options", "nosniff");
    done();
  });
}

export const securityHeaders = fp(securityHeadersPlugin, { fastify: "5.x", name: "elastilog-security-headers" });
