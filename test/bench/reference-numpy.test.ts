import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { computeElasticLog, parseCsv, summariseFlags } from "../../core/index.js";
import { REFERENCE_SCRIPT, numpyMissing, writeWellFile } from "../../bench/file-cases.js";
import { syntheticWell, syntheticWellCsv, syntheticWellRequest } from "../../bench/synthetic-well.js";
import { build } from "../helpers/build.js";
import { relativeError } from "../helpers/elastic.js";

const missing = numpyMissing();
if (missing !== undefined) console.warn(`bench/reference_numpy.py is not checked: ${missing}`);

/** The script's output: header cells and columns, "nan" read as NaN; any other text fails the test. */
const readOutput = (path: string) => {
  const [header, ...lines] = readFileSync(path, "utf8").trimEnd().split(/\r?\n/);
  const names = header.split(",");
  const columns = names.map(() => new Float64Array(lines.length));
  lines.forEach((line, row) =>
    line.split(",").forEach((cell, c) => {
      const value = cell === "nan" ? NaN : Number(cell);
      if (cell !== "nan" && (cell === "" || Number.isNaN(value))) throw new Error(`row ${row + 1}: "${cell}" is not a number`);
      columns[c][row] = value;
    }),
  );
  return { names, columns };
};

describe("bench/reference_numpy.py, the script the benchmark compares the service with", () => {
  it.skipIf(missing !== undefined)(
    `agrees with core computeElasticLog on every value of a 4000-sample well to 1e-9 relative, nan exactly where core invalidates (Mavko, Mukerji & Dvorkin, Rock Physics Handbook, isotropic relations)${missing ? ` — skipped: ${missing}` : ""}`,
    () => {
      const well = syntheticWell(4000, 11);
      const folder = mkdtempSync(join(tmpdir(), "elastilog-reference-"));
      let output: ReturnType<typeof readOutput>;
      try {
        const source = writeWellFile(join(folder, "marram-bank-7.csv"), syntheticWellCsv(well));
        const target = join(folder, "moduli.csv");
        execFileSync("python3", [REFERENCE_SCRIPT, source, target], { timeout: 60_000 });
        output = readOutput(target);
      } finally {
        rmSync(folder, { recursive: true, force: true });
      }

      const log = computeElasticLog(syntheticWellRequest(well));
      // The file must exercise every rule the script reimplements, or agreeing would prove little.
      expect(Object.keys(summariseFlags(log.flags, log.invalidMask).flags)).toEqual(
        expect.arrayContaining(["missing", "vs_not_below_vp", "vp_vs_below_sqrt2"]),
      );

      expect(output.names).toEqual(["DEPT[m]", "E[GPa]", "NU", "G[GPa]", "K[GPa]", "LAMBDA[GPa]", "M[GPa]", "VPVS"]);
      expect(Array.from(output.columns[0])).toEqual(Array.from(well.depthMetres));
      const expected = [log.youngsModulus, log.poissonsRatio, log.shearModulus, log.bulkModulus, log.lameLambda, log.pWaveModulus, log.vpVsRatio];
      const disagreements: string[] = [];
      expected.forEach((column, c) => {
        const script = output.columns[c + 1];
        for (let i = 0; i < well.depthMetres.length; i++) {
          const agree = Number.isNaN(column[i]) ? Number.isNaN(script[i]) : relativeError(script[i], column[i]) <= 1e-9;
          if (!agree) disagreements.push(`${output.names[c + 1]}[${i}]: script ${script[i]}, core ${column[i]}`);
        }
      });
      expect(disagreements.slice(0, 10)).toEqual([]);
    },
  );
});

describe("the service beside bench/reference_numpy.py on the same CSV file (what the benchmark times)", () => {
  const well = syntheticWell(3000, 13);
  const text = [...syntheticWellCsv(well)].join("");

  /** The script's answer to `digits` significant digits, and the service's CSV answer with `query`. */
  const both = async (digits: number, query: string) => {
    const folder = mkdtempSync(join(tmpdir(), "elastilog-reference-"));
    let script: ReturnType<typeof readOutput>;
    try {
      const source = writeWellFile(join(folder, "marram-bank-7.csv"), [text]);
      const target = join(folder, "moduli.csv");
      execFileSync("python3", [REFERENCE_SCRIPT, source, target, String(digits)], { timeout: 60_000 });
      script = readOutput(target);
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
    const app = await build();
    const answer = await app.inject({ method: "POST", url: `/v1/logs?format=csv${query}`, payload: text, headers: { "content-type": "text/csv" } });
    expect(answer.statusCode).toBe(200);
    const table = parseCsv(answer.body).table;
    const service = (mnemonic: string) => table.columns[table.curves.findIndex((curve) => curve.mnemonic === mnemonic)];
    const pairs = ["EL_E", "EL_NU", "EL_G", "EL_K", "EL_LAMBDA", "EL_M", "EL_VPVS"].map((mnemonic, c) => ({ mnemonic, ours: service(mnemonic), theirs: script.columns[c + 1] }));
    return pairs;
  };

  it.skipIf(missing !== undefined)("agree on every value to 1e-9 relative with full precision on both sides (digits=exact, the script's %.17g)", async () => {
    const disagreements: string[] = [];
    for (const { mnemonic, ours, theirs } of await both(17, "&digits=exact")) {
      expect(ours).toHaveLength(well.depthMetres.length);
      ours.forEach((value, i) => {
        const agree = Number.isNaN(value) ? Number.isNaN(theirs[i]) : relativeError(theirs[i], value) <= 1e-9;
        if (!agree) disagreements.push(`${mnemonic}[${i}]: service ${value}, script ${theirs[i]}`);
      });
    }
    expect(disagreements.slice(0, 10)).toEqual([]);
  });

  it.skipIf(missing !== undefined)("write the same numbers at the benchmark's 8 significant digits (service default, the script's %.8g; both correctly rounded)", async () => {
    const disagreements: string[] = [];
    for (const { mnemonic, ours, theirs } of await both(8, "")) {
      ours.forEach((value, i) => {
        if (!Object.is(value, theirs[i]) && !(Number.isNaN(value) && Number.isNaN(theirs[i]))) disagreements.push(`${mnemonic}[${i}]: service ${value}, script ${theirs[i]}`);
      });
    }
    expect(disagreements.slice(0, 10)).toEqual([]);
  });
});
