import { readlinkSync } from "node:fs";
import { setPriority } from "node:os";
import { Piscina } from "piscina";
import { isProblemError, type ProblemSlug, type ProblemFieldError } from "../problems.js";
import { columnJsonBytes } from "../../core/index.js";
import { prepareColumnsAnswer, type ColumnsBody, type PreparedAnswer } from "../elastic-columns.js";
import { convertLogs, type LogsResult, type LogsTask } from "../logs-task.js";

/** Nice value of the worker threads: above the event loop's 0, so that probes and small requests get a core first. */
export const WORKER_NICENESS = 10;

/**
 * Lowers this thread's scheduling priority. On Linux a thread is a task with its own id (from /proc/thread-self)
 * whose priority setpriority(2) sets alone; elsewhere, or where the system refuses, the thread keeps its priority.
 */
const yieldToTheEventLoop = (): void => {
  try {
    const threadId = Number(readlinkSync("/proc/thread-self").split("/").at(-1));
    if (Number.isSafeInteger(threadId) && threadId > 0) setPriority(threadId, WORKER_NICENESS);
  } catch {
    // Not Linux, or not allowed: the work still runs off the event loop, only without the lower priority.
  }
};
// Only in a pool's thread: a module that merely imports this file (a test) keeps its priority.
if (Piscina.isWorkerThread) yieldToTheEventLoop();

/** What crosses back from a worker: errors as data (class instances lose their prototype between threads). */
export type Outcome<T> = { ok: T } | { problem: { slug: ProblemSlug; detail: string; errors?: ProblemFieldError[] } };

/** Hands the columns' buffers over to the receiving thread instead of copying them (Piscina's Transferable interface). */
const transferring = <T extends object>(value: T, buffers: ArrayBufferLike[]) =>
  Piscina.move({
    [Piscina.transferableSymbol]: buffers,
    [Piscina.valueSymbol]: value,
  } as never) as unknown as T;

/** Task `prepare`: parse, validate and compute a `POST /v1/elastic` body. */
export function prepare({ body, maxSamples, format }: { body: ColumnsBody; maxSamples: number; format: "json" | "arrow" }) {
  try {
    const answer = prepareColumnsAnswer(body, maxSamples, format);
    const buffers = [...new Set(answer.kind === "json" ? answer.columns.map((column) => column.buffer) : answer.pieces.map((piece) => piece.buffer))];
    return transferring({ ok: answer } satisfies Outcome<PreparedAnswer>, buffers);
  } catch (error) {
    if (isProblemError(error)) return { problem: { slug: error.slug, detail: error.detail, errors: error.errors } } satisfies Outcome<PreparedAnswer>;
    throw error;
  }
}

/** Task `serialize`: columns as JSON text, ASCII bytes (numbers, commas, brackets and null only), each in a buffer of its own. */
export function serialize({ columns }: { columns: Float64Array[] }) {
  const texts = columns.map(columnJsonBytes);
  return transferring({ texts }, texts.map((text) => text.buffer));
}

/** Task `logs`: read and convert a whole well for a JSON answer. */
export async function logs(task: LogsTask) {
  try {
    const result = await convertLogs(task);
    const buffers = result.columns.map((column) => column.buffer);
    return transferring({ ok: result } satisfies Outcome<LogsResult>, buffers);
  } catch (error) {
    if (isProblemError(error)) return { problem: { slug: error.slug, detail: error.detail, errors: error.errors } } satisfies Outcome<LogsResult>;
    throw error;
  }
}
