import { setImmediate } from "node:timers/promises";
import { absentAsNaN, AsciiText, computeElasticLog, type FlagSummary, summariseFlags } from "../core/index.js";
import { deriveProperties } from "./derived-request.js";
import { asFileProblem, conversionOptions, correlationIds } from "./logs-task.js";
import { ProblemError } from "./problems.js";
import type { LogsQuery } from "./schemas/logs.js";
import { planConversion, requestForRows, type ConversionPlan } from "./well-conversion.js";
import { createWellOutput, type TextFormat, type WellOutput } from "./well-output.js";
import { WellFileReader, type FileEncoding, type WellHeader } from "./well-upload.js";

export interface WellStreamTask {
  query: LogsQuery;
  format: TextFormat;
  maxSamples: number;
  /** Bytes of file accepted in one request. */
  byteLimit: number;
  /** The encoding the request declared (`charset=`); undefined: found from the bytes. */
  encoding?: FileEncoding;
}

/** Rows converted and written at a time: enough to amortise the work per batch, few enough to keep the event loop answering. */
export const BATCH_ROWS = 1024;

/** Joins batches of rows (one array per curve each) into one array per curve. */
const joinRows = (batches: Float64Array[][], rows: number): Float64Array[] => {
  if (batches.length === 1) return batches[0];
  return batches[0].map((_, c) => {
    const column = new Float64Array(rows);
    let at = 0;
    for (const batch of batches) {
      column.set(batch[c], at);
      at += batch[c].length;
    }
    return column;
  });
};

const mergeSummary = (total: FlagSummary, part: FlagSummary): void => {
  total.count += part.count;
  total.valid += part.valid;
  for (const [code, count] of Object.entries(part.flags) as [keyof FlagSummary["flags"], number][]) total.flags[code] = (total.flags[code] ?? 0) + count;
};

/**
 * Converts a well file to CSV, LAS or NDJSON while it is still arriving: bytes are read, complete rows taken
 * from the reader, computed and written batch by batch, so a file of any length converts in bounded memory.
 * The one exception is LAS out of a CSV file, whose STRT, STOP and STEP must be known before the first line: its
 * input columns are held until the end (8 bytes per value read), then converted and written batch by batch like
 * the others. Every problem with the request is thrown as a ProblemError; when it is thrown after the
 * first text has been handed out, the caller can only cut the answer short. `done` receives the flag summary.
 */
export async function* convertWellStream(source: AsyncIterable<Uint8Array>, task: WellStreamTask, done: (summary: FlagSummary) => void): AsyncGenerator<Buffer> {
  const { query, format } = task;
  const options = conversionOptions(query);
  const ids = correlationIds(query);
  const reader = new WellFileReader({ encoding: task.encoding, nullValue: query.null_value });
  const text = new AsciiText(1 << 20);
  const summary: FlagSummary = { count: 0, valid: 0, flags: {} };
  let setup: { plan: ConversionPlan; output: WellOutput; curveCount: number } | undefined;
  let held: Float64Array[][] = [];
  let heldRows = 0;
  let written = 0;
  let batches = 0;
  let bytes = 0;

  const begin = (header: WellHeader) => {
    const plan = planConversion(header, options);
    setup = { plan, output: createWellOutput(format, header, plan, query.digits), curveCount: header.curves.length };
  };
  const hold = (rows: Float64Array[]) => {
    const count = rows[0]?.length ?? 0;
    if (count === 0) return;
    held.push(rows);
    heldRows += count;
    if (written + heldRows > task.maxSamples) {
      throw new ProblemError("too-many-samples", `The file has more than ${task.maxSamples} samples, the most accepted in one request. Split the well.`);
    }
  };
  /**
   * The first `count` held rows (all when fewer), taken out of the held ones: only the pieces that hold them are
   * joined (views, not copies, where one piece holds them all), so a whole file held is never copied at once.
   */
  const takeHeld = (count: number): Float64Array[] => {
    const taken = Math.min(count, heldRows);
    let pieces = 0;
    let rows = 0;
    while (rows < taken) rows += held[pieces++][0].length;
    const joined = joinRows(held.slice(0, pieces), rows);
    const rest = joined.map((column) => column.subarray(taken));
    held = rest[0].length > 0 ? [rest, ...held.slice(pieces)] : held.slice(pieces);
    heldRows -= taken;
    return joined.map((column) => column.subarray(0, taken));
  };
  /** Converts and writes the next batch: `count` held rows, or all of them; an empty file still gets its header. */
  const convert = (count = heldRows): Buffer => {
    const { plan, output, curveCount } = setup as NonNullable<typeof setup>;
    const columns = held.length === 0 ? Array.from({ length: curveCount }, () => new Float64Array(0)) : takeHeld(count);
    const log = computeElasticLog(requestForRows(plan, columns));
    // An absent input value (NaN where the reader read NA, NaN or an empty cell; else the null value) is NaN from here on, so
    // that it is written as every absent value is: an empty cell in CSV, the answer's NULL in LAS, null in NDJSON.
    // A column holding no null value is passed on as it is (one scan, no copy).
    for (let c = 0; c < columns.length; c++) columns[c] = absentAsNaN(columns[c], plan.nullValue);
    const depthIndex = plan.curves.depth?.index;
    const depth = depthIndex === undefined ? undefined : columns[depthIndex];
    const derived = deriveProperties(log, { correlations: ids }, "query");
    mergeSummary(summary, summariseFlags(log.flags, log.invalidMask));
    output.batch({ first: written, input: columns, log, derived, depth }, text);
    written += log.length;
    batches++;
    const bytes = text.take();
    return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  };

  try {
    for await (const chunk of source) {
      bytes += chunk.length;
      if (bytes > task.byteLimit) {
        throw new ProblemError("body-too-large", `The file is larger than this endpoint's limit of ${task.byteLimit} bytes. Split the well, or ask the operator to raise FILE_BODY_LIMIT_BYTES.`);
      }
      reader.push(chunk);
      if (setup === undefined) {
        const header = reader.header();
        if (header === undefined) continue;
        begin(header);
      }
      hold(reader.takeRows());
      while (setup !== undefined && setup.output.wholeFile === undefined && heldRows >= BATCH_ROWS) {
        yield convert(BATCH_ROWS);
        // A body already buffered is read, and batches handed on, in promise callbacks alone, which never let the
        // event loop take other connections' requests: give it a turn after each batch.
        await setImmediate();
      }
    }
    const file = reader.end();
    // A file read to its end without error has its header (LAS ~A reached, CSV header line read).
    if (setup === undefined) begin(reader.header() as WellHeader);
    hold(file.table.columns);
    const { output, plan } = setup as NonNullable<typeof setup>;
    // A held curve joined whole on request (the index, for STRT, STOP and STEP); the rows go on in batches below.
    output.wholeFile?.(heldRows, (c) => {
      const column = heldRows === 0 ? new Float64Array(0) : joinRows(held.map((rows) => [rows[c]]), heldRows)[0];
      return c === plan.curves.depth?.index ? absentAsNaN(column, plan.nullValue) : column;
    });
    while (heldRows > 0) {
      yield convert(BATCH_ROWS);
      await setImmediate();
    }
    if (batches === 0) yield convert();
  } catch (error) {
    throw asFileProblem(error);
  }
  done(summary);
}
