import { describe, expect, it } from "vitest";
import { parseLas } from "../../core/index.js";
import { elasticColumnsResponse } from "../../server/schemas/elastic.js";
import { build } from "../helpers/build.js";

/** A deterministic synthetic log (demo data): slownesses of a sand–shale alternation with a few nulls and bad picks. */
const syntheticColumns = (samples: number) => {
  const dtc: (number | null)[] = [];
  const dts: (number | null)[] = [];
  const rho: number[] = [];
  for (let i = 0; i < samples; i++) {
    const shale = Math.floor(i / 500) % 2 === 0;
    dtc.push(i % 1009 === 0 ? null : (shale ? 96 : 82) + (i % 7) * 0.5);
    dts.push(i % 997 === 0 ? (dtc[i] ?? 100) * 1.2 : (shale ? 185 : 145) + (i % 5));
    rho.push((shale ? 2.48 : 2.31) + (i % 11) * 0.002);
  }
  return { dtc, dts, rho };
};

describe("large answers (parsed, computed and written on worker threads)", () => {
  it("a 30,000-sample body gives the same numbers as the same samples sent in small requests", async () => {
    const app = await build();
    const columns = syntheticColumns(30_000);
    const large = await app.inject({ method: "POST", url: "/v1/elastic", payload: columns });
    expect(large.statusCode).toBe(200);
    expect(large.headers["content-type"]).toMatch(/^application\/json/);
    const body = elasticColumnsResponse.parse(large.json());
    expect(body.count).toBe(30_000);
    for (const start of [0, 997, 1009, 14_950, 29_990]) {
      const slice = { dtc: columns.dtc.slice(start, start + 10), dts: columns.dts.slice(start, start + 10), rho: columns.rho.slice(start, start + 10) };
      const small = (await app.inject({ method: "POST", url: "/v1/elastic", payload: slice })).json();
      for (const key of ["E", "nu", "G", "K", "lambda", "M", "vp_vs", "vp", "vs"] as const) {
        expect(body[key].slice(start, start + 10), `${key} from row ${start}`).toEqual(small[key]);
      }
      expect(body.flags.filter((f) => f.index >= start && f.index < start + 10).map((f) => ({ ...f, index: f.index - start }))).toEqual(small.flags);
    }
    expect(body.summary.flags.missing).toBe(Math.ceil(30_000 / 1009));
  });

  it("problems found on a worker thread come back as the same problem documents", async () => {
    const app = await build();
    const columns = syntheticColumns(30_000);
    const badElement = await app.inject({ method: "POST", url: "/v1/elastic", payload: { ...columns, rho: [...columns.rho.slice(0, -1), "heavy"] } });
    expect(badElement.statusCode).toBe(400);
    expect(badElement.json().errors).toEqual([{ field: "body.rho", index: 29_999, message: 'expected a number or null, got the string "heavy"' }]);
    const text = JSON.stringify(columns);
    const truncated = await app.inject({ method: "POST", url: "/v1/elastic", payload: text.slice(0, -10), headers: { "content-type": "application/json" } });
    expect(truncated.statusCode).toBe(400);
    expect(truncated.json().type).toBe("/problems/malformed-body");
    const unknown = await app.inject({ method: "POST", url: "/v1/elastic", payload: { ...columns, VS: [1] } });
    expect(unknown.json().errors).toEqual([{ field: "body.VS", message: expect.stringContaining("unknown field") }]);
  });
});

describe("large files (converted on a worker thread)", () => {
  const csvOf = (rows: number, bad?: number) => {
    const { dtc, dts, rho } = syntheticColumns(rows);
    const lines = ["DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]"];
    for (let i = 0; i < rows; i++) lines.push(`${1000 + i * 0.1524},${i === bad ? "n/a?" : (dtc[i] ?? "")},${dts[i] ?? ""},${rho[i]}`);
    return `${lines.join("\r\n")}\r\n`;
  };

  it("a 40,000-row CSV (over 1 MiB) converts to JSON and LAS with every row, the same as a small file of the same rows", async () => {
    const app = await build();
    const text = csvOf(40_000);
    expect(Buffer.byteLength(text)).toBeGreaterThan(1024 * 1024);
    const json = await app.inject({ method: "POST", url: "/v1/logs", payload: text, headers: { "content-type": "text/csv" } });
    expect(json.statusCode).toBe(200);
    const answer = json.json();
    expect(answer.count).toBe(40_000);
    const head = text.split("\r\n").slice(0, 11).join("\r\n") + "\r\n";
    const small = (await app.inject({ method: "POST", url: "/v1/logs", payload: head, headers: { "content-type": "text/csv" } })).json();
    expect(answer.E.slice(0, 10)).toEqual(small.E);
    const las = await app.inject({ method: "POST", url: "/v1/logs?format=las", payload: text, headers: { "content-type": "text/csv" } });
    expect(parseLas(las.body).table.columns[0]).toHaveLength(40_000);
  });

  it("a problem on row 30,000 of a large file names its line, as for a small one", async () => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/logs", payload: csvOf(40_000, 29_999), headers: { "content-type": "text/csv" } });
    expect(response.statusCode).toBe(422);
    expect(response.json().errors[0]).toMatchObject({ field: "body", line: 30_001 });
  });
});
