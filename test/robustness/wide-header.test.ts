import { afterEach, describe, expect, it } from "vitest";
import { expectColumnsOfLength, expectSuccessOrProblem, expectWellRows, withinBound } from "./answer-checks.js";
import { forkProbeService, killService, startService, type ProbeService, type ServiceProcess } from "./service-process.js";
import { demoLasCut } from "./well-texts.js";

const EXTRA_COLUMNS = 99_996;
const ROWS = 3;
/** Generous for a file under 2 MB: the readers keep numeric columns, so the cost should follow the values, not the curve count. */
const PEAK_GROWTH_LIMIT_BYTES = 256 * 1024 * 1024;

const extraNames = (count: number): string[] => Array.from({ length: count }, (_, i) => `QX${i}`);

/** DEPT, DTC, DTS, RHOB and `extra` more columns, with ROWS rows of the demo well's first values and 7 in every extra column. */
const wideCsv = (extra: number): string => {
  const header = ["DEPT[m]", "DTC[us/ft]", "DTS[us/ft]", "RHOB[g/cm3]", ...extraNames(extra)].join(",");
  const row = (i: number) => [1450 + i * 0.1524, 95.2, 170.4, 2.45, ...Array.from({ length: extra }, () => 7)].join(",");
  return `${header}\n${Array.from({ length: ROWS }, (_, i) => row(i)).join("\n")}\n`;
};

/** The demo well's LAS header with `extra` more curves in ~Curve, and ROWS samples carrying a value for each. */
const wideLas = (extra: number): string => {
  const lines = demoLasCut(ROWS).split("\n");
  const parameter = lines.findIndex((line) => line.startsWith("~P"));
  const data = lines.findIndex((line) => line.startsWith("~A"));
  const curves = extraNames(extra).map((name) => ` ${name}.M : extra curve`);
  const values = " 7".repeat(extra);
  const samples = lines.slice(data + 1).map((line) => (line.trim() === "" ? line : `${line}${values}`));
  return [...lines.slice(0, parameter), ...curves, ...lines.slice(parameter, data + 1), ...samples].join("\n");
};

let probe: ProbeService | undefined;

afterEach(async () => {
  await probe?.stop();
  probe = undefined;
});

const post = async (base: string, file: string, boundMs: number) => {
  const response = await withinBound(
    fetch(`${base}/v1/logs`, { method: "POST", headers: { "content-type": "text/plain" }, body: file, signal: AbortSignal.timeout(boundMs + 1_000) }),
    boundMs,
    "POST /v1/logs",
  );
  const headers = Object.fromEntries(response.headers);
  return { statusCode: response.status, headers, body: await response.text() };
};

describe("a header with very many columns (issue 5, checks: a million columns)", () => {
  it.each([
    { format: "CSV", file: () => wideCsv(EXTRA_COLUMNS) },
    { format: "LAS", file: () => wideLas(EXTRA_COLUMNS) },
  ])(
    "a $format file with 100,000 curves and 3 rows converts with its 3 rows, and the service's peak memory grows by less than 256 MB",
    async ({ file }) => {
      const text = file();
      // A fresh process per file, as the peak resident set size only ever grows.
      probe = await forkProbeService();
      const before = await probe.memory();
      const answer = await post(probe.base, text, 60_000);
      expectSuccessOrProblem(answer, text);
      expect(answer.statusCode, answer.body.slice(0, 300)).toBe(200);
      expectColumnsOfLength(JSON.parse(answer.body), ROWS, text);
      const after = await probe.memory();
      const growth = after.peakRssBytes - before.peakRssBytes;
      expect(growth, `peak resident memory grew by ${Math.round(growth / 2 ** 20)} MB for a ${Math.round(text.length / 2 ** 20)} MB file`).toBeLessThan(PEAK_GROWTH_LIMIT_BYTES);
    },
    120_000,
  );

  describe("in a process of its own, killed when over the bound: the service must not stall on a header", () => {
    let service: ServiceProcess | undefined;

    afterEach(async () => {
      await killService(service);
      service = undefined;
    });

    const repeated = (name: string, count: number): string[] => Array.from({ length: count }, () => name);
    it.each([
      {
        what: "a CSV header of 1,000,000 distinct columns over a short row",
        boundMs: 60_000,
        file: () => `${["DEPT[m]", "DTC[us/ft]", "DTS[us/ft]", "RHOB[g/cm3]", ...extraNames(999_996)].join(",")}\n1450,95.2,170.4,2.45\n`,
      },
      {
        what: "a CSV header naming DT 50,000 times (a 150 kB file)",
        boundMs: 20_000,
        file: () => `DEPT[m],${repeated("DT", 50_000).join(",")}\n1450,95.2\n`,
      },
      {
        what: "a LAS ~Curve section listing DT 50,000 times, with one sample",
        boundMs: 20_000,
        file: () => {
          const lines = demoLasCut(1).split("\n");
          const parameter = lines.findIndex((line) => line.startsWith("~P"));
          const sample = lines.length - 2;
          lines[sample] += " 95.2".repeat(50_000);
          return [...lines.slice(0, parameter), ...repeated(" DT  .US/F : DUPLICATE SONIC", 50_000), ...lines.slice(parameter)].join("\n");
        },
      },
    ])("$what is answered within $boundMs ms: a 4xx problem, or a 2xx with its one row", async ({ file, boundMs }) => {
      service = await startService();
      const text = file();
      const answer = await post(service.base, text, boundMs);
      expectSuccessOrProblem(answer, text);
      if (answer.statusCode < 300) expectWellRows(answer, 1, text);
    }, 120_000);
  });
});
