import { createHash, timingSafeEqual } from "node:crypto";
import type { FastifyInstance, FastifyRequest } from "fastify";
import fp from "fastify-plugin";
import { ProblemError, type ProblemSlug } from "../problems.js";
import { METRICS_PATH } from "./metrics.js";

declare module "fastify" {
  interface FastifyRequest {
    /**
     * SHA-256 of the request's API key (base64url) once it has been accepted; undefined without authentication.
     * Tells clients apart (rate limiting) without keeping or logging the key itself.
     */
    apiKeyDigest: string | undefined;
  }
}

export interface AuthenticationOptions {
  /** Accepted bearer keys (`API_KEYS`, comma-separated). Empty: no authentication at all. */
  apiKeys: readonly string[];
  /** Also require a key for `GET /metrics` (`METRICS_REQUIRE_AUTH`); needs at least one key. */
  metricsRequireAuth?: boolean;
}

const REALM = "elastilog";
const UNAUTHORIZED: ProblemSlug = "unauthorized";

/** The token syntax of RFC 6750 §2.1 (`b64token`); a key outside it could never be sent in the header. */
const B64TOKEN = /^[A-Za-z0-9\-._~+/]+=*$/;
const BEARER = /^Bearer(?: +(.*))?$/i;

const sha256 = (text: string): Buffer => createHash("sha256").update(text, "utf8").digest();

/**
 * True when one of the digests is the presented key's. Comparing SHA-256 digests with timingSafeEqual
 * takes the same time whatever the key's length and however many leading characters are right, and
 * every digest is compared, so the time does not tell which key nearly matched either.
 */
export const matchesOneOf = (presented: string, keyDigests: readonly Buffer[]): boolean => {
  const digest = sha256(presented);
  let matched = false;
  for (const keyDigest of keyDigests) matched = timingSafeEqual(digest, keyDigest) || matched;
  return matched;
};

/** The raw path and the matched route pattern: the router decodes `%76` to `v`, so both must be checked. */
const pathsOf = (request: FastifyRequest): string[] => {
  const raw = request.url.split("?", 1)[0];
  const route = request.routeOptions.url;
  return route === undefined ? [raw] : [raw, route];
};

const challenge = (error?: "invalid_token") =>
  error === undefined ? `Bearer realm="${REALM}"` : `Bearer realm="${REALM}", error="${error}"`;

/**
 * Optional API-key authentication (RFC 6750 bearer tokens): when keys are configured, every `/v1/` request
 * (and `/metrics` if asked) needs `Authorization: Bearer <key>`. Probes, documentation and problem pages stay open.
 * It runs on `onRequest`, before any body is read, so an unauthenticated client cannot make the service parse a body.
 */
async function authenticationPlugin(app: FastifyInstance, options: AuthenticationOptions): Promise<void> {
  for (const key of options.apiKeys) {
    if (!B64TOKEN.test(key)) {
      throw new Error("API_KEYS: every key must be letters, digits and -._~+/ (RFC 6750 b64token), without spaces or empty entries");
    }
  }
  app.decorateRequest("apiKeyDigest", undefined);
  if (options.apiKeys.length === 0) {
    if (options.metricsRequireAuth) throw new Error("METRICS_REQUIRE_AUTH is set but API_KEYS is empty: no key could ever open /metrics");
    return;
  }
  const keyDigests = options.apiKeys.map(sha256);
  const isProtected = (path: string) => path.startsWith("/v1/") || (options.metricsRequireAuth === true && path === METRICS_PATH);

  app.addHook("onRequest", async (request) => {
    // A CORS preflight never carries credentials (Fetch standard); it must pass for the real request to be sent.
    if (request.method === "OPTIONS" || !pathsOf(request).some(isProtected)) return;
    const header = request.headers.authorization;
    if (header === undefined) {
      throw new ProblemError(UNAUTHORIZED, "This endpoint needs an API key: send the header `Authorization: Bearer <key>`.", undefined, {
        "www-authenticate": challenge(),
      });
    }
    const bearer = BEARER.exec(header);
    if (bearer === null) {
      throw new ProblemError(UNAUTHORIZED, "Only the Bearer scheme is accepted: send the header `Authorization: Bearer <key>`.", undefined, {
        "www-authenticate": challenge(),
      });
    }
    const token = bearer[1] ?? "";
    if (!B64TOKEN.test(token) || !matchesOneOf(token, keyDigests)) {
      request.log.info("request refused: the bearer key is not one of the configured keys");
      throw new ProblemError(UNAUTHORIZED, "The API key is not valid; check it, or ask the operator of this service for one.", undefined, {
        "www-authenticate": challenge("invalid_token"),
      });
    }
    request.apiKeyDigest = sha256(token).toString("base64url");
  });
}

export const authentication = fp(authenticationPlugin, { fastify: "5.x", name: "elastilog-authentication" });
