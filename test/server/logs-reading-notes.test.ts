import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/**
 * A LAS 2.0 file of our own demo well (Marram Bank 7) whose header reading leaves notes: a line that is not
 * MNEM.UNIT VALUE : DESCRIPTION (CWLS LAS 2.0, Appendix 1 Part 3), and a density curve without a unit.
 */
const LAS = [
  "~Version",
  "VERS.   2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
  "WRAP.   NO  : ONE LINE PER DEPTH STEP",
  "~Well",
  "STRT.M  1510.0 : START DEPTH",
  "STOP.M  1510.5 : STOP DEPTH",
  "STEP.M  0.5 : STEP",
  "NULL.   -999.25 : NULL VALUE",
  "WELL.   MARRAM BANK 7 : WELL",
  "this line is no header item",
  "~Curve",
  "DEPT.M     : DEPTH",
  "DTC .US/F  : COMPRESSIONAL SLOWNESS",
  "DTS .US/F  : SHEAR SLOWNESS",
  "RHOB.      : BULK DENSITY",
  "~A",
  "1510.0 95 170 2.45",
  "1510.5 96 172 2.44",
  "",
].join("\r\n");

const convert = async (payload: string | Buffer, format: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload, headers: { "content-type": "text/plain" } });
};

/** The lines of a LAS text's ~Other section. */
const otherSection = (las: string): string[] => {
  const lines = las.split(/\r\n|\n/);
  const start = lines.findIndex((line) => /^~O/i.test(line));
  const end = lines.findIndex((line, i) => i > start && line.startsWith("~"));
  return start < 0 ? [] : lines.slice(start + 1, end);
};

describe("what reading the input noticed reaches a LAS answer, in ~Other, as it reaches a JSON answer's warnings", () => {
  it("the header's notes (an ignored line, a curve without a unit) are listed with their line numbers", async () => {
    const json = (await convert(LAS, "json")).json();
    const messages: { line?: number; message: string }[] = json.warnings;
    expect(messages.length).toBeGreaterThanOrEqual(2);
    const other = otherSection((await convert(LAS, "las")).body).join("\n");
    expect(other).toContain("Notes from reading the input");
    for (const { line, message } of messages) expect(other).toContain(`${line === undefined ? "" : `line ${line}: `}${message}`);
    expect(other).toContain("line 10: ");
  });

  it("a file read as Windows-1252 says so in the LAS answer", async () => {
    const latin1 = Buffer.from(LAS.replace("RHOB.  ", "RHOB.g/cm3").replace("COMPRESSIONAL SLOWNESS", "COMPRESSIONAL SLOWNESS µs/ft"), "latin1");
    const other = otherSection((await convert(latin1, "las")).body).join("\n");
    expect(other).toContain("Windows-1252");
  });

  it("a file read without notes gets no notes heading", async () => {
    const clean = LAS.replace("this line is no header item\r\n", "").replace("RHOB.      :", "RHOB.G/C3  :");
    expect((await convert(clean, "json")).json().warnings).toEqual([]);
    expect(otherSection((await convert(clean, "las")).body).join("\n")).not.toContain("Notes from reading");
  });
});

describe("a CSV file's depth order (a CSV has no STEP; LAS files are checked against theirs as they are read)", () => {
  it("the JSON answer's warnings name a repeated depth and a splice overlap, and keep every row", async () => {
    const csv = ["DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]", "1510.0,95,170,2.45", "1510.5,96,172,2.44", "1510.5,96,172,2.44", "1511.0,97,174,2.43", "1510.75,97,174,2.43", "1511.25,98,175,2.42", ""].join("\n");
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/logs", payload: csv, headers: { "content-type": "text/csv" } });
    expect(response.statusCode).toBe(200);
    const answer = response.json();
    expect(answer.count).toBe(6);
    expect(answer.warnings.map((warning: { message: string }) => warning.message)).toEqual(
      expect.arrayContaining([
        "curve DEPT: the depth repeats: data row 3 has the depth of data row 2 (1510.5)",
        "curve DEPT: the depth turns back at data row 5: from 1511 to 1510.75, against the direction the column started in",
      ]),
    );
  });
});
