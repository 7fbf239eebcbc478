/**
 * POST /v1/logs answers that say what to fix: a CSV with decimal commas, a file whose line breaks were removed by
 * curl -d, and a file with no shear or density curve (the gap-fill options). Data from our own fictional well,
 * Marram Bank 7.
 */
import { describe, expect, it } from "vitest";
import { problemSchema } from "../../server/schemas/problem.js";
import { build } from "../helpers/build.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";

const post = async (payload: string, query = "", contentType = "text/csv") => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs${query}`, payload, headers: { "content-type": contentType } });
};

/** The problem of a 422 answer, checked against the problem schema. */
const problem422 = async (payload: string, query = "", contentType?: string) => {
  const response = await post(payload, query, contentType);
  expect(response.statusCode).toBe(422);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
  return problemSchema.parse(response.json());
};

describe("a CSV with decimal commas (a semicolon delimiter and cells such as 90,5 are the telltale; common practice)", () => {
  const HEADER = "DEPT[m];DTC[us/ft];DTS[us/ft];RHOB[g/cm3]";

  it("is a 422 that says the file uses decimal commas, names the line and a cell, and says to write decimal points", async () => {
    const problem = await problem422(`${HEADER}\n100,0;90,5;160,2;2,40\n100,2;90,6;160,1;2,41\n`);
    expect(problem.type).toBe("/problems/unreadable-file");
    expect(problem.detail).toBe(
      'The well file cannot be read: line 2: the file uses decimal commas (the value "100,0" in column DEPT), which are not read here: ' +
        "write numbers with a decimal point (100.0), e.g. export the file with the point as decimal separator; the delimiter may stay as it is.",
    );
    expect(problem.detail).not.toContain("units");
    expect(problem.errors?.[0]).toMatchObject({ field: "body", line: 2 });
  });

  it("names the first row with a decimal comma when the rows above it hold whole numbers", async () => {
    const problem = await problem422(`${HEADER}\n100;90;160;2\n100,2;90,6;160,1;2,41\n`);
    expect(problem.errors?.[0]).toMatchObject({ line: 3, message: expect.stringMatching(/^csv_decimal_comma: line 3: the file uses decimal commas/) });
  });
});

describe("a file sent with curl -d, which strips carriage returns and newlines from the file (curl's manual; --data-binary keeps them; from memory)", () => {
  const LAS = marramBankLas({ start: "1", stop: "3", step: "1" }, "1 90 160 2.4", "2 91 161 2.41", "3 92 162 2.42");
  const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1,90,160,2.4\r\n2,91,161,2.41\r\n";
  /** What curl -d @file sends: the file without its line breaks, as application/x-www-form-urlencoded. */
  const curlD = (text: string) => text.replace(/[\r\n]/g, "");
  const FORM = "application/x-www-form-urlencoded";

  it.each(["json", "las", "csv", "ndjson"])("LAS, format=%s: the reader's message is kept and the hint added", async (format) => {
    const problem = await problem422(curlD(LAS), `?format=${format}`, FORM);
    expect(problem.detail).toBe(
      "The well file cannot be read: line 1: the file ends at line 1 without an ~A section: a header with no samples. " +
        "The body has no line breaks: if it was sent with curl -d, send it with --data-binary instead (curl -d removes line breaks; --data-binary @well.las sends the file as it is).",
    );
  });

  it.each(["json", "csv"])("CSV, format=%s: the reader's message is kept and the hint added", async (format) => {
    const problem = await problem422(curlD(CSV), `?format=${format}`, FORM);
    expect(problem.detail).toBe(
      "The well file cannot be read: the header line is followed by no data rows. " +
        "The body has no line breaks: if it was sent with curl -d, send it with --data-binary instead (curl -d removes line breaks; --data-binary @well.csv sends the file as it is).",
    );
  });

  it("a file with a # comment line above its header becomes one long comment line: the hint is added there too", async () => {
    const problem = await problem422(curlD(`# Marram Bank 7, fictional well\n${LAS}`), "", FORM);
    expect(problem.detail).toBe(
      "The body holds no well data: send a LAS 2.0 or CSV file as the request body. " +
        "The body has no line breaks: if it was sent with curl -d, send it with --data-binary instead (curl -d removes line breaks; --data-binary @well.las sends the file as it is).",
    );
  });

  it("the same files with their line breaks are read (what --data-binary sends)", async () => {
    expect((await post(LAS, "", FORM)).statusCode).toBe(200);
    expect((await post(CSV, "", FORM)).statusCode).toBe(200);
  });

  it("no hint where line breaks cannot be the cause: a header-only CSV with its line break, a lone header line, a short body", async () => {
    for (const body of ["DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n", "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]", "DEPT,DTC1,90", "~V VERS. 2.0"]) {
      const problem = await problem422(body);
      expect(problem.detail, body).not.toContain("line breaks");
    }
  });
});

