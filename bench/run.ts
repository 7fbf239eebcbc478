/**
 * `npm run bench`: measures the service against its floors, in one run, side by side, and writes BENCHMARKS.md.
 * Never part of `npm test`. Traffic goes to 127.0.0.1 only; every loop is bounded.
 */
import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import { openSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createServer } from "node:net";
import { cpus, totalmem } from "node:os";
import autocannon from "autocannon";
import { request } from "undici";

const root = new URL("..", import.meta.url).pathname;

const freePort = (): Promise<number> =>
  new Promise((resolve) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const port = (server.address() as { port: number }).port;
      server.close(() => resolve(port));
    });
  });

/**
 * Starts a server process whose stdout goes to a file, as a log shipper would take it: a pipe read by
 * this (busy) process would block the server's synchronous log writes and distort the numbers.
 */
const start = async (args: string[], env: Record<string, string>, ready: RegExp): Promise<ChildProcess> => {
  const logFile = join(tmpdir(), `elastilog-bench-${process.pid}-${args[0].replace(/\W/g, "_")}.log`);
  const child = spawn("node", args, { cwd: root, env: { ...process.env, ...env }, stdio: ["ignore", openSync(logFile, "w"), "inherit"] });
  const exited = new Promise<never>((_, reject) => child.once("exit", (code) => reject(new Error(`${args.join(" ")} exited with ${code}`))));
  for (let waited = 0; !ready.test(readFileSync(logFile, "utf8")); waited += 50) {
    if (waited > 30_000) throw new Error(`${args.join(" ")} did not start`);
    await Promise.race([new Promise((resolve) => setTimeout(resolve, 50)), exited]);
  }
  return child;
};

const median = (values: number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

/** A deterministic synthetic log (a demo, not data): slownesses and densities of a sand–shale sequence. */
const syntheticBody = (samples: number): string => {
  let seed = 42;
  const random = () => ((seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32);
  const depth = new Array<number>(samples);
  const dtc = new Array<number | null>(samples);
  const dts = new Array<number | null>(samples);
  const rho = new Array<number | null>(samples);
  for (let i = 0; i < samples; i++) {
    depth[i] = Math.round((1000 + i * 0.1524) * 1e4) / 1e4;
    const shale = Math.sin(i / 400) > 0;
    dtc[i] = Math.round(((shale ? 95 : 80) + random() * 10) * 1e3) / 1e3;
    dts[i] = i % 997 === 0 ? null : Math.round(((shale ? 190 : 140) + random() * 20) * 1e3) / 1e3;
    rho[i] = Math.round(((shale ? 2.5 : 2.3) + random() * 0.1) * 1e4) / 1e4;
  }
  return JSON.stringify({ depth, dtc, dts, rho });
};

interface Row {
  case: string;
  measured: string;
  floor: string;
  ratio: string;
  target: string;
  met: string;
}

const rows: Row[] = [];
const fmt = (ms: number) => `${ms.toFixed(1)} ms`;

const benchJson = async (base: string, samples: number, runs: number) => {
  const body = syntheticBody(samples);
  const times: number[] = [];
  const floors: number[] = [];
  for (let run = 0; run < runs; run++) {
    const t0 = performance.now();
    const response = await request(`${base}/v1/elastic`, { method: "POST", headers: { "content-type": "application/json" }, body });
    const text = await response.body.text();
    times.push(performance.now() - t0);
    if (response.statusCode !== 200) throw new Error(`POST ${samples} samples answered ${response.statusCode}: ${text.slice(0, 300)}`);
    const answer = JSON.parse(text);
    const f0 = performance.now();
    JSON.parse(body);
    JSON.stringify(answer);
    floors.push(performance.now() - f0);
  }
  const ratio = median(times) / median(floors);
  const target = samples === 1_000_000 ? 1.5 : undefined;
  rows.push({
    case: `JSON POST /v1/elastic, ${samples.toLocaleString("en")} samples (median of ${runs})`,
    measured: fmt(median(times)),
    floor: `${fmt(median(floors))} (JSON.parse request + JSON.stringify answer)`,
    ratio: `${ratio.toFixed(2)}×`,
    target: target ? `≤ ${target}× floor` : "—",
    met: target ? (ratio <= target ? "yes" : "no") : "—",
  });
};

const throughput = async (url: string): Promise<number> => {
  const result = await autocannon({ url, connections: 20, duration: 5, pipelining: 1 });
  if (result.non2xx > 0) throw new Error(`${url}: ${result.non2xx} non-2xx answers`);
  return result.requests.average;
};

const main = async () => {
  execFileSync("npx", ["tsc", "-p", "tsconfig.build.json"], { cwd: root, stdio: "inherit" });
  const port = await freePort();
  const service = await start(["dist/server/main.js"], { PORT: String(port), HOST: "127.0.0.1", LOG_LEVEL: "info" }, /Server listening/);
  const barePort = await freePort();
  const bare = await start(["bench/bare-fastify.mjs"], { PORT: String(barePort) }, /ready/);
  const base = `http://127.0.0.1:${port}`;
  try {
    await benchJson(base, 10_000, 7);
    await benchJson(base, 100_000, 5);
    await benchJson(base, 1_000_000, 3);
    const point = await throughput(`${base}/v1/elastic?dtc=95&dts=170&rho=2.45`);
    const constant = await throughput(`http://127.0.0.1:${barePort}/constant`);
    const share = point / constant;
    rows.push({
      case: "Single-point GET /v1/elastic, 20 connections, 5 s",
      measured: `${Math.round(point)} req/s`,
      floor: `${Math.round(constant)} req/s (bare Fastify route returning a constant)`,
      ratio: `${share.toFixed(2)}`,
      target: "≥ 0.70 of the bare route",
      met: share >= 0.7 ? "yes" : "no",
    });
  } finally {
    service.kill("SIGTERM");
    bare.kill("SIGTERM");
  }
  const header = [
    "# Benchmarks",
    "",
    `Written by \`npm run bench\` on ${new Date().toISOString().slice(0, 10)}: Node ${process.version}, ${cpus().length} × ${cpus()[0]?.model ?? "unknown CPU"}, ${Math.round(totalmem() / 2 ** 30)} GiB.`,
    "The service runs in its own process (compiled output, as in production) on 127.0.0.1; the floors are measured in the benchmark's process in the same run.",
    "",
    "| case | measured | floor | ratio | target | met |",
    "| --- | --- | --- | --- | --- | --- |",
  ];
  const table = rows.map((r) => `| ${r.case} | ${r.measured} | ${r.floor} | ${r.ratio} | ${r.target} | ${r.met} |`);
  const text = [...header, ...table, ""].join("\n");
  writeFileSync(new URL("../BENCHMARKS.md", import.meta.url), text);
  console.log(text);
};

await main();
