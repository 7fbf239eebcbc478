import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/**
 * Two rows of our own demo well (Marram Bank 7) with units written with a micro sign, as older files do.
 * In ISO-8859-1 / Windows-1252 the micro sign is the single byte 0xB5, which is not UTF-8 (a lone continuation byte).
 */
const TEXT = "DEPT[m],DTC[µs/ft],DTS[µs/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n";
const LATIN1 = Buffer.from(TEXT, "latin1");

const convert = async (payload: Buffer, contentType: string, format = "json") => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload, headers: { "content-type": contentType } });
};

describe("the text encoding of a well file (RFC 9110 §8.3.2 charset; WHATWG Encoding: ISO-8859-1 is read as Windows-1252)", () => {
  it("a file whose first bytes are not UTF-8 is read as Windows-1252 when no charset is declared, and the answer says so", async () => {
    expect(LATIN1.includes(0xb5)).toBe(true);
    const response = await convert(LATIN1, "text/csv");
    expect(response.statusCode).toBe(200);
    const body = response.json();
    expect(body.count).toBe(2);
    expect(body.vp[0]).toBeCloseTo(304800 / 95, 9);
    expect(JSON.stringify(body.warnings)).toContain("Windows-1252");
  });

  it("a declared charset=iso-8859-1 is read as such, without a warning; the same text in UTF-8 gives the same numbers", async () => {
    const declared = (await convert(LATIN1, "text/csv; charset=ISO-8859-1")).json();
    const utf8 = (await convert(Buffer.from(TEXT, "utf8"), "text/csv")).json();
    expect(JSON.stringify(declared.warnings)).not.toContain("Windows-1252");
    expect(JSON.stringify(utf8.warnings)).not.toContain("Windows-1252");
    expect(declared.E).toEqual(utf8.E);
    expect(declared.input_curves).toEqual(utf8.input_curves);
  });

  it("a Windows-1252 file converted to CSV is answered in UTF-8 with its micro signs intact", async () => {
    const response = await convert(LATIN1, "text/csv", "csv");
    expect(response.statusCode).toBe(200);
    expect(response.body.split("\r\n")[0]).toContain("DTC[µs/ft]");
  });

  it("a charset that is not read here (UTF-16) is a 415 problem that names the encodings that are", async () => {
    const response = await convert(Buffer.from(TEXT, "utf8"), "text/csv; charset=utf-16");
    expect(response.statusCode).toBe(415);
    expect(response.json().detail).toContain("UTF-8");
  });

  it.each([
    ["text/csv; charset=utf-8; charset=latin1", "2 times"],
    ['text/csv; charset="utf-8', "does not close"],
    ["text/csv; charset=", "empty"],
  ])("%s is a 415 problem, not a guess", async (contentType, words) => {
    const response = await convert(Buffer.from(TEXT, "utf8"), contentType);
    expect(response.statusCode).toBe(415);
    expect(response.json().detail).toContain(words);
  });

  it('a quoted charset (RFC 9110 §5.6.6), charset="ISO-8859-1", is read', async () => {
    const response = await convert(LATIN1, 'text/csv; charset="ISO-8859-1"');
    expect(response.statusCode).toBe(200);
    expect(JSON.stringify(response.json().warnings)).not.toContain("Windows-1252");
  });
});

