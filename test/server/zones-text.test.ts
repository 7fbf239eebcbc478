import { describe, expect, it } from "vitest";
import { parseZonesText } from "../../server/schemas/zones.js";
import { logsJsonResponse } from "../../server/schemas/logs.js";
import { build } from "../helpers/build.js";

/** A four-row CSV of our own demo well (Marram Bank 7): DEPT in m, DTC and DTS in µs/ft, RHOB in g/cm3. */
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n16.0,95,170,2.45\r\n16.5,96,172,2.44\r\n17.0,97,174,2.43\r\n19.5,98,176,2.42\r\n";

const logs = async (zones: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?zones=${encodeURIComponent(zones)}`, payload: CSV, headers: { "content-type": "text/csv" } });
};

describe("zones as name:top:base;… in a query string", () => {
  it.each([
    ["a:0x10:20", "top", "0x10"],
    ["a:0b11:20", "top", "0b11"],
    ["a:0o7:20", "top", "0o7"],
    ["a:1:Infinity", "base", "Infinity"],
    ["a:1:2m", "base", "2m"],
  ])("%s is refused: depths are decimal numbers only (Number() would read hex, binary, octal)", (text, side, written) => {
    const parsed = parseZonesText(text);
    expect(parsed).toEqual({ error: expect.stringContaining(`zone 1 ("${text}"): ${side} expected a finite decimal number`) });
    expect("error" in parsed && parsed.error).toContain(JSON.stringify(written));
  });

  it.each(["a:1:2;;b:3:4", ";a:1:2", "a:1:2; ;b:3:4", "a:1:2;;", ";"])("%s is refused: an empty entry is not skipped", (text) => {
    expect(parseZonesText(text)).toEqual({ error: expect.stringMatching(/^zone \d is empty: separate the zones by single ;/) });
  });

  it("reads decimal depths as written (sign, point, exponent) and allows one trailing ;", () => {
    expect(parseZonesText("Linnet_Sand:1.5e1:+17.25;Sorrel:Shale:17.25:.2E2;")).toEqual({
      zones: [
        { name: "Linnet_Sand", top: 15, base: 17.25 },
        { name: "Sorrel:Shale", top: 17.25, base: 20 },
      ],
    });
    expect(parseZonesText("a: -3 :1")).toEqual({ zones: [{ name: "a", top: -3, base: 1 }] });
    expect(parseZonesText("a::1")).toEqual({ error: 'zone 1 ("a::1"): top is empty' });
  });

  it("POST /v1/logs?zones=a:0x10:20 is a 400 naming query.zones (it summarised 16–20 m before)", async () => {
    const response = await logs("a:0x10:20");
    expect(response.statusCode).toBe(400);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json().errors).toEqual([{ field: "query.zones", message: expect.stringContaining('got "0x10"') }]);
  });

  it("POST /v1/logs?zones=a:16:17;b:18:17 is a 400 naming query.zones[1].base, where the zone was given", async () => {
    const response = await logs("a:16:17;b:18:17");
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toEqual([{ field: "query.zones[1].base", message: "must be deeper than the top (18), got 17" }]);
  });

  it("POST /v1/logs?zones=a:16:17;;b:17:20 is a 400, and a:16:17;b:17:20; answers both zones", async () => {
    const refused = await logs("a:16:17;;b:17:20");
    expect(refused.statusCode).toBe(400);
    expect(refused.json().errors).toEqual([{ field: "query.zones", message: expect.stringContaining("zone 2 is empty") }]);
    const answered = await logs("a:16:17;b:17:20;");
    expect(answered.statusCode).toBe(200);
    const zones = logsJsonResponse.parse(answered.json()).zones ?? [];
    expect(zones.map((zone) => [zone.name, zone.count])).toEqual([["a", 2], ["b", 2]]);
  });
});
