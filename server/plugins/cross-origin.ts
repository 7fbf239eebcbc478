import cors from "@fastify/cors";
import type { FastifyInstance } from "fastify";
import fp from "fastify-plugin";

export interface CrossOriginOptions {
  /** Origins whose browser pages may call the API (`CORS_ORIGINS`, comma-separated), e.g. `https://logs.example`. Empty: CORS off. */
  allowedOrigins: readonly string[];
  /** How long a browser may cache a preflight answer, seconds; 600 unless given. */
  preflightMaxAgeSeconds?: number;
}

/** A serialised origin (RFC 6454 §6.2): scheme, host and port only; a trailing slash or path would never match a browser's Origin header. */
const isSerialisedOrigin = (origin: string): boolean => {
  try {
    return new URL(origin).origin === origin;
  } catch {
    return false;
  }
};

/**
 * Cross-origin requests from the listed browser origins only (exact match, no wildcard). Off by default:
 * a script or server-side client needs no CORS, and an open policy would let any web page use a
 * user's network position to call the service.
 */
async function crossOriginPlugin(app: FastifyInstance, options: CrossOriginOptions): Promise<void> {
  if (options.allowedOrigins.length === 0) return;
  const invalid = options.allowedOrigins.filter((origin) => !isSerialisedOrigin(origin));
  if (invalid.length > 0) {
    throw new Error(`CORS_ORIGINS: ${invalid.map((o) => `"${o}"`).join(", ")} is not an origin; write scheme://host[:port], without a path or trailing slash`);
  }
  await app.register(cors, {
    origin: [...options.allowedOrigins],
    methods: ["GET", "POST", "OPTIONS"],
    allowedHeaders: ["content-type", "authorization", "x-request-id"],
    // A page can read only the CORS-safelisted response headers unless told (Fetch standard): Retry-After
    // and the rate-limit headers say when a refused request may be sent again.
    exposedHeaders: ["x-request-id", "retry-after", "x-ratelimit-limit", "x-ratelimit-remaining", "x-ratelimit-reset"],
    maxAge: options.preflightMaxAgeSeconds ?? 600,
    // @fastify/cors answers an OPTIONS request without Origin with a text/plain 400; let it through instead,
    // so no answer of this service is anything but JSON or a problem document.
    strictPreflight: false,
    hideOptionsRoute: true,
  });
}

export const crossOrigin = fp(crossOriginPlugin, { fastify: "5.x", name: "elastilog-cross-origin" });
