/**
 * Streaming conversion of well files (CSV, LAS and NDJSON answers): rows are read, computed and written batch by
 * batch while the file is still arriving. The checks compare the streamed answers with the JSON answer of the same
 * file, which is computed over the whole file at once, so that a batch boundary that shifted, lost or repeated a
 * row would show. The well is Marram Bank 7, the benchmark's fictional well.
 */
import { Readable } from "node:stream";
import { setTimeout as sleep } from "node:timers/promises";
import { describe, expect, it } from "vitest";
import { request } from "undici";
import { syntheticWell, syntheticWellCsv, syntheticWellLas } from "../../bench/synthetic-well.js";
import { flagBit, parseCsv, parseLas, type FlagCode } from "../../core/index.js";
import { HELD_ANSWER_BYTES } from "../../server/routes/logs.js";
import { BATCH_ROWS } from "../../server/well-stream.js";
import { build } from "../helpers/build.js";

const ROWS = 3 * BATCH_ROWS + 123;
const well = syntheticWell(ROWS, 11);
const LAS = [...syntheticWellLas(well)].join("");
const CSV = [...syntheticWellCsv(well)].join("");

const post = async (body: string, format: string, extra = "") => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?format=${format}&correlations=static_e.eissa1988${extra}`, payload: body, headers: { "content-type": "text/plain" } });
};

const column = (table: { curves: { mnemonic: string }[]; columns: Float64Array[] }, mnemonic: string) => {
  const at = table.curves.findIndex((curve) => curve.mnemonic === mnemonic);
  expect(at, mnemonic).toBeGreaterThanOrEqual(0);
  return Array.from(table.columns[at], (value) => (Number.isNaN(value) ? null : value));
};

describe("streamed answers of a file longer than one batch", () => {
  it("CSV out with digits=exact: every row equals the whole-file JSON answer's row, in order (E, nu, Vp/Vs, the derived estimate, the flags)", async () => {
    const [json, csv] = await Promise.all([post(LAS, "json"), post(LAS, "csv", "&digits=exact")]);
    expect(csv.statusCode).toBe(200);
    const whole = json.json();
    const table = parseCsv(csv.body).table;
    expect(table.columns[0]).toHaveLength(ROWS);
    expect(column(table, "DEPT")).toEqual(Array.from(well.depthMetres));
    expect(column(table, "EL_E")).toEqual(whole.E);
    expect(column(table, "EL_NU")).toEqual(whole.nu);
    expect(column(table, "EL_VPVS")).toEqual(whole.vp_vs);
    expect(column(table, "EL_STATIC_E_EISSA1988")).toEqual(whole.derived["static_e.eissa1988"].values);
    const masks = new Array<number>(ROWS).fill(0);
    for (const flag of whole.flags as { index: number; code: FlagCode }[]) masks[flag.index] |= flagBit(flag.code);
    expect(column(table, "EL_QC")).toEqual(masks);
    expect(masks.filter((mask) => mask !== 0).length).toBeGreaterThan(ROWS / 100);
  });

  it("CSV out by default: computed values rounded to 8 significant digits as Number.prototype.toPrecision(8) rounds them (ECMA-262), input values as read", async () => {
    const [json, csv] = await Promise.all([post(LAS, "json"), post(LAS, "csv")]);
    const table = parseCsv(csv.body).table;
    const rounded = (values: (number | null)[]) => values.map((value) => (value === null ? null : Number(value.toPrecision(8))));
    expect(column(table, "EL_E")).toEqual(rounded(json.json().E));
    expect(column(table, "EL_MURHO")).toEqual(rounded(json.json().mu_rho));
    expect(column(table, "DTC")).toEqual(Array.from(well.dtcMicrosecondsPerFoot));
    const five = parseCsv((await post(LAS, "csv", "&digits=5")).body).table;
    expect(column(five, "EL_NU")).toEqual(json.json().nu.map((value: number | null) => (value === null ? null : Number(value.toPrecision(5)))));
  });

  it("digits is refused with a 400 naming it for JSON and NDJSON answers (full doubles), and outside 1–15", async () => {
    for (const [format, digits] of [["json", "8"], ["ndjson", "8"], ["csv", "16"], ["csv", "0"], ["las", "eight"]]) {
      const response = await post("DEPT,DTC,DTS,RHOB\n1,100,200,2.3\n", format, `&digits=${digits}`);
      expect(response.statusCode, `${format} ${digits}`).toBe(400);
      expect(JSON.stringify(response.json().errors)).toContain("digits");
    }
  });

  it("LAS out of a LAS file: read back, the input curves are the file's and the computed curves match the JSON answer to the 8 digits written", async () => {
    const [json, las] = await Promise.all([post(LAS, "json"), post(LAS, "las")]);
    const whole = json.json();
    const table = parseLas(las.body).table;
    expect(column(table, "DTC")).toEqual(Array.from(well.dtcMicrosecondsPerFoot));
    const written = column(table, "EL_E");
    expect(written).toHaveLength(ROWS);
    written.forEach((value, i) => {
      // A LAS reader keeps the null value as written (CWLS LAS 2.0, ~W NULL).
      if (whole.E[i] === null) expect(value).toBe(-999.25);
      else expect(Math.abs((value as number) - whole.E[i])).toBeLessThanOrEqual(Math.abs(whole.E[i]) * 1e-7);
    });
  });

  it("LAS out of a CSV file (STRT and STOP need every row: its input columns are held to the end): the index runs from the first depth to the last", async () => {
    const las = await post(CSV, "las");
    expect(las.statusCode).toBe(200);
    const document = parseLas(las.body);
    expect(document.table.columns[0]).toHaveLength(ROWS);
    expect(document.warnings.filter((warning) => /STRT|STOP|STEP/.test(warning.message))).toEqual([]);
    expect(document.table.columns[0][ROWS - 1]).toBe(well.depthMetres[ROWS - 1]);
  });

  it("NDJSON out: one line per row, indexes 0 … n−1 across batch boundaries, every value and flag as in the JSON answer", async () => {
    const [json, ndjson] = await Promise.all([post(CSV, "json"), post(CSV, "ndjson")]);
    const answer = json.json();
    const lines = ndjson.body.trimEnd().split("\n").map((line) => JSON.parse(line));
    expect(lines.map((line) => line.index)).toEqual(Array.from({ length: ROWS }, (_, i) => i));
    for (const key of ["depth", "E", "nu", "G", "K", "lambda", "M", "vp_vs", "p_impedance", "s_impedance", "lambda_rho", "mu_rho", "vp", "vs", "rho"]) {
      expect(lines.map((line) => line[key]), key).toEqual(answer[key]);
    }
    expect(lines.map((line) => line["static_e.eissa1988"])).toEqual(answer.derived["static_e.eissa1988"].values);
    const flagsByRow = lines.map(() => [] as string[]);
    for (const flag of answer.flags as { index: number; code: string }[]) flagsByRow[flag.index].push(flag.code);
    expect(lines.map((line) => line.flags)).toEqual(flagsByRow);
    expect(Object.keys(lines[0])).toEqual(["index", "depth", "E", "nu", "G", "K", "lambda", "M", "vp_vs", "p_impedance", "s_impedance", "lambda_rho", "mu_rho", "vp", "vs", "rho", "static_e.eissa1988", "flags"]);
  });

  it("the CSV, LAS and NDJSON answers of the file fed in chunks of 997 bytes (splitting numbers, lines and batches) equal those of the whole file", async () => {
    const app = await build();
    const bytes = Buffer.from(LAS);
    for (const format of ["csv", "las", "ndjson"]) {
      const url = `/v1/logs?format=${format}`;
      const whole = await app.inject({ method: "POST", url, payload: bytes, headers: { "content-type": "text/plain" } });
      const pieces = Array.from({ length: Math.ceil(bytes.length / 997) }, (_, i) => bytes.subarray(i * 997, i * 997 + 997));
      const chunked = await app.inject({ method: "POST", url, payload: Readable.from(pieces), headers: { "content-type": "text/plain" } });
      expect(chunked.statusCode).toBe(200);
      expect(chunked.body.length).toBeGreaterThan(bytes.length);
      expect(chunked.body === whole.body, format).toBe(true);
    }
  });

  it.each([
    ["CSV out of a LAS file", LAS, "csv"],
    ["LAS out of a CSV file (converted batch by batch once every row is read)", CSV, "las"],
  ])("the event loop gets a turn after every batch while a file already in memory converts, so other requests are not starved: %s", async (_, file, format) => {
    const app = await build();
    const bytes = Buffer.from(file);
    // Counts the event loop's iterations: a callback that schedules itself again runs once per iteration.
    let turns = 0;
    let ticker: NodeJS.Immediate;
    const tick = () => {
      turns++;
      ticker = setImmediate(tick);
    };
    ticker = setImmediate(tick);
    try {
      const answer = await app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload: Readable.from([bytes]), headers: { "content-type": "text/plain" } });
      expect(answer.statusCode).toBe(200);
    } finally {
      clearImmediate(ticker);
    }
    // A turn at least after every batch (the file is 3 batches and a part).
    expect(turns).toBeGreaterThanOrEqual(Math.ceil(ROWS / BATCH_ROWS));
  });

  it("a problem found within the held part of the answer is still a 422 problem naming the line", async () => {
    const lines = LAS.split("\r\n");
    const bad = lines.length - 10;
    lines[bad] = lines[bad].replace(/\d+\.\d+/, "12.3.4");
    const response = await post(lines.join("\r\n"), "csv");
    expect(response.statusCode).toBe(422);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json().errors[0].line).toBe(bad + 1);
  });
});

describe("streaming over a real socket (undici client)", () => {
  const BIG_ROWS = 120_000;
  const big = syntheticWell(BIG_ROWS, 5);
  const bigLas = Buffer.from([...syntheticWellLas(big)].join(""));

  const serve = async () => {
    const app = await build();
    return app.listen({ port: 0, host: "127.0.0.1" });
  };

  it(`the answer begins before the upload ends: the first ${HELD_ANSWER_BYTES / 2 ** 20} MiB of answer are out while half the file is still unsent`, async () => {
    const base = await serve();
    const half = Math.floor(bigLas.length / 2);
    let answerStarted = false;
    let sentSecondHalfAfterAnswer: boolean | undefined;
    async function* body() {
      yield bigLas.subarray(0, half);
      for (let waited = 0; !answerStarted && waited < 20_000; waited += 20) await sleep(20);
      sentSecondHalfAfterAnswer = answerStarted;
      yield bigLas.subarray(half);
    }
    const answer = await request(`${base}/v1/logs?format=csv`, { method: "POST", body: Readable.from(body()), headers: { "content-type": "text/plain" } });
    answerStarted = true;
    expect(answer.statusCode).toBe(200);
    const text = await answer.body.text();
    expect(sentSecondHalfAfterAnswer).toBe(true);
    expect(parseCsv(text).table.columns[0]).toHaveLength(BIG_ROWS);
  });

  it("a problem found after the answer began cuts the transfer short (the client sees an error, never a file that looks whole), and the service keeps answering", async () => {
    const base = await serve();
    const text = bigLas.toString("latin1");
    const broken = Buffer.from(`${text.slice(0, text.length - 200)} 12.3.4\r\n`, "latin1");
    const answer = await request(`${base}/v1/logs?format=csv`, { method: "POST", body: broken, headers: { "content-type": "text/plain" } });
    expect(answer.statusCode).toBe(200);
    await expect(answer.body.text()).rejects.toThrow();
    const health = await request(`${base}/livez`);
    expect(health.statusCode).toBe(200);
    await health.body.dump();
    // The destroyed response never reaches the request counter; its own counter says it happened.
    const metrics = await (await request(`${base}/metrics`)).body.text();
    expect(metrics).toMatch(/^elastilog_answers_cut_short_total\{route="\/v1\/logs"\} 1$/m);
  });
});
