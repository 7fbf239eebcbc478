import { randomUUID } from "node:crypto";
import swagger from "@fastify/swagger";
import Fastify, { LogController, type FastifyInstance, type FastifyServerOptions } from "fastify";
import {
  jsonSchemaTransform,
  validatorCompiler,
  type ZodTypeProvider,
} from "fastify-type-provider-zod";
import { AnswerPool } from "./answer-pool.js";
import { DEFAULT_CONFIG, type ServiceConfig } from "./config.js";
import { transformObject } from "./openapi-components.js";
import { authentication } from "./plugins/authentication.js";
import { bodyFraming } from "./plugins/body-framing.js";
import { clientErrorHandler } from "./plugins/client-errors.js";
import { crossOrigin } from "./plugins/cross-origin.js";
import { loadShedding } from "./plugins/load-shedding.js";
import { metrics } from "./plugins/metrics.js";
import { answerFrameworkError, installProblemHandlers } from "./plugins/problem-handlers.js";
import { rateLimiting } from "./plugins/rate-limiting.js";
import { trackRouteMethods } from "./plugins/route-methods.js";
import { referencePages } from "./plugins/reference-pages.js";
import { securityHeaders } from "./plugins/security-headers.js";
import correlationRoutes from "./routes/correlations.js";
import elasticRoutes from "./routes/elastic.js";
import healthRoutes from "./routes/health.js";
import logsRoutes from "./routes/logs.js";
import referenceRoutes from "./routes/reference.js";
import { SERVICE_VERSION } from "./version.js";

declare module "fastify" {
  interface FastifyInstance {
    /** Set when a shutdown starts; /readyz then answers 503. */
    shuttingDown: boolean;
    /** Worker threads for large answers. */
    answerPool: AnswerPool;
  }
}

export interface AppOptions {
  config?: Partial<ServiceConfig>;
  /** pino options, `false` for silence (tests), `true` for defaults. */
  logger?: FastifyServerOptions["logger"];
}

const REQUEST_ID = /^[A-Za-z0-9._:-]{1,128}$/;

const SAFETY_NOTE =
  "Log-derived moduli are estimates. Dynamic values and any static or strength values derived from them by empirical correlations " +
  "must be calibrated against core tests for the field at hand before they are used in fracture design, wellbore stability or " +
  "sanding studies; engineering decisions rest with licensed professionals under local regulations.";

/**
 * The whole application, ready to `inject` or to `listen` — it never listens by itself (see main.ts).
 * Responses are written with JSON.stringify: the zod response schemas document the contract and the
 * tests check answers against them, but a million-sample answer is not re-validated on every request.
 */
