import { availableParallelism } from "node:os";
import { Readable } from "node:stream";
import { fileURLToPath } from "node:url";
import type { FastifyReply } from "fastify";
import { Piscina } from "piscina";
import { columnJson } from "../core/index.js";
import type { AnswerParts, ColumnsBody, PreparedAnswer } from "./elastic-columns.js";
import { ProblemError } from "./problems.js";
import type { LogsResult, LogsTask } from "./logs-task.js";
import type { Outcome } from "./workers/answer-worker.js";

/** Below this many numbers an answer is written on the event loop: a worker round trip would cost more. */
const PARALLEL_NUMBERS = 20_000;

// Under tsx or vitest this module is TypeScript, and so is its worker, which a small bootstrap loads through tsx.
const runningTypeScript = new URL(import.meta.url).pathname.endsWith(".ts");
const WORKER = new URL(runningTypeScript ? "./workers/typescript-worker.mjs" : "./workers/answer-worker.js", import.meta.url);

/** Hands a body to another thread without copying when the Buffer owns its whole ArrayBuffer. */
const transferable = (bytes: Buffer): Uint8Array =>
  bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : Uint8Array.prototype.slice.call(bytes);

/**
 * Worker threads for the heavy part of large answers (issue: big requests must not starve small ones):
 * parsing and computing a large JSON body, and writing large columns as JSON text in parallel.
 * Threads start on first use and stop after a minute idle.
 */
export class AnswerPool {
  private pool: Piscina | undefined;

  private readonly threads: number;

  constructor(threads: number = availableParallelism()) {
    this.threads = Math.max(1, threads);
  }

  private workers(): Piscina {
    this.pool ??= new Piscina({
      filename: fileURLToPath(WORKER),
      maxThreads: this.threads,
      minThreads: 0,
      idleTimeout: 60_000,
    });
    return this.pool;
  }

  /** `POST /v1/elastic` body to the prepared answer, on a worker; a request problem is thrown as ProblemError. */
  async prepare(body: ColumnsBody, maxSamples: number, format: "json" | "arrow"): Promise<PreparedAnswer> {
    const bytes = transferable(Buffer.from(body.bytes.buffer, body.bytes.byteOffset, body.bytes.byteLength));
    const outcome = (await this.workers().run(
      { body: { ...body, bytes }, maxSamples, format },
      { name: "prepare", transferList: [bytes.buffer as ArrayBuffer] },
    )) as Outcome<PreparedAnswer>;
    if ("problem" in outcome) throw new ProblemError(outcome.problem.slug, outcome.problem.detail, outcome.problem.errors);
    return outcome.ok;
  }

  /** A whole well converted on a worker (`server/logs-task.ts`); the file's bytes are handed over, not copied. */
  async logs(task: LogsTask): Promise<LogsResult> {
    const chunks = task.chunks.map((chunk) => transferable(Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength)));
    const outcome = (await this.workers().run({ ...task, chunks }, { name: "logs", transferList: chunks.map((chunk) => chunk.buffer as ArrayBuffer) })) as Outcome<LogsResult>;
    if ("problem" in outcome) throw new ProblemError(outcome.problem.slug, outcome.problem.detail, outcome.problem.errors);
    return outcome.ok;
  }

  /**
   * Columns as JSON text, one task per column spread over the workers, each promise settling as its column is
   * written, so that the answer can start while later columns are still being written. The columns' memory is
   * handed over, not copied (a copy of a whole well's columns would hold the event loop for tens of
   * milliseconds): they are unusable here afterwards.
   */
  serialize(columns: Float64Array[]): Promise<Buffer>[] {
    // A buffer can be handed over once: a column that shares one (a view, or the same column twice) goes as a copy.
    const handed = new Set<ArrayBufferLike>();
    return columns.map(async (column) => {
      const whole = column.byteOffset === 0 && column.byteLength === column.buffer.byteLength;
      const owned = !whole || handed.has(column.buffer) ? column.slice() : column;
      handed.add(owned.buffer);
      const { texts } = (await this.workers().run({ columns: [owned] }, { name: "serialize", transferList: [owned.buffer as ArrayBuffer] })) as { texts: Uint8Array[] };
      return Buffer.from(texts[0].buffer, texts[0].byteOffset, texts[0].byteLength);
    });
  }

  async close(): Promise<void> {
    await this.pool?.destroy();
    this.pool = undefined;
  }
}

/** Bytes per write to a socket: a whole column's text in one write would hold the event loop for tens of milliseconds. */
const WRITE_BYTES = 1 << 20;

/** Views of at most WRITE_BYTES on `bytes`, without copying. */
export function* socketSized(bytes: Uint8Array): Generator<Buffer> {
  for (let at = 0; at < bytes.byteLength; at += WRITE_BYTES) {
    yield Buffer.from(bytes.buffer, bytes.byteOffset + at, Math.min(WRITE_BYTES, bytes.byteLength - at));
  }
}

/**
 * Sends an answer cut at its columns: small ones joined on the event loop; large ones written by the workers and
 * streamed piece by piece, each column as soon as it and those before it are written.
 */
export const sendAnswer = async (reply: FastifyReply, answer: AnswerParts, pool: AnswerPool) => {
  reply.type("application/json; charset=utf-8");
  const numbers = answer.columns.reduce((sum, column) => sum + column.length, 0);
  if (numbers < PARALLEL_NUMBERS) {
    return reply.send(answer.parts.map((part, i) => (i < answer.columns.length ? part + columnJson(answer.columns[i]) : part)).join(""));
  }
  const texts = pool.serialize(answer.columns);
  // Awaited in order below; a failure is seen there (the answer is cut short), never as an unhandled rejection.
  for (const text of texts) text.catch(() => undefined);
  // The first column is awaited before the answer starts: a worker that cannot start is still a problem answer.
  const first = await texts[0];
  async function* pieces(): AsyncGenerator<Buffer> {
    for (let i = 0; i < answer.parts.length; i++) {
      yield Buffer.from(answer.parts[i]);
      if (i < texts.length) yield* socketSized(i === 0 ? first : await texts[i]);
    }
  }
  // Bytes, not objects: the stream then buffers at most one MiB ahead of the socket.
  return reply.send(Readable.from(pieces(), { objectMode: false, highWaterMark: WRITE_BYTES }));
};
