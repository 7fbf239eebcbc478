/** Whole files through `POST /v1/logs` beside the numpy script a user would run today, and the server's peak memory. */
import { spawnSync } from "node:child_process";
import { closeSync, createReadStream, createWriteStream, openSync, statSync } from "node:fs";
import { join } from "node:path";
import { pipeline } from "node:stream/promises";
import { request } from "undici";
import { freePort, residentMegabytes, root, settle, start, stop } from "./processes.js";
import { median, milliseconds, yesOrNo, type Row } from "./report.js";
import { syntheticWell, syntheticWellCsv, syntheticWellLas, writeChunks, type SyntheticWell } from "./synthetic-well.js";

export const REFERENCE_SCRIPT = join(root, "bench", "reference_numpy.py");
const SCRIPT_LIMIT_MS = 300_000;
const MEMORY_TARGET_MB = 400;

export const writeWellFile = (path: string, chunks: Iterable<string>): string => {
  const fd = openSync(path, "w");
  try {
    writeChunks(fd, chunks);
  } finally {
    closeSync(fd);
  }
  return path;
};

/** Posts a file as a stream and writes the answer to a file, as a script with curl would; returns the wall time. */
const convertFile = async (base: string, source: string, format: "csv" | "las", target: string, input = format): Promise<number> => {
  await settle(base);
  const t0 = performance.now();
  const response = await request(`${base}/v1/logs?format=${format}`, {
    method: "POST",
    headers: { "content-type": input === "csv" ? "text/csv" : "application/x-las" },
    body: createReadStream(source),
  });
  if (response.statusCode !== 200) {
    throw new Error(`POST /v1/logs (${format}) answered ${response.statusCode}: ${(await response.body.text()).slice(0, 200)}`);
  }
  await pipeline(response.body, createWriteStream(target));
  return performance.now() - t0;
};

/** Why the reference script cannot run on this machine, or undefined when python3 imports numpy. */
export const numpyMissing = (): string | undefined => {
  const probe = spawnSync("python3", ["-c", "import numpy"], { encoding: "utf8", timeout: 30_000 });
  if (probe.error) return `python3 cannot be started (${probe.error.message})`;
  return probe.status === 0 ? undefined : `python3 cannot import numpy (${probe.stderr.trim().split("\n").at(-1)})`;
};

/** Significant digits of computed values on both sides: the service's default, and the same asked of the script. */
const DIGITS = 8;

const runScript = (source: string, target: string): number => {
  const t0 = performance.now();
  const run = spawnSync("python3", [REFERENCE_SCRIPT, source, target, String(DIGITS)], { encoding: "utf8", timeout: SCRIPT_LIMIT_MS });
  if (run.error || run.status !== 0) throw new Error(`reference_numpy.py failed: ${run.error?.message ?? run.stderr.slice(-300)}`);
  return performance.now() - t0;
};

/** CSV and LAS of the same well through the service, each beside the numpy script on the CSV; runs interleaved. */
export const fileCases = async (base: string, well: SyntheticWell, folder: string, runs: number): Promise<Row[]> => {
  const samples = well.depthMetres.length.toLocaleString("en");
  const csv = writeWellFile(join(folder, "marram-bank-7.csv"), syntheticWellCsv(well));
  const las = writeWellFile(join(folder, "marram-bank-7.las"), syntheticWellLas(well));
  const missing = numpyMissing();
  const times = { csv: [] as number[], las: [] as number[], numpy: [] as number[] };
  for (let run = 0; run < runs; run++) {
    times.csv.push(await convertFile(base, csv, "csv", join(folder, "answer.csv")));
    times.las.push(await convertFile(base, las, "las", join(folder, "answer.las")));
    if (missing === undefined) times.numpy.push(runScript(csv, join(folder, "numpy-answer.csv")));
  }
  const numpy = missing === undefined ? median(times.numpy) : undefined;
  const sizes = { csv: statSync(csv).size, las: statSync(las).size };
  return (["csv", "las"] as const).map((format) => {
    const service = median(times[format]);
    return {
      case: `${format.toUpperCase()} in and out, POST /v1/logs?format=${format}, ${samples} samples (${(sizes[format] / 1e6).toFixed(0)} MB file; input curves, 14 properties and QC out, computed values to ${DIGITS} significant digits; median of ${runs})`,
      measured: milliseconds(service),
      floor: numpy === undefined ? `numpy script not run: ${missing}` : `${milliseconds(numpy)} (python3 bench/reference_numpy.py on the CSV: depth and 7 moduli out, to ${DIGITS} significant digits; wall time)`,
      ratio: numpy === undefined ? "—" : `${(service / numpy).toFixed(2)}×`,
      target: "≤ 1.00× the numpy script",
      met: numpy === undefined ? "not measured" : yesOrNo(service <= numpy),
    };
  });
};

/** A fresh server converts one LAS file; its peak resident set (VmHWM) is read before it stops. */
/**
 * Peak resident memory of a fresh server converting a long well to LAS: from a LAS file (streamed through), or from
 * a CSV file, whose input columns are held until its last row (STRT, STOP and STEP come before the first data line).
 */
export const memoryCase = async (samples: number, folder: string, input: "las" | "csv"): Promise<Row[]> => {
  const well = syntheticWell(samples, 29);
  const source = writeWellFile(join(folder, `marram-bank-7-long.${input}`), input === "las" ? syntheticWellLas(well) : syntheticWellCsv(well));
  const port = await freePort();
  const server = await start(
    "memory",
    ["dist/server/main.js"],
    { PORT: String(port), HOST: "127.0.0.1", LOG_LEVEL: "info", MAX_SAMPLES: String(samples), REQUEST_TIMEOUT_MS: String(SCRIPT_LIMIT_MS) },
    /listening/i,
  );
  try {
    const pid = server.pid as number;
    const idle = residentMegabytes(pid, "VmRSS");
    const elapsed = await convertFile(`http://127.0.0.1:${port}`, source, "las", join(folder, "answer-long.las"), input);
    const peak = residentMegabytes(pid, "VmHWM");
    return [
      {
        case: `Memory: ${input === "las" ? "LAS in and out" : "CSV in, LAS out (input columns held to the last row)"}, ${samples.toLocaleString("en")} samples (${(statSync(source).size / 1e6).toFixed(0)} MB file), fresh server`,
        measured: `peak resident ${peak.toFixed(0)} MB (VmHWM), converted in ${milliseconds(elapsed)}`,
        floor: `${idle.toFixed(0)} MB resident when idle`,
        ratio: "—",
        target: `peak < ${MEMORY_TARGET_MB} MB`,
        met: yesOrNo(peak < MEMORY_TARGET_MB),
      },
    ];
  } finally {
    await stop(server);
  }
};
