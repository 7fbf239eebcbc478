/**
 * The Arrow exchange as a Python user has it: pyarrow (the Apache Arrow C++ library) writes the body and reads the
 * answer. Runs the README's Python example as printed, and a round trip whose answer must equal the JSON answer to
 * the same columns bit for bit. Skipped, saying why, where no Python with pyarrow is found (.ci/run installs it
 * when the package index can be reached; ELASTILOG_PYTHON names another interpreter).
 */
import { execFile, spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { FLAG_CODES } from "../../core/index.js";
import { OUTPUT_PROPERTIES } from "../../server/output-properties.js";
import { build } from "../helpers/build.js";

const PYTHON = process.env.ELASTILOG_PYTHON ?? "python3";
const ROUND_TRIP_SCRIPT = new URL("../fixtures/pyarrow_round_trip.py", import.meta.url).pathname;
const README = new URL("../../README.md", import.meta.url).pathname;
const SCRIPT_LIMIT_MS = 60_000;

const pyarrowMissing = (): string | undefined => {
  const probe = spawnSync(PYTHON, ["-c", "import pyarrow"], { encoding: "utf8", timeout: 30_000 });
  if (probe.error) return `${PYTHON} cannot be started (${probe.error.message})`;
  return probe.status === 0 ? undefined : `${PYTHON} cannot import pyarrow (${probe.stderr.trim().split("\n").at(-1)})`;
};
const missing = pyarrowMissing();
if (missing !== undefined) console.warn(`the Arrow exchange is not checked with pyarrow: ${missing}`);
const skipped = missing === undefined ? "" : ` — skipped: ${missing}`;

/** Runs Python without blocking the event loop: the service it talks to is in this process. */
const runPython = async (args: string[]): Promise<string> => {
  const { stdout } = await promisify(execFile)(PYTHON, args, { timeout: SCRIPT_LIMIT_MS, maxBuffer: 64 * 1024 * 1024 });
  return stdout;
};

const listening = async () => {
  const app = await build();
  const base = await app.listen({ port: 0, host: "127.0.0.1" });
  return { app, base };
};

/** The README's Python example, exactly as printed there. */
const readmeExample = (): string => {
  const text = readFileSync(README, "utf8");
  const start = text.indexOf("From Python with pyarrow:");
  const block = /```python\n([\s\S]*?)```/.exec(text.slice(start));
  if (start < 0 || block === null) throw new Error("README.md has no Python example after 'From Python with pyarrow:'");
  return block[1];
};

const asNumber = (value: number | null): number => (value === null ? NaN : value);

describe("Arrow IPC with pyarrow (Apache Arrow C++), as a Python user sends and reads it", () => {
  it.skipIf(missing !== undefined)(`runs the README's Python example as printed and reads the same E, nu and flags as the JSON answer${skipped}`, async () => {
    const { app, base } = await listening();
    const example = readmeExample();
    expect(example).toContain("http://127.0.0.1:8080/");
    const printed = await runPython(["-c", example.replace("http://127.0.0.1:8080", base)]);
    const json = (
      await app.inject({
        method: "POST",
        url: "/v1/elastic",
        payload: { dtc: [92.5, null, 88.1], dts: [166.0, 170.2, 150.0], rho: [2.41, 2.43, 2.45], units: { modulus: "GPa" } },
      })
    ).json();
    const line = (values: (number | null)[]) => `[[${values.map((value) => (value === null ? "null" : String(value))).join(",")}]]`;
    expect(printed).toContain(`E: ${line(json.E)}`);
    expect(printed).toContain(`nu: ${line(json.nu)}`);
    expect(printed).toContain("flags: [[0,1,0]]");
    expect(printed).toContain(`"0":"${FLAG_CODES[0]}"`);
  });

  it.skipIf(missing !== undefined)(
    `answers a pyarrow stream of several record batches (float32 DTC, nulls, null values) with the JSON answer's columns and flags, bit for bit${skipped}`,
    async () => {
      const { app, base } = await listening();
      const read = JSON.parse(await runPython([ROUND_TRIP_SCRIPT, base]));
      expect(read.content_type).toMatch(/^application\/vnd\.apache\.arrow\.stream/);
      const json = (
        await app.inject({ method: "POST", url: "/v1/elastic", payload: { ...read.sent, null_value: -999.25, units: { modulus: "GPa" } } })
      ).json();
      expect(read.names).toEqual(["depth", ...OUTPUT_PROPERTIES.map((property) => property.key), "flags"]);
      expect(read.types.flags).toBe("uint32");
      expect(read.units.E).toBe("GPa");
      expect(read.metadata_keys).toEqual(expect.arrayContaining(["elastilog.flag_bits", "elastilog.summary", "elastilog.units", "elastilog.version"]));
      expect(read.flag_bits).toEqual(Object.fromEntries(FLAG_CODES.map((code, bit) => [String(bit), code])));
      const rows = read.sent.depth.length;
      for (const name of ["depth", ...OUTPUT_PROPERTIES.map((property) => property.key)]) {
        expect(read.types[name], name).toBe("double");
        const arrow: (number | null)[] = read.columns[name];
        const expected: (number | null)[] = json[name];
        expect(arrow.length, name).toBe(rows);
        const differing = arrow.findIndex((value, i) => !Object.is(asNumber(value), asNumber(expected[i])));
        expect(differing, `${name}: first differing row`).toBe(-1);
      }
      const masks = new Array<number>(rows).fill(0);
      for (const flag of json.flags as { index: number; code: (typeof FLAG_CODES)[number] }[]) masks[flag.index] |= 1 << FLAG_CODES.indexOf(flag.code);
      expect(read.columns.flags).toEqual(masks);
      // The demo well has gaps, null values and a mispicked shear: the comparison covers nulls and flagged rows.
      expect(read.columns.E.filter((value: number | null) => value === null).length).toBeGreaterThan(100);
      expect(masks.filter((mask) => mask !== 0).length).toBeGreaterThan(100);
    },
  );
});
