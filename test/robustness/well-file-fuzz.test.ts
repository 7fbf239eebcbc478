import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CASE_BOUND_MS, FUZZ_SEED, expectSuccessOrProblem, expectWellRows, withinBound, fuzzedApp } from "./answer-checks.js";
import { csvDataRecords, demoCsvCut, demoLasCut, lasSampleCount } from "./well-texts.js";

type Mutation = (file: Buffer) => Buffer;

const text = (file: Buffer): string => file.toString("latin1");
const bytes = (latin1: string): Buffer => Buffer.from(latin1, "latin1");
const at = (position: number, length: number): number => position % (length + 1);

/** Edits of the file as bytes (latin1 keeps one character per byte, so binary bytes survive every edit). */
const truncate = fc.nat().map((position): Mutation => (file) => file.subarray(0, at(position, file.length)));

const insertBytes = fc
  .tuple(
    fc.nat(),
    fc.oneof(
      fc.uint8Array({ minLength: 1, maxLength: 8 }),
      fc.constantFrom([0x00], [0xff], [0xc3], [0xed, 0xa0, 0x80], [0xef, 0xbb, 0xbf], [0xf4, 0x90, 0x80, 0x80], [0x00, 0x00, 0x00, 0x00]).map((list) => Uint8Array.from(list)),
    ),
  )
  .map(([position, inserted]): Mutation => (file) => {
    const cut = at(position, file.length);
    return Buffer.concat([file.subarray(0, cut), inserted, file.subarray(cut)]);
  });

const insertText = (inserted: fc.Arbitrary<string>) =>
  fc.tuple(fc.nat(), inserted).map(([position, piece]): Mutation => (file) => {
    const cut = at(position, file.length);
    return Buffer.concat([file.subarray(0, cut), bytes(piece), file.subarray(cut)]);
  });

/** Whole lines: deleted, duplicated, or a very long one put in. */
const editLines = (edit: (lines: string[], index: number) => string[]) =>
  fc.nat().map((index): Mutation => (file) => {
    const lines = text(file).split("\n");
    return bytes(edit(lines, index % lines.length).join("\n"));
  });

const longLine = fc
  .tuple(fc.integer({ min: 1_000, max: 300_000 }), fc.constantFrom("x", "1 ", "1,", ",", '"', "\t", "9"))
  .chain(([length, unit]) => editLines((lines, index) => [...lines.slice(0, index), unit.repeat(Math.ceil(length / unit.length)), ...lines.slice(index)]));

const lineEndings = fc.constantFrom("\r\n", "\r").map((ending): Mutation => (file) => bytes(text(file).replace(/\n/g, ending)));

/**
 * `extra` more columns: in CSV the header gets names and (unless `headerOnly`) every row a value;
 * in LAS ~Curve gets items and every data line a value.
 */
const widen = fc.tuple(fc.integer({ min: 1, max: 3_000 }), fc.boolean()).map(([extra, headerOnly]): Mutation => (file) => {
  const lines = text(file).split("\n");
  const names = Array.from({ length: extra }, (_, i) => `QX${i}`);
  const data = lines.findIndex((line) => /^\s*~A/i.test(line));
  if (data === -1) {
    return bytes(lines.map((line, i) => (i === 0 ? `${line},${names.join(",")}` : headerOnly || line.trim() === "" ? line : `${line}${",7".repeat(extra)}`)).join("\n"));
  }
  const curves = lines.findIndex((line) => /^\s*~C/i.test(line));
  const afterCurves = curves === -1 ? -1 : lines.findIndex((line, i) => i > curves && /^\s*~/.test(line));
  const insertAt = afterCurves === -1 ? data : afterCurves;
  const items = names.map((name) => ` ${name}.M : extra curve`);
  const widened = lines.map((line, i) => (i > data && !headerOnly && line.trim() !== "" ? `${line}${" 7".repeat(extra)}` : line));
  return bytes([...widened.slice(0, insertAt), ...items, ...widened.slice(insertAt)].join("\n"));
});

