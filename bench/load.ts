/**
 * `npm run load`: puts the compiled service under a bounded load on 127.0.0.1 and prints a Markdown table:
 * a mix of single-point GETs and 10,000-sample POSTs at 50 connections for 20 s; /livez latency while one
 * 1,000,000-sample POST is converted; resident memory at the start, after a warm-up and after 100,000 requests.
 * Never part of `npm test`. Every phase is bounded in count and in time; the script stops by itself.
 * The samples are the demonstration well Kestrel Flats 3 (examples/demo-well.csv), repeated to the size needed.
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { cpus } from "node:os";
import { join } from "node:path";
import autocannon from "autocannon";
import { Agent, Pool, request } from "undici";
import { parseCsv } from "../core/index.js";
import { forkProbeService } from "../test/robustness/service-process.js";
import { freePort, residentMegabytes, root, start, stop, withBareStream } from "./processes.js";
import { milliseconds, yesOrNo } from "./report.js";

const MIX_CONNECTIONS = 50;
const MIX_SECONDS = 20;
const MIX_POST_SAMPLES = 10_000;
const WHOLE_WELL_SAMPLES = 1_000_000;
const WARM_UP_REQUESTS = 10_000;
const SOAK_REQUESTS = 100_000;
/** Upper bounds in time, so that a slow or stuck service cannot keep the script running. */
const WHOLE_WELL_LIMIT_MS = 180_000;
const PROBE_INTERVAL_MS = 20;
const SOAK_LIMIT_MS = 600_000;

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** DTC, DTS and RHOB of the demonstration well; empty cells (not logged) become null in JSON. */
const demoWell = () => {
  const { table } = parseCsv(readFileSync(join(root, "examples/demo-well.csv"), "utf8"));
  const column = (mnemonic: string) => {
    const index = table.curves.findIndex((curve) => curve.mnemonic === mnemonic);
    if (index < 0) throw new Error(`examples/demo-well.csv has no ${mnemonic} column`);
    return Array.from(table.columns[index], (value) => (Number.isNaN(value) ? null : value));
  };
  return { dtc: column("DTC"), dts: column("DTS"), rho: column("RHOB") };
};

const well = demoWell();
const STEP_METRES = 0.1524;

/** A POST /v1/elastic body of `samples` rows: the demonstration well repeated, with depth running on. */
const columnsBody = (samples: number): string => {
  const pick = (column: (number | null)[]) => Array.from({ length: samples }, (_, i) => column[i % column.length]);
  const depth = Array.from({ length: samples }, (_, i) => Math.round((1450 + i * STEP_METRES) * 1e4) / 1e4);
  return JSON.stringify({ depth, dtc: pick(well.dtc), dts: pick(well.dts), rho: pick(well.rho) });
};

/** Single-point GETs at three depths of the well where all three logs are present, and one POST of `postSamples`. */
const mixedRequests = (postSamples: number): autocannon.Request[] => {
  const complete = well.dtc.flatMap((dtc, i) => (dtc !== null && well.dts[i] !== null && well.rho[i] !== null ? [i] : []));
  const points = [0.2, 0.5, 0.8].map((share) => complete[Math.floor(share * complete.length)]);
  return [
    ...points.map((i) => ({ method: "GET" as const, path: `/v1/elastic?dtc=${well.dtc[i]}&dts=${well.dts[i]}&rho=${well.rho[i]}` })),
    { method: "POST", path: "/v1/elastic", headers: { "content-type": "application/json" }, body: columnsBody(postSamples) },
  ];
};

/** Runs autocannon, stopping it after `limitMs` whatever its own options say, and resolves with its result. */
const cannon = (options: autocannon.Options, limitMs: number) => {
  let instance: autocannon.Instance | undefined;
  const done = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon(options, (error: unknown, result: autocannon.Result) => (error ? reject(error) : resolve(result)));
  });
  const bound = setTimeout(() => instance?.stop(), limitMs);
  return done.finally(() => clearTimeout(bound));
};

interface Row {
  measure: string;
  value: string;
  target: string;
  met: string;
}

const megabytes = (value: number) => `${value.toFixed(1)} MB`;

