import type { FastifyInstance } from "fastify";
import { afterAll, beforeAll, expect } from "vitest";
import { buildApp } from "../../server/app.js";
import { csvDataRecords, lasSampleCount } from "./well-texts.js";

/** Longest one fuzz case may take before it counts as a hang (not a speed check: a sound case takes milliseconds). */
export const CASE_BOUND_MS = 15_000;

/** Fixed, so a failure reproduces; fast-check prints the seed and path of a counterexample. */
export const FUZZ_SEED = 20_260_405;

export { withinBound } from "./within-bound.js";

export interface Answer {
  statusCode: number;
  headers: Record<string, string | string[] | number | undefined>;
  body: string;
}

/** The columns every /v1/elastic and /v1/logs JSON answer carries, one value per input row (README, "Endpoints"). */
export const PROPERTY_COLUMNS = ["E", "nu", "G", "K", "lambda", "M", "vp_vs", "p_impedance", "s_impedance", "lambda_rho", "mu_rho", "vp", "vs"];

const contentType = (answer: Answer): string => String(answer.headers["content-type"] ?? "");

/**
 * A 2xx, or a 4xx RFC 9457 problem document (`application/problem+json` with `type`, `title`,
 * `status` equal to the HTTP status, and `detail`); never a 5xx. Every answer carries x-request-id.
 */
export const expectSuccessOrProblem = (answer: Answer, input: string): void => {
  const where = `${answer.statusCode} ${answer.body.slice(0, 300)}\nfor input: ${input.slice(0, 300)}`;
  expect((answer.statusCode >= 200 && answer.statusCode < 300) || (answer.statusCode >= 400 && answer.statusCode < 500), where).toBe(true);
  expect(answer.headers["x-request-id"], where).toBeTypeOf("string");
  if (answer.statusCode < 400) return;
  expect(contentType(answer), where).toMatch(/^application\/problem\+json\b/);
  const problem = JSON.parse(answer.body) as Record<string, unknown>;
  expect(problem.type, where).toBeTypeOf("string");
  expect(problem.title, where).toBeTypeOf("string");
  expect(problem.status, where).toBe(answer.statusCode);
  expect(problem.detail, where).toBeTypeOf("string");
};

/** A JSON column answer keeps every row: `count`, the summary, every property column and every derived column have `rows` entries. */
export const expectColumnsOfLength = (json: Record<string, unknown>, rows: number, input: string): void => {
  const where = `for input: ${input.slice(0, 300)}`;
  expect(json.count, where).toBe(rows);
  expect((json.summary as { count: number }).count, where).toBe(rows);
  for (const key of PROPERTY_COLUMNS) expect((json[key] as unknown[]).length, `${key} ${where}`).toBe(rows);
  for (const key of ["depth", "top", "base"]) {
    if (json[key] !== undefined) expect((json[key] as unknown[]).length, `${key} ${where}`).toBe(rows);
  }
  for (const [id, derived] of Object.entries((json.derived ?? {}) as Record<string, { values: unknown[] }>)) {
    expect(derived.values.length, `derived ${id} ${where}`).toBe(rows);
  }
  for (const flag of json.flags as { index: number }[]) expect(flag.index, where).toBeLessThan(rows);
};

/** The rows of a 2xx well answer in whichever format it came: JSON columns, CSV records or LAS samples. */
export const expectWellRows = (answer: Answer, rows: number, input: string): void => {
  const type = contentType(answer);
  if (type.startsWith("application/json")) expectColumnsOfLength(JSON.parse(answer.body), rows, input);
  else if (type.startsWith("text/csv")) expect(csvDataRecords(answer.body), `CSV answer for input: ${input.slice(0, 300)}`).toBe(rows);
  else if (type.startsWith("application/x-las")) expect(lasSampleCount(answer.body), `LAS answer for input: ${input.slice(0, 300)}`).toBe(rows);
  else expect.fail(`unexpected content type ${type} for a 2xx well answer`);
};

/**
 * One app for a fuzzing file, built before its tests and closed after them, with load shedding off: a refusal under
 * the fuzzer's own load would hide what the service does with each input.
 */
export const fuzzedApp = (): Pick<FastifyInstance, "inject"> => {
  let app: FastifyInstance | undefined;
  beforeAll(async () => {
    app = await buildApp({ logger: false, config: { maxEventLoopDelayMs: 0 } });
    await app.ready();
  });
  afterAll(async () => {
    await app?.close();
  });
  return { inject: ((...args: Parameters<FastifyInstance["inject"]>) => (app as FastifyInstance).inject(...args)) as FastifyInstance["inject"] };
};
