import { jsonSchemaTransformObject } from "fastify-type-provider-zod";
import { logsRequestBody } from "./schemas/logs.js";
import { problemResponseComponents } from "./schemas/problem.js";

type TransformObject = typeof jsonSchemaTransformObject;
type Document = ReturnType<TransformObject>;

const REF_PREFIX = "#/components/schemas/";

const collectRefs = (value: unknown, found: Set<string>): void => {
  if (Array.isArray(value)) value.forEach((item) => collectRefs(item, found));
  else if (value !== null && typeof value === "object") {
    for (const [key, child] of Object.entries(value)) {
      if (key === "$ref" && typeof child === "string" && child.startsWith(REF_PREFIX)) found.add(child.slice(REF_PREFIX.length));
      else collectRefs(child, found);
    }
  }
};

/**
 * The zod type provider writes every registered schema twice (an input and an output variant).
 * Keep only the component schemas the paths and responses actually reference, directly or through other
 * components, so the published document lists each schema once. Adds one problem response per status
 * (`components.responses`), so the document lists every problem type, even those no operation declares, and
 * the request body of `POST /v1/logs`, which the route reads as a stream with no schema to describe it.
 */
export const transformObject: TransformObject = (input) => {
  const document = jsonSchemaTransformObject(input) as Document & { components?: { schemas?: Record<string, unknown> } };
  const schemas = document.components?.schemas;
  if (schemas === undefined) return document;
  const responses = { ...problemResponseComponents(`${REF_PREFIX}Problem`), ...(document.components as { responses?: object }).responses };
  const used = new Set<string>();
  collectRefs([(document as { paths?: unknown }).paths, responses], used);
  for (let size = -1; size !== used.size; ) {
    size = used.size;
    for (const name of [...used]) collectRefs(schemas[name], used);
  }
  const logs = (document as { paths?: Record<string, { post?: Record<string, unknown> }> }).paths?.["/v1/logs"]?.post;
  if (logs !== undefined) logs.requestBody = logsRequestBody;
  document.components = {
    ...document.components,
    schemas: Object.fromEntries(Object.entries(schemas).filter(([name]) => used.has(name))),
    responses,
  };
  return document;
};