const measureMemory = async (base: string, pid: number): Promise<Row[]> => {
  const atStart = residentMegabytes(pid, "VmRSS");
  const requests = mixedRequests(100);
  const warmUp = await cannon({ url: base, connections: 10, amount: WARM_UP_REQUESTS, requests }, SOAK_LIMIT_MS);
  const afterWarmUp = residentMegabytes(pid, "VmRSS");
  const soak = await cannon({ url: base, connections: 10, amount: SOAK_REQUESTS, requests }, SOAK_LIMIT_MS);
  const afterSoak = residentMegabytes(pid, "VmRSS");
  const answered = soak["2xx"] + soak.non2xx;
  const growth = afterSoak / afterWarmUp - 1;
  return [
    { measure: "RSS at the start (idle, just listening)", value: megabytes(atStart), target: "—", met: "—" },
    { measure: `RSS after a warm-up of ${(warmUp["2xx"] + warmUp.non2xx).toLocaleString("en")} requests (3 GETs : 1 POST of 100 samples, 10 connections)`, value: megabytes(afterWarmUp), target: "—", met: "—" },
    {
      measure: `RSS after ${answered.toLocaleString("en")} more requests of the same mix${answered < SOAK_REQUESTS ? " (stopped at the time bound)" : ""} (moves with V8's heap sizing: garbage not yet collected counts)`,
      value: `${megabytes(afterSoak)} (${growth >= 0 ? "+" : ""}${(growth * 100).toFixed(1)} % over the warm-up)`,
      target: "—",
      met: "—",
    },
  ];
};

/**
 * The same soak against the same app in a process started with --expose-gc (test/robustness/heap-probe-service.ts),
 * whose heap is read after full collections: growth there is what a leak would show.
 */
const measureHeapAfterCollections = async (): Promise<Row[]> => {
  const service = await forkProbeService("warn");
  try {
    const requests = mixedRequests(100);
    await cannon({ url: service.base, connections: 10, amount: WARM_UP_REQUESTS, requests }, SOAK_LIMIT_MS);
    const afterWarmUp = (await service.memory()).heapUsedBytes / 2 ** 20;
    const soak = await cannon({ url: service.base, connections: 10, amount: SOAK_REQUESTS, requests }, SOAK_LIMIT_MS);
    const after = await service.memory();
    const answered = soak["2xx"] + soak.non2xx;
    const growth = after.heapUsedBytes / 2 ** 20 / afterWarmUp - 1;
    return [
      {
        measure: `Heap in use after full collections, after the warm-up and after ${answered.toLocaleString("en")} more requests of the mix (same app, process with --expose-gc; resident ${megabytes(after.rssBytes / 2 ** 20)} at the end)`,
        value: `${megabytes(afterWarmUp)} → ${megabytes(after.heapUsedBytes / 2 ** 20)} (${growth >= 0 ? "+" : ""}${(growth * 100).toFixed(1)} %)`,
        target: "growth < 10 %",
        met: yesOrNo(growth < 0.1 && answered >= SOAK_REQUESTS && soak.non2xx === 0),
      },
    ];
  } finally {
    await service.stop();
  }
};

/** The non-2xx answers by status code, e.g. ` (503 × 12)`, so that load shedding is told apart from failures. */
const byStatus = (result: autocannon.Result): string => {
  const counts = Object.entries(result.statusCodeStats ?? {}).filter(([code]) => !code.startsWith("2"));
  return counts.length === 0 ? "" : ` (${counts.map(([code, stats]) => `${code} × ${stats.count ?? 0}`).join(", ")})`;
};

const measureMix = async (base: string): Promise<Row[]> => {
  const result = await cannon(
    { url: base, connections: MIX_CONNECTIONS, duration: MIX_SECONDS, requests: mixedRequests(MIX_POST_SAMPLES) },
    (MIX_SECONDS + 30) * 1000,
  );
  const what = `3 single-point GETs : 1 POST of ${MIX_POST_SAMPLES.toLocaleString("en")} samples, ${MIX_CONNECTIONS} connections, ${MIX_SECONDS} s`;
  return [
    { measure: `Mixed load (${what}): requests per second`, value: result.requests.average.toFixed(0), target: "—", met: "—" },
    { measure: "Mixed load: p50 latency", value: milliseconds(result.latency.p50), target: "—", met: "—" },
    { measure: "Mixed load: p99 latency", value: milliseconds(result.latency.p99), target: "—", met: "—" },
    {
      measure: `Mixed load: non-2xx answers, errors and timeouts (of ${(result["2xx"] + result.non2xx).toLocaleString("en")} answers)`,
      value: `${result.non2xx}${byStatus(result)}, ${result.errors}, ${result.timeouts}`,
      target: "0, 0, 0",
      met: yesOrNo(result.non2xx === 0 && result.errors === 0 && result.timeouts === 0),
    },
  ];
};

