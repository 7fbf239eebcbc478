import type { FastifyInstance } from "fastify";
import type { ZodTypeProvider } from "fastify-type-provider-zod";
import { z } from "zod";
import { filterCorrelations, findCorrelation } from "../../core/index.js";
import { CAUTION, correlationEntry } from "../derived-answer.js";
import { requireJsonAnswer } from "../media-negotiation.js";
import { ProblemError } from "../problems.js";
import { correlationDescription, correlationFilter, correlationList, correlationQuery } from "../schemas/correlations.js";
import { problemResponse, requestProblemResponses } from "../schemas/problem.js";

/** The catalogue of published empirical correlations, with their citations and calibration ranges. */
export default async function correlationRoutes(instance: FastifyInstance): Promise<void> {
  const app = instance.withTypeProvider<ZodTypeProvider>();

  app.get(
    "/v1/correlations",
    {
      schema: {
        tags: ["correlations"],
        summary: "The catalogue of empirical correlations (static Young's modulus, UCS, friction angle, Vs, density, brittleness).",
        description: `Filter by kind and lithology, in any case (kind=UCS reads as ucs); lithology lists every correlation that applies to the rock named, those of its group and of any rock included. ${CAUTION}`,
        querystring: correlationFilter,
        response: { 200: correlationList, 400: problemResponse(400), 406: problemResponse(406), ...requestProblemResponses },
      },
    },
    async (request) => {
      requireJsonAnswer(request.headers.accept);
      const correlations = filterCorrelations(request.query).map(correlationEntry);
      return { count: correlations.length, correlations, caution: CAUTION };
    },
  );

  app.get(
    "/v1/correlations/:id",
    {
      schema: {
        tags: ["correlations"],
        summary: "One correlation: formula, inputs and units, calibration ranges, citation and caveats.",
        params: z.object({ id: z.string().meta({ examples: ["static_e.lacy1997_sandstone"] }) }),
        querystring: correlationQuery,
        response: { 200: correlationDescription, 400: problemResponse(400), 404: problemResponse(404), 406: problemResponse(406), ...requestProblemResponses },
      },
    },
    async (request) => {
      requireJsonAnswer(request.headers.accept);
      const correlation = findCorrelation(request.params.id);
      if (correlation === undefined) {
        throw new ProblemError("not-found", `There is no correlation "${request.params.id}"; GET /v1/correlations lists the catalogue.`);
      }
      return correlationEntry(correlation);
    },
  );
}