export async function buildApp(options: AppOptions = {}): Promise<FastifyInstance> {
  const config: ServiceConfig = { ...DEFAULT_CONFIG, ...options.config };
  const app = Fastify({
    logger: options.logger ?? { level: config.logLevel, redact: ["req.headers.authorization"] },
    bodyLimit: config.jsonBodyLimitBytes,
    connectionTimeout: config.connectionTimeoutMs,
    keepAliveTimeout: config.keepAliveTimeoutMs,
    requestTimeout: config.requestTimeoutMs,
    // One line per request, written when it ends (below), instead of Fastify's two: half the logging cost.
    logController: new LogController({ requestIdLogLabel: "request_id", disableRequestLogging: true }),
    genReqId: (request) => {
      const given = request.headers["x-request-id"];
      return typeof given === "string" && REQUEST_ID.test(given) ? given : randomUUID();
    },
    // Node checks header and request timeouts on a timer of its own, every 30 s by default: check often enough
    // that HEADERS_TIMEOUT_MS cuts a client trickling its headers off in time.
    http: { connectionsCheckingInterval: Math.max(100, Math.min(1000, Math.floor(config.headersTimeoutMs / 4))) },
    clientErrorHandler,
    frameworkErrors: answerFrameworkError,
    onProtoPoisoning: "error",
    onConstructorPoisoning: "error",
  }).withTypeProvider<ZodTypeProvider>();
  app.server.headersTimeout = config.headersTimeoutMs;
  app.decorate("shuttingDown", false);
  app.decorate("answerPool", new AnswerPool(config.workerThreads));
  app.addHook("onClose", async () => app.answerPool.close());
  // Order matters: CORS headers must reach the 503, 401 and 429 answers of load shedding, authentication and rate limiting.
  await app.register(securityHeaders);
  await app.register(crossOrigin, { allowedOrigins: config.corsOrigins });
  await app.register(loadShedding, {
    maxEventLoopDelayMs: config.maxEventLoopDelayMs,
    maxHeapUsedBytes: config.maxHeapUsedBytes,
    maxRssBytes: config.maxRssBytes,
    maxEventLoopUtilization: config.maxEventLoopUtilization,
    retryAfterSeconds: config.retryAfterSeconds,
  });
  await app.register(bodyFraming);
  await app.register(authentication, { apiKeys: config.apiKeys, metricsRequireAuth: config.metricsRequireAuth });
  // After authentication, whose hook then has named the request's API key; before the routes, to which it adds its hook.
  await app.register(rateLimiting, { maxRequests: config.rateLimitMax, windowMs: config.rateLimitWindowMs });
  const methodsOf = trackRouteMethods(app);
  app.setValidatorCompiler(validatorCompiler);
  app.setSerializerCompiler(() => (data) => JSON.stringify(data));
  // Hooks on every request are callbacks, not async functions: an async hook costs a promise and a microtask
  // turn per request, which a single-point GET (a few tens of µs in all) feels.
  app.addHook("onSend", (request, reply, payload, done) => {
    reply.header("x-request-id", request.id);
    // While shutting down, answers in flight close their connection: a keep-alive client (a load balancer)
    // would otherwise hold it open past the grace period, and close() waits for every connection.
    if (app.shuttingDown) reply.header("connection", "close");
    done(null, payload);
  });
  app.addHook("onResponse", (request, reply, done) => {
    request.log.info(
      { method: request.method, url: request.url, status: reply.statusCode, ms: Math.round(reply.elapsedTime * 10) / 10 },
      "request completed",
    );
    done();
  });

  await app.register(swagger, {
    openapi: {
      openapi: "3.1.0",
      info: {
        title: "elastilog",
        version: SERVICE_VERSION,
        description: [
          "Turns well-log sonic (Vp/Vs or DTC/DTS) and bulk density data into dynamic elastic rock properties",
          "(Young's modulus E, Poisson's ratio nu, shear modulus G, Lamé's lambda, bulk modulus K, P-wave modulus M, Vp/Vs,",
          "impedances, lambda*rho and mu*rho), and flags every sample whose logs are physically impossible or implausible.",
          "\n\n**Caution.** " + SAFETY_NOTE,
        ].join(" "),
        license: { name: "Proprietary", identifier: "LicenseRef-Proprietary" },
      },
      servers: [{ url: "http://127.0.0.1:8080", description: "Local service started with npm start" }],
      components: {
        securitySchemes: {
          apiKey: { type: "http", scheme: "bearer", description: "Only when the service runs with API_KEYS: every /v1/* request needs Authorization: Bearer <key>." },
        },
      },
      tags: [
        { name: "elastic", description: "Dynamic elastic properties and QC flags." },
        { name: "wells", description: "Whole wells: LAS 2.0 and CSV files in and out." },
        { name: "correlations", description: "Published empirical correlations from dynamic to static properties and strength, with citations. Every value they yield is an estimate." },
        { name: "operations", description: "Probes for orchestrators and load balancers, and Prometheus metrics." },
        { name: "reference", description: "The contract and the problem types." },
      ],
    },
    transform: jsonSchemaTransform,
    transformObject,
  });
  await app.register(referencePages);

  installProblemHandlers(app, { bodyLimitBytes: config.jsonBodyLimitBytes }, methodsOf);
  await app.register(metrics);
  await app.register(healthRoutes);
  await app.register(referenceRoutes);
  await app.register(elasticRoutes, { maxSamples: config.maxSamples });
  await app.register(correlationRoutes);
  await app.register(logsRoutes, { maxSamples: config.maxSamples, fileBodyLimitBytes: config.fileBodyLimitBytes });
  return app;
}