const junkCell = fc
  .tuple(fc.nat(), fc.constantFrom("NA", "-", "nan", "1e309", "", "abc", "-999.25", "1,5", "null", '""', "0x1F"))
  .map(([which, junk]): Mutation => (file) => {
    const source = text(file);
    const numbers = [...source.matchAll(/-?\d+\.\d+/g)];
    if (numbers.length === 0) return file;
    const chosen = numbers[which % numbers.length];
    return bytes(source.slice(0, chosen.index) + junk + source.slice((chosen.index ?? 0) + chosen[0].length));
  });

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  truncate,
  insertBytes,
  insertText(fc.constantFrom('"', '""', '"\n', "~A", "~V", "#", ",", ";", "\t", "\r", " ")),
  editLines((lines, index) => lines.filter((_, i) => i !== index)),
  editLines((lines, index) => [...lines.slice(0, index + 1), lines[index], ...lines.slice(index + 1)]),
  longLine,
  lineEndings,
  fc.constant((file: Buffer) => Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), file])),
  widen,
  junkCell,
);

/** A cut of the demo well (a few dozen rows), as LAS or CSV, with a few random mutations. */
const wellFile = fc
  .tuple(fc.constantFrom("las", "csv"), fc.integer({ min: 1, max: 40 }), fc.array(mutation, { maxLength: 4 }))
  .map(([format, rows, mutations]) => mutations.reduce<Buffer>((file, mutate) => mutate(file), Buffer.from(format === "las" ? demoLasCut(rows) : demoCsvCut(rows), "utf8")));

const RAW_TYPES = ["text/plain", "text/csv", "application/octet-stream", "application/x-www-form-urlencoded", "application/x-las"];

/** How the file is sent: raw under a random content type, or as the file part of a well-formed multipart upload. */
const sending = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...RAW_TYPES, "text/plain; charset=utf-8", "TEXT/CSV", "application/x-las; charset=latin1").map((type) => ({ type, multipart: false })) },
  { weight: 1, arbitrary: fc.constantFrom("application/json", "text/html", "application/xml", "multipart/form-data; boundary=kestrel-flats", "multipart/form-data").map((type) => ({ type, multipart: false })) },
  { weight: 2, arbitrary: fc.constant({ type: "multipart/form-data; boundary=kestrel-flats", multipart: true }) },
);

const multipartOf = (file: Buffer): Buffer =>
  Buffer.concat([
    Buffer.from('--kestrel-flats\r\nContent-Disposition: form-data; name="file"; filename="well"\r\nContent-Type: application/octet-stream\r\n\r\n'),
    file,
    Buffer.from("\r\n--kestrel-flats--\r\n"),
  ]);

/** The answer format, asked by `format=` or `Accept` (RFC 9110), or left to the default. */
const asking = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom("", "?format=json", "?format=csv", "?format=las").map((query) => ({ query, accept: undefined as string | undefined })) },
  { weight: 4, arbitrary: fc.constantFrom("application/json", "text/csv", "application/x-las", "*/*", "text/csv;q=0.5, application/x-las").map((accept) => ({ query: "", accept })) },
  { weight: 1, arbitrary: fc.constantFrom("?format=xml", "?format=").map((query) => ({ query, accept: undefined as string | undefined })) },
  { weight: 1, arbitrary: fc.constantFrom("image/png", "text/*;q=0", ";;q=", "application/x-las;q=0").map((accept) => ({ query: "", accept })) },
);

/** The format the server reads the text as (README: a LAS file begins with ~ after optional # comments and blank lines). */
const readsAsLas = (decoded: string): boolean => decoded.replace(/^\uFEFF/, "").split(/\r\n|\r|\n/).find((line) => line.trim() !== "" && !line.trim().startsWith("#"))?.trim().startsWith("~") ?? false;

const app = fuzzedApp();

