import { z } from "zod";
import { PROBLEM_MEDIA_TYPE } from "../problems.js";

export const problemSchema = z
  .object({
    type: z.string().meta({ description: "URI of the kind of problem; GET it for an explanation.", examples: ["/problems/invalid-request"] }),
    title: z.string(),
    status: z.int(),
    detail: z.string().meta({ description: "What is wrong with this request and what to change." }),
    request_id: z.string().optional(),
    errors: z
      .array(z.object({ field: z.string(), index: z.int().optional(), message: z.string() }))
      .optional()
      .meta({ description: "One entry per bad field (and row, for a column element)." }),
  })
  .meta({ id: "Problem", description: "RFC 9457 problem details." });

const problemResponse = (description: string) => ({
  description,
  content: { [PROBLEM_MEDIA_TYPE]: { schema: problemSchema } },
});

/** The error answers every route may give, for the OpenAPI document. */
export const commonProblemResponses = {
  400: problemResponse("The request is not valid: the `errors` list names each bad field and row."),
  401: problemResponse("An API key is required (only when the service runs with API_KEYS): send Authorization: Bearer <key>."),
  404: problemResponse("No such path."),
  406: problemResponse("None of the media types in Accept can be produced."),
  413: problemResponse("The body, or the number of samples, is over the limit."),
  415: problemResponse("The body's content type is not accepted here."),
  500: problemResponse("A fault of the service (never caused by input); quote request_id when reporting it."),
  503: problemResponse("The service is overloaded or shutting down; retry after the seconds in Retry-After."),
} as const;
