import rateLimit, { normalizeIP } from "@fastify/rate-limit";
import type { FastifyInstance, FastifyRequest } from "fastify";
import fp from "fastify-plugin";
import { ProblemError, type ProblemSlug } from "../problems.js";

export interface RateLimitingOptions {
  /** Requests one client may send to `/v1/*` per window (`RATE_LIMIT_MAX`); 0: no rate limiting. */
  maxRequests: number;
  /** Length of the window, ms (`RATE_LIMIT_WINDOW_MS`). */
  windowMs: number;
}

const RATE_LIMITED: ProblemSlug = "rate-limited";

/** Only the API is limited: probes, metrics, the contract, /docs and problem pages must answer whoever asks. */
const isLimited = (request: FastifyRequest): boolean => (request.routeOptions.url ?? "").startsWith("/v1/");

/**
 * The client a request counts against: its API key once authentication accepted one (as a digest: the key
 * itself is never kept), otherwise the peer address (IPv6 by its /64, as @fastify/rate-limit does).
 */
export const clientOf = (request: FastifyRequest): string =>
  request.apiKeyDigest === undefined ? `address:${normalizeIP(request.ip)}` : `key:${request.apiKeyDigest}`;

/**
 * Optional per-client rate limiting of `/v1/*` (@fastify/rate-limit, fixed windows counted in this process):
 * over the limit a request gets a 429 problem with `Retry-After` (RFC 6585 §4) and the plugin's
 * `x-ratelimit-*` headers; every limited answer carries the remaining allowance. Register it after
 * authentication, whose `onRequest` hook runs first and names the key, and before the routes.
 */
async function rateLimitingPlugin(app: FastifyInstance, options: RateLimitingOptions): Promise<void> {
  const { maxRequests, windowMs } = options;
  if (!(Number.isSafeInteger(maxRequests) && maxRequests >= 0)) {
    throw new Error(`the rate limit is a whole number of requests (0: off), got ${maxRequests}`);
  }
  if (maxRequests === 0) return;
  if (!(Number.isSafeInteger(windowMs) && windowMs >= 1)) {
    throw new Error(`RATE_LIMIT_WINDOW_MS must be a whole number of milliseconds above 0, got ${windowMs}`);
  }
  await app.register(rateLimit, {
    max: maxRequests,
    timeWindow: windowMs,
    keyGenerator: clientOf,
    allowList: (request) => !isLimited(request),
    errorResponseBuilder: (request, context) => {
      const retryAfterSeconds = Math.max(1, Math.ceil(context.ttl / 1000));
      const who = request.apiKeyDigest === undefined ? "this client address" : "this API key";
      return new ProblemError(
        RATE_LIMITED,
        `More than ${context.max} requests in ${windowMs / 1000} s from ${who}; wait ${retryAfterSeconds} s (Retry-After) before sending the next one.`,
        undefined,
        { "retry-after": String(retryAfterSeconds) },
      );
    },
  });
}

export const rateLimiting = fp(rateLimitingPlugin, { fastify: "5.x", name: "elastilog-rate-limiting", dependencies: ["elastilog-authentication"] });