describe("the row counts the property below relies on", () => {
  it("count the demo well's 3,000 samples in its LAS and CSV files (README, \"A whole well\")", () => {
    expect(lasSampleCount(readFileSync(new URL("../../examples/demo-well.las", import.meta.url), "utf8"))).toBe(3000);
    expect(csvDataRecords(readFileSync(new URL("../../examples/demo-well.csv", import.meta.url), "utf8"))).toBe(3000);
  });

  it("follow RFC 4180 §2 (quoted line breaks and quotes) and skip blank records and comments before the header", () => {
    expect(csvDataRecords('A,B,C\r\n"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx\r\n')).toBe(2);
    expect(csvDataRecords('# note\n\nA;B\n1;"2""5"\n\n   \n3;4')).toBe(2);
    expect(csvDataRecords("A,B\n1,2\r3,4\r\n")).toBe(2);
  });

  it("read ~A one sample per line with WRAP NO, and per curve count with WRAP YES (CWLS LAS 2.0)", () => {
    const header = (wrap: string) => `~V\n VERS. 2.0 :\n WRAP. ${wrap} :\n~C\n DEPT.M :\n DTC.US/F :\n RHOB.G/C3 :\n~A\n`;
    expect(lasSampleCount(`${header("NO")}1 2 3\n# comment\n\n4 5 6\n`)).toBe(2);
    expect(lasSampleCount(`${header("YES")}1\n2 3\n4\n5 6\n`)).toBe(2);
  });
});

describe("POST /v1/logs under random and mutated LAS and CSV files", () => {
  it(
    "always answers 2xx or a 4xx problem document (RFC 9457), never 5xx nor a hang; a 2xx has one row per input sample in JSON, CSV and LAS",
    async () => {
      await fc.assert(
        fc.asyncProperty(wellFile, sending, asking, async (file, how, ask) => {
          const decoded = new TextDecoder("utf-8").decode(file);
          const answer = await withinBound(
            app.inject({
              method: "POST",
              url: `/v1/logs${ask.query}`,
              headers: { "content-type": how.type, ...(ask.accept === undefined ? {} : { accept: ask.accept }) },
              payload: how.multipart ? multipartOf(file) : file,
            }),
            CASE_BOUND_MS,
            "POST /v1/logs",
          );
          const described = `${how.type} ${ask.query} ${ask.accept ?? ""}\n${decoded}`;
          expectSuccessOrProblem(answer, described);
          if (answer.statusCode >= 300) return;
          expectWellRows(answer, readsAsLas(decoded) ? lasSampleCount(decoded) : csvDataRecords(decoded), described);
        }),
        { seed: FUZZ_SEED, numRuns: 250 },
      );
    },
    120_000,
  );

  it.each([
    ["multipart/form-data; boundary=kestrel-flats", "a raw CSV file"],
    ["multipart/form-data", "a raw CSV file"],
    ["multipart/form-data; boundary=kestrel-flats", "a multipart body cut before its closing boundary"],
  ])("a body labelled %s that is %s is a 4xx problem document, not a 500", async (type, what) => {
    const csv = Buffer.from(demoCsvCut(5));
    const payload = what === "a raw CSV file" ? csv : multipartOf(csv).subarray(0, 150);
    const answer = await app.inject({ method: "POST", url: "/v1/logs", headers: { "content-type": type }, payload });
    expectSuccessOrProblem(answer, `${type}: ${what}`);
    expect(answer.statusCode).toBeGreaterThanOrEqual(400);
  });

  it("a 415 from POST /v1/logs names the content types this endpoint accepts, not application/json", async () => {
    const answer = await app.inject({ method: "POST", url: "/v1/logs", headers: { "content-type": "application/json" }, payload: demoCsvCut(5) });
    expectSuccessOrProblem(answer, "application/json");
    expect(answer.statusCode).toBe(415);
    const { detail } = answer.json() as { detail: string };
    expect(detail).toMatch(/text\/plain|application\/x-las|multipart\/form-data/);
    expect(detail).not.toMatch(/send application\/json/);
  });
});
