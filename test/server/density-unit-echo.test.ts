import { tableFromIPC } from "apache-arrow";
import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/**
 * Every answer gives rho in the unit the density was given in, and says so where it names units: a script that
 * reads `units.density` (or a column's unit) next to `rho` must never find a kg/m3 label on g/cm3 numbers.
 * 1 g/cm3 = 1000 kg/m3 (SI definitions of the gram and the metre).
 */
describe("the density unit of the answer is the unit of the density input", () => {
  it("POST /v1/elastic with JSON columns in kg/m3: rho in kg/m3, units.density kg/m3", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic",
      payload: { dtc: [95, 96], dts: [170, 172], rho: [2450, 2440], units: { density: "kg/m3" } },
    });
    expect(response.statusCode).toBe(200);
    const body = response.json();
    expect(body.rho).toEqual([2450, 2440]);
    expect(body.units.density).toBe("kg/m3");
  });

  it("POST /v1/elastic answered in Arrow: the rho field's unit metadata and the schema's units agree with its values", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic",
      headers: { accept: "application/vnd.apache.arrow.stream" },
      payload: { dtc: [95], dts: [170], rho: [2450], units: { density: "kg/m3" } },
    });
    expect(response.statusCode).toBe(200);
    const table = tableFromIPC(response.rawPayload);
    expect(table.getChild("rho")?.get(0)).toBe(2450);
    expect(table.schema.fields.find((field) => field.name === "rho")?.metadata.get("elastilog.unit")).toBe("kg/m3");
    expect(JSON.parse(table.schema.metadata.get("elastilog.units") as string).density).toBe("kg/m3");
  });

  it("POST /v1/logs with a CSV whose density is in kg/m3: the CSV answer's EL_RHO column is labelled and written in kg/m3, the JSON answer agrees", async () => {
    const app = await build();
    // Two rows of our own demo well (Marram Bank 7), density in kg/m3.
    const csv = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[kg/m3]\r\n1510.0,95,170,2450\r\n1510.5,96,172,2440\r\n";
    const asCsv = await app.inject({ method: "POST", url: "/v1/logs?format=csv", payload: csv, headers: { "content-type": "text/csv" } });
    expect(asCsv.statusCode).toBe(200);
    const [header, first] = asCsv.body.split("\r\n");
    const columns = header.split(",");
    const rhoAt = columns.indexOf("EL_RHO[kg/m3]");
    expect(rhoAt).toBeGreaterThan(0);
    expect(Number(first.split(",")[rhoAt])).toBe(2450);
    const asJson = await app.inject({ method: "POST", url: "/v1/logs", payload: csv, headers: { "content-type": "text/csv" } });
    expect(asJson.json().rho).toEqual([2450, 2440]);
    expect(asJson.json().units.density).toBe("kg/m3");
  });
});
