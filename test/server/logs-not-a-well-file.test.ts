import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/** Two rows of our own demo well (Marram Bank 7), as CSV text. */
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n";

const utf16 = (text: string, bigEndian: boolean): Buffer => {
  const little = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, "utf16le")]);
  return bigEndian ? Buffer.from(little.map((_, i) => little[i ^ 1])) : little;
};

const convert = async (payload: Buffer | string, format: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload, headers: { "content-type": "text/plain" } });
};

describe("bodies that are not a LAS or CSV text get a 422 that says what they are and what to send", () => {
  it.each([["json"], ["csv"], ["las"], ["ndjson"]])("UTF-16 text, little- and big-endian (Unicode byte-order marks FF FE and FE FF), as %s", async (format) => {
    for (const bigEndian of [false, true]) {
      const response = await convert(utf16(CSV, bigEndian), format);
      expect(response.statusCode).toBe(422);
      expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(response.json().detail).toContain("UTF-16");
      expect(response.body).not.toContain("\\u0000");
    }
  });

  it("UTF-16 text without a byte-order mark, and a binary file, are found by their NUL bytes", async () => {
    const noMark = await convert(Buffer.from(CSV, "utf16le"), "json");
    expect(noMark.statusCode).toBe(422);
    expect(noMark.json().detail).toContain("NUL bytes");
    const binary = await convert(Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00]), "csv");
    expect(binary.statusCode).toBe(422);
  });

  it.each([['{"dtc":[95],"dts":[170],"rho":[2.45]}'], ['  [{"dtc":95}]']])("a JSON body (%s) is pointed to POST /v1/elastic", async (json) => {
    const response = await convert(json, "json");
    expect(response.statusCode).toBe(422);
    expect(response.json().detail).toContain("POST /v1/elastic");
  });

  it("the same CSV as UTF-8 converts (the checks above refuse what is not text, nothing else)", async () => {
    const response = await convert(CSV, "json");
    expect(response.statusCode).toBe(200);
    expect(response.json().count).toBe(2);
  });
});

describe("a well file sent without a Content-Type", () => {
  it("is read as the file (a script posting the file's bytes as they are sends none), while a foreign Content-Type stays a 415", async () => {
    const app = await build();
    const bare = await app.inject({ method: "POST", url: "/v1/logs", payload: Buffer.from(CSV) });
    expect(bare.headers["content-type"]).toMatch(/^application\/json/);
    expect(bare.statusCode).toBe(200);
    expect(bare.json().count).toBe(2);
    const foreign = await app.inject({ method: "POST", url: "/v1/logs", payload: CSV, headers: { "content-type": "image/png" } });
    expect(foreign.statusCode).toBe(415);
    expect(foreign.json().detail).toContain("image/png");
  });
});

describe("a multipart body the upload reader cannot split", () => {
  it("(no boundary in the body) is a 400 that says how to send an upload, not the reader library's words alone", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/logs",
      payload: CSV,
      headers: { "content-type": "multipart/form-data; boundary=marram-bank-7" },
    });
    expect(response.statusCode).toBe(400);
    expect(response.json().detail).toContain("curl -F file=@well.las");
  });
});
