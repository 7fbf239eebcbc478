import { describe, expect, it } from "vitest";
import { logsJsonResponse } from "../../server/schemas/logs.js";
import { build } from "../helpers/build.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";

/** Our fictional well Marram Bank 7, logged in metres from 1450 m to 1907 m. */
const WELL = marramBankLas(
  { start: "1450.0", stop: "1907.0", step: "228.5" },
  "1450.0 92.0 170.0 2.40",
  "1678.5 88.0 160.0 2.45",
  "1907.0 85.0 150.0 2.50",
);

const convert = async (query: string) => {
  const app = await build();
  const response = await app.inject({ method: "POST", url: `/v1/logs?${query}`, payload: WELL, headers: { "content-type": "text/plain" } });
  expect(response.statusCode).toBe(200);
  return logsJsonResponse.parse(response.json());
};

describe("POST /v1/logs warns of zones that hold no sample", () => {
  it("a zone wholly below the log (tops in feet on a log in metres) is named with its top, base and the log's first and last depth", async () => {
    const answer = await convert("zones=A:5000:6000");
    expect(answer.zones?.[0]).toMatchObject({ name: "A", count: 0, valid: 0, flagged_fraction: null });
    expect(answer.warnings).toHaveLength(1);
    const { message } = answer.warnings[0];
    expect(message).toContain('zone "A" (top 5000 m, base 6000 m) holds no sample');
    expect(message).toContain("from 1450 m (first) to 1907 m (last)");
    expect(message).toMatch(/check the depth unit of the zones/i);
    // 1 ft = 0.3048 m exactly (international foot): 5000 ft = 1524 m, 6000 ft = 1828.8 m
    expect(message).toContain("read in ft, the zone would run from 1524 m to 1828.8 m");
  });

  it("so is a zone within the log's depths that falls between two samples; a zone with samples gets no warning", async () => {
    const answer = await convert("zones=Held:1440:1460;Between:1500:1600");
    expect(answer.zones?.map((zone) => zone.count)).toEqual([1, 0]);
    expect(answer.warnings).toEqual([{ message: expect.stringContaining('zone "Between" (top 1500 m, base 1600 m) holds no sample') }]);
    expect(answer.warnings[0].message).toContain("from 1450 m (first) to 1907 m (last)");
  });

  it("a file whose zones all hold samples keeps its warnings empty", async () => {
    expect((await convert("zones=All:1450:1907")).warnings).toEqual([]);
  });
});
