/**
 * The zones part of a multipart upload is read as a JSON body is (RFC 8259): a byte-order mark before the text is
 * ignored (§8.1 allows it; Windows editors save one), a name given twice in one object is refused (§4 leaves
 * duplicates to each parser; JSON.parse keeps the last), and a syntax error says where it is.
 */
import { describe, expect, it } from "vitest";
import { logsJsonResponse } from "../../server/schemas/logs.js";
import { problemSchema } from "../../server/schemas/problem.js";
import { build } from "../helpers/build.js";

/** A four-row CSV of our own demo well (Marram Bank 7): DEPT in m, DTC and DTS in µs/ft, RHOB in g/cm3. */
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n1511.0,97,174,2.43\r\n1511.5,98,176,2.42\r\n";
const BOM = Buffer.from([0xef, 0xbb, 0xbf]);

/** POST /v1/logs with the CSV as a file part and the zones as a file part (curl -F zones=@zones.json) or a plain field. */
const upload = async (zones: Buffer | string, asFile: boolean) => {
  const boundary = "----elastilog-zones-part";
  const part = (name: string, filename: string | undefined, content: Buffer | string) => [
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${name}"${filename ? `; filename="${filename}"` : ""}\r\n\r\n`),
    Buffer.isBuffer(content) ? content : Buffer.from(content),
    Buffer.from("\r\n"),
  ];
  const body = Buffer.concat([...part("file", "marram-bank-7.csv", CSV), ...part("zones", asFile ? "zones.json" : undefined, zones), Buffer.from(`--${boundary}--\r\n`)]);
  const app = await build();
  return app.inject({ method: "POST", url: "/v1/logs", payload: body, headers: { "content-type": `multipart/form-data; boundary=${boundary}` } });
};

const invalid = (response: { statusCode: number; headers: Record<string, unknown>; json: () => unknown }) => {
  expect(response.statusCode).toBe(400);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/); // RFC 9457
  return problemSchema.parse(response.json());
};

describe("the zones part of POST /v1/logs", () => {
  for (const asFile of [true, false]) {
    const how = asFile ? "as a file part" : "as a form field";

    it(`reads zones saved with a UTF-8 byte-order mark, ${how} (it was refused as not JSON)`, async () => {
      const zones = Buffer.concat([BOM, Buffer.from('[{"name":"Upper","top":1510,"base":1511}]')]);
      const response = await upload(zones, asFile);
      expect(response.statusCode).toBe(200);
      const answer = logsJsonResponse.parse(response.json());
      expect(answer.zones?.[0]).toMatchObject({ name: "Upper", count: 3 }); // the deepest zone keeps its base;
    });

    it(`refuses a name given twice in one zone, ${how}, naming its path as a JSON body's would be (the last was kept)`, async () => {
      const response = await upload('[{"name":"a","top":1510,"base":1511},{"name":"b","name":"c","top":1511,"base":1512}]', asFile);
      const problem = invalid(response);
      expect(problem.type).toBe("/problems/invalid-request");
      expect(problem.errors).toEqual([{ field: "body.zones[1].name", message: expect.stringContaining("is given more than once in one object") }]);
    });

    it(`says on which line and column the zones part stops being JSON, ${how}`, async () => {
      const response = await upload(Buffer.concat([BOM, Buffer.from('[\n  {"name": "a", "top": 1510 "base": 1511}\n]')]), asFile);
      const problem = invalid(response);
      expect(problem.detail).toMatch(/^In the zones part: .*not valid JSON \(at line 2, column 29\)/);
      expect(problem.errors).toEqual([{ field: "body.zones", message: expect.stringContaining("JSON array of {name, top, base}") }]);
    });
  }

  it("an empty zones part is a 400 saying so, and a zone of the wrong shape names its field in brackets", async () => {
    expect(invalid(await upload(" \r\n", true)).errors).toEqual([{ field: "body.zones", message: expect.stringContaining("is empty") }]);
    expect(invalid(await upload('[{"name":"a","top":"1510","base":1511}]', true)).errors).toEqual([{ field: "body.zones[0].top", message: expect.any(String) }]);
  });
});
