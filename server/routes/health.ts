import type { FastifyInstance } from "fastify";
import { z } from "zod";
import { pathProblemResponses } from "../schemas/problem.js";

const status = z.object({ status: z.enum(["ok", "shutting_down"]) }).meta({ id: "HealthStatus" });

/** Liveness and readiness probes. Readiness fails as soon as a shutdown starts, so load balancers stop sending work. */
export default async function healthRoutes(app: FastifyInstance): Promise<void> {
  app.get(
    "/livez",
    { schema: { tags: ["operations"], summary: "Liveness: the process answers.", response: { 200: status, ...pathProblemResponses } } },
    async () => ({ status: "ok" as const }),
  );
  app.get(
    "/readyz",
    {
      schema: {
        tags: ["operations"],
        summary: "Readiness: the service takes new work (503 once shutting down).",
        response: { 200: status, 503: status, ...pathProblemResponses },
      },
    },
    async (_request, reply) => (app.shuttingDown ? reply.code(503).send({ status: "shutting_down" }) : { status: "ok" }),
  );
}