const percentile = (sorted: number[], share: number): number => sorted[Math.min(sorted.length - 1, Math.ceil(share * sorted.length) - 1)] ?? Number.NaN;

/**
 * Probes /livez every PROBE_INTERVAL_MS until `stopped` resolves, and measures each probe from the moment it was
 * due, not from when it could be sent: a closed-loop client (one connection waiting for each answer) would send
 * a single probe during a long stall and hide it in the percentiles (coordinated omission).
 */
const probeOpenLoop = async (base: string, stopped: Promise<unknown>) => {
  const pool = new Pool(base, { connections: 64 });
  const latencies: number[] = [];
  let failures = 0;
  let running = true;
  const finish = () => (running = false);
  void stopped.then(finish, finish);
  const pending: Promise<void>[] = [];
  const started = performance.now();
  for (let n = 0; running && n < WHOLE_WELL_LIMIT_MS / PROBE_INTERVAL_MS; n++) {
    const due = started + n * PROBE_INTERVAL_MS;
    await sleep(Math.max(0, due - performance.now()));
    pending.push(
      pool.request({ method: "GET", path: "/livez" }).then(
        async (answer) => {
          await answer.body.dump();
          if (answer.statusCode === 200) latencies.push(performance.now() - due);
          else failures++;
        },
        () => void failures++,
      ),
    );
  }
  await Promise.all(pending);
  await pool.close();
  latencies.sort((a, b) => a - b);
  return { latencies, failures };
};

/** POSTs a whole well to `path` and reads the answer to its end: status, answer size and seconds taken. */
const postWhole = async (base: string, path: string, contentType: string, body: string | Buffer) => {
  const agent = new Agent({ headersTimeout: WHOLE_WELL_LIMIT_MS, bodyTimeout: WHOLE_WELL_LIMIT_MS });
  const started = performance.now();
  try {
    const answer = await request(`${base}${path}`, { method: "POST", headers: { "content-type": contentType }, body, dispatcher: agent });
    let answerBytes = 0;
    for await (const chunk of answer.body) answerBytes += (chunk as Buffer).length;
    return { status: answer.statusCode, answerBytes, seconds: (performance.now() - started) / 1000 };
  } finally {
    await agent.close();
  }
};

/** One whole-well POST while /livez is probed. */
const probeDuringWholeWell = async (base: string, path: string, contentType: string, body: string | Buffer) => {
  const conversion = postWhole(base, path, contentType, body);
  const [converted, probes] = await Promise.all([conversion, probeOpenLoop(base, conversion)]);
  return { converted, ...probes };
};

const probeSummary = (latencies: number[], failures: number) =>
  `a probe every ${PROBE_INTERVAL_MS} ms, ${latencies.length} answered, ${failures} failed; p50 ${milliseconds(percentile(latencies, 0.5))}, max ${milliseconds(latencies.at(-1) ?? Number.NaN)}`;

/** The rows of one whole-well conversion with /livez probed meanwhile: its status and time, and the probes' p99 against the target. */
const conversionRows = (what: string, status: number, seconds: number, latencies: number[], failures: number): Row[] => [
  { measure: what, value: `${status} in ${seconds.toFixed(1)} s`, target: "200", met: yesOrNo(status === 200) },
  {
    measure: `/livez p99 latency meanwhile (${probeSummary(latencies, failures)})`,
    value: milliseconds(percentile(latencies, 0.99)),
    target: "< 100 ms",
    met: yesOrNo(percentile(latencies, 0.99) < 100 && failures === 0),
  },
];

