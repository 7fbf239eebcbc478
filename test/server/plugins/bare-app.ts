import Fastify, { type FastifyInstance, type FastifyServerOptions } from "fastify";
import { validatorCompiler } from "fastify-type-provider-zod";
import { afterEach } from "vitest";
import { installProblemHandlers } from "../../../server/plugins/problem-handlers.js";

const open: FastifyInstance[] = [];

afterEach(async () => {
  await Promise.all(open.splice(0).map((app) => app.close()));
});

/**
 * A bare Fastify app with the project's problem handlers, the plugin under test (registered first, as
 * app.ts registers plugins before routes), and stand-ins for the service's routes; closed after the test.
 */
export const bareApp = async (
  registerPlugin: (app: FastifyInstance) => PromiseLike<unknown>,
  serverOptions: FastifyServerOptions = { logger: false },
): Promise<FastifyInstance> => {
  const app = Fastify(serverOptions) as unknown as FastifyInstance;
  open.push(app);
  // As app.ts: routes declare zod schemas, which Fastify's own compilers cannot read.
  app.setValidatorCompiler(validatorCompiler);
  app.setSerializerCompiler(() => (data) => JSON.stringify(data));
  installProblemHandlers(app, { bodyLimitBytes: 1024 * 1024 });
  await registerPlugin(app);
  app.get("/v1/elastic", async () => ({ E: 20 }));
  app.post("/v1/elastic", async () => ({ count: 0 }));
  app.get("/livez", async () => ({ status: "ok" }));
  app.get("/readyz", async () => ({ status: "ok" }));
  app.get("/openapi.json", async () => ({ openapi: "3.1.0" }));
  app.get("/problems/:slug", async () => ({ type: "/problems/not-found" }));
  if (!app.hasRoute({ method: "GET", url: "/metrics" })) app.get("/metrics", async (_request, reply) => reply.type("text/plain").send("# metrics\n"));
  await app.ready();
  return app;
};