describe("a file with no shear or density curve names the gap-fill option, as the single-point GET does", () => {
  it("the GET words it so (the reference for the file's answer)", async () => {
    const app = await build();
    expect((await app.inject({ url: "/v1/elastic?dtc=90&rho=2.4" })).json().detail).toContain("or vs_from to predict Vs from Vp");
    expect((await app.inject({ url: "/v1/elastic?dtc=90&dts=160" })).json().detail).toContain("or rho_from to predict it from Vp");
  });

  it.each([
    ["CSV", "DEPT[m],DTC[us/ft],RHOB[g/cm3]\n1,90,2.4\n2,91,2.41\n"],
    ["LAS", marramBankLas({ start: "1", stop: "2", step: "1" }, "1 90 160 2.4", "2 91 161 2.41").replace("DTS.US/F : SHEAR SLOWNESS\n", "").replace(/ 16\d /g, " ")],
  ])("%s without a shear curve: the 422 names vs_from and its correlations; following it gives 200", async (_format, body) => {
    const problem = await problem422(body);
    expect(problem.type).toBe("/problems/unusable-file");
    expect(problem.detail).toContain("no shear sonic curve found");
    expect(problem.detail).toContain("Name the curve with vs_curve, or give vs_from to predict Vs from Vp by a published correlation (");
    expect(problem.detail).toContain("vs.castagna1985");
    expect(problem.detail).toContain("GET /v1/correlations?kind=vs describes them)");
    expect(problem.errors).toEqual([{ field: "query.vs_curve", message: expect.stringContaining("or give vs_from") }]);
    const filled = await post(body, "?vs_from=vs.castagna1985");
    expect(filled.statusCode).toBe(200);
    expect(filled.json().filled).toMatchObject({ vs: 2 });
  });

  it("without a density curve: the 422 names rho_from and its correlation; following it gives 200", async () => {
    const body = "DEPT[m],DTC[us/ft],DTS[us/ft]\n1,90,160\n2,91,161\n";
    const problem = await problem422(body);
    expect(problem.detail).toContain("Name the curve with rho_curve, or give rho_from to predict bulk density from Vp by a published correlation (");
    expect(problem.detail).toMatch(/density\.gardner1974[^)]*; GET \/v1\/correlations\?kind=density describes them\)\.$/);
    expect((await post(body, "?rho_from=density.gardner1974")).statusCode).toBe(200);
  });

  it("the correlations named are those GET /v1/correlations?kind= lists", async () => {
    const app = await build();
    const problem = await problem422("DEPT,DTC\n1,90\n");
    for (const kind of ["vs", "density"]) {
      const ids = (await app.inject({ url: `/v1/correlations?kind=${kind}` })).json().correlations.map((c: { id: string }) => c.id);
      expect(ids.length).toBeGreaterThan(0);
      expect(problem.detail).toContain(`(${ids.join(", ")}; GET /v1/correlations?kind=${kind} describes them)`);
    }
  });

  it("a curve named by vs_curve that does not exist is told as before, without the gap-fill option", async () => {
    const problem = await problem422("DEPT,DTC,RHOB\n1,90,2.4\n", "?vs_curve=SHEAR");
    expect(problem.detail).toContain("no curve is named SHEAR");
    expect(problem.detail).not.toContain("vs_from");
  });
});