const measureProbeDuringWholeWell = async (base: string): Promise<Row[]> => {
  const body = columnsBody(WHOLE_WELL_SAMPLES);
  const { converted, latencies, failures } = await probeDuringWholeWell(base, "/v1/elastic", "application/json", body);
  // The same transfer with no work at all: what this machine allows any Node server while it sends that much.
  const floor = await withBareStream(converted.answerBytes, (bare) => probeDuringWholeWell(bare, "/v1/elastic", "application/json", body));
  return [
    ...conversionRows(
      `One POST /v1/elastic of ${WHOLE_WELL_SAMPLES.toLocaleString("en")} samples as JSON columns (${(body.length / 2 ** 20).toFixed(0)} MiB in, ${(converted.answerBytes / 2 ** 20).toFixed(0)} MiB out)`,
      converted.status,
      converted.seconds,
      latencies,
      failures,
    ),
    {
      measure: `Floor of this machine: /livez p99 of a bare Node http server (bench/bare-stream.mjs) that reads the same body and streams an answer of the same size with no computation (${probeSummary(floor.latencies, floor.failures)}; answered in ${floor.converted.seconds.toFixed(1)} s)`,
      value: milliseconds(percentile(floor.latencies, 0.99)),
      target: "—",
      met: "—",
    },
  ];
};

/** A CSV file of the demonstration well repeated to `samples` rows, depth running on (DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]). */
const wellCsv = (samples: number): Buffer => {
  const cell = (value: number | null) => (value === null ? "" : String(value));
  const lines = ["DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]"];
  for (let i = 0; i < samples; i++) {
    const k = i % well.dtc.length;
    lines.push(`${Math.round((1450 + i * STEP_METRES) * 1e4) / 1e4},${cell(well.dtc[k])},${cell(well.dts[k])},${cell(well.rho[k])}`);
  }
  return Buffer.from(`${lines.join("\r\n")}\r\n`);
};

/** /livez while a whole-well CSV file is converted to CSV (POST /v1/logs, streamed), after one smaller file has warmed that path up. */
const measureProbeDuringFile = async (base: string): Promise<Row[]> => {
  const path = "/v1/logs?format=csv";
  await postWhole(base, path, "text/csv", wellCsv(WHOLE_WELL_SAMPLES / 10));
  const file = wellCsv(WHOLE_WELL_SAMPLES);
  const { converted, latencies, failures } = await probeDuringWholeWell(base, path, "text/csv", file);
  return conversionRows(
    `One CSV file of ${WHOLE_WELL_SAMPLES.toLocaleString("en")} samples to CSV, POST /v1/logs, streamed (${(file.length / 2 ** 20).toFixed(0)} MiB in, ${(converted.answerBytes / 2 ** 20).toFixed(0)} MiB out; after a warm-up file of a tenth of that)`,
    converted.status,
    converted.seconds,
    latencies,
    failures,
  );
};

const main = async () => {
  execFileSync("npx", ["tsc", "-p", "tsconfig.build.json"], { cwd: root, stdio: "inherit" });
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  // API_KEYS empty: the load measures the service, not a deployment's keys.
  const service = await start("load", ["dist/server/main.js"], { PORT: String(port), HOST: "127.0.0.1", LOG_LEVEL: "info", API_KEYS: "" }, /Server listening/);
  let rows: Row[];
  try {
    // Memory first, while the heap has seen nothing larger than the mix; printed last, in the order of issue 5.
    const memory = await measureMemory(base, service.pid as number);
    const mix = await measureMix(base);
    const probe = [...(await measureProbeDuringFile(base)), ...(await measureProbeDuringWholeWell(base))];
    rows = [...mix, ...probe, ...memory, ...(await measureHeapAfterCollections())];
  } finally {
    await stop(service);
  }
  const cpu = cpus();
  console.log(
    [
      "# Load",
      "",
      `\`npm run load\` on ${new Date().toISOString().slice(0, 10)}: Node ${process.version}, ${cpu.length} × ${cpu[0]?.model ?? "unknown CPU"}; the compiled service and the load generator share this machine, on 127.0.0.1.`,
      "",
      "| measure | value | target | met |",
      "| --- | --- | --- | --- |",
      ...rows.map((row) => `| ${row.measure} | ${row.value} | ${row.target} | ${row.met} |`),
      "",
    ].join("\n"),
  );
};

await main();
