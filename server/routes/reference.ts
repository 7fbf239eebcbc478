import type { FastifyInstance } from "fastify";
import type { ZodTypeProvider } from "fastify-type-provider-zod";
import { z } from "zod";
import { PROBLEM_KINDS, ProblemError, problemTypeUri, type ProblemSlug } from "../problems.js";
import { pathProblemResponses, problemResponse } from "../schemas/problem.js";

const problemKind = z
  .object({ type: z.string(), title: z.string(), status: z.int(), how_to_fix: z.string() })
  .meta({ id: "ProblemKind", description: "Explanation of one kind of problem (the target of a problem's `type` URI)." });

const openApiObject = z
  .looseObject({ openapi: z.string(), info: z.looseObject({}), paths: z.looseObject({}) })
  .meta({ description: "OpenAPI 3.1 document (the OpenAPI Object of the OpenAPI Specification 3.1.0 §4.8.1)." });

/** The machine-readable contract (`/openapi.yaml`, `/openapi.json`) and the explanation behind each problem type URI. */
export default async function referenceRoutes(instance: FastifyInstance): Promise<void> {
  const app = instance.withTypeProvider<ZodTypeProvider>();

  app.get(
    "/openapi.yaml",
    {
      schema: {
        tags: ["reference"],
        summary: "This service's OpenAPI 3.1 document, as YAML.",
        response: {
          200: { description: "The OpenAPI 3.1 document.", content: { "application/yaml": { schema: z.string().meta({ description: "OpenAPI 3.1 document in YAML." }) } } },
          ...pathProblemResponses,
          503: problemResponse(503),
        },
      },
    },
    async (_request, reply) => reply.type("application/yaml; charset=utf-8").send(app.swagger({ yaml: true })),
  );
  app.get(
    "/openapi.json",
    {
      schema: {
        tags: ["reference"],
        summary: "This service's OpenAPI 3.1 document, as JSON.",
        response: {
          200: { description: "The OpenAPI 3.1 document.", content: { "application/json": { schema: openApiObject } } },
          ...pathProblemResponses,
          503: problemResponse(503),
        },
      },
    },
    // @fastify/swagger types its answer as either OpenAPI version's Document; this service writes 3.1.
    async () => app.swagger() as z.infer<typeof openApiObject>,
  );
  app.get(
    "/problems/:slug",
    {
      schema: {
        tags: ["reference"],
        summary: "What a kind of problem means and how to fix the request.",
        params: z.object({ slug: z.string().meta({ examples: ["invalid-request"] }) }),
        response: { 200: problemKind, 404: problemResponse(404), ...pathProblemResponses, 503: problemResponse(503) },
      },
    },
    async (request) => {
      const slug = request.params.slug as ProblemSlug;
      const kind = PROBLEM_KINDS[slug];
      if (!Object.hasOwn(PROBLEM_KINDS, slug)) {
        throw new ProblemError("not-found", `There is no problem type "${request.params.slug}". Known: ${Object.keys(PROBLEM_KINDS).join(", ")}.`);
      }
      return { type: problemTypeUri(slug), title: kind.title, status: kind.status, how_to_fix: kind.fix };
    },
  );
}
