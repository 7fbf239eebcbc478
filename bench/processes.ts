/** Starting, watching and stopping the processes the benchmark measures; everything on 127.0.0.1, every wait bounded. */
import { spawn, type ChildProcess } from "node:child_process";
import { openSync, readFileSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

export const root = new URL("..", import.meta.url).pathname;

const STARTUP_LIMIT_MS = 30_000;
const SHUTDOWN_LIMIT_MS = 30_000;

export const freePort = (): Promise<number> =>
  new Promise((resolve) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const port = (server.address() as { port: number }).port;
      server.close(() => resolve(port));
    });
  });

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Starts a process whose stdout goes to a file, as a log shipper would take it: a pipe read by this
 * (busy) process would block the server's synchronous log writes and distort the numbers.
 */
export const start = async (label: string, args: string[], env: Record<string, string>, ready: RegExp): Promise<ChildProcess> => {
  const logFile = join(tmpdir(), `elastilog-bench-${process.pid}-${label}.log`);
  const child = spawn("node", args, { cwd: root, env: { ...process.env, ...env }, stdio: ["ignore", openSync(logFile, "w"), "inherit"] });
  let exitCode: number | null | undefined;
  child.once("exit", (code) => (exitCode = code));
  for (let waited = 0; !ready.test(readFileSync(logFile, "utf8")); waited += 50) {
    if (exitCode !== undefined) throw new Error(`${label} exited with ${exitCode} while starting`);
    if (waited > STARTUP_LIMIT_MS) {
      child.kill("SIGKILL");
      throw new Error(`${label} did not start within ${STARTUP_LIMIT_MS} ms`);
    }
    await sleep(50);
  }
  return child;
};

const SETTLE_LIMIT_MS = 30_000;

/** A full collection of this process's garbage, when node runs with --expose-gc (as npm run bench starts it). */
export const collectGarbage = (): void => (globalThis as { gc?: () => void }).gc?.();

/**
 * Waits until the service takes new work again: after a whole-well request its load shedding (event-loop delay
 * above its limit) refuses requests for a sampling interval or two, which would otherwise count against the next case.
 */
export const settle = async (base: string): Promise<void> => {
  // The benchmark's own garbage (the last answer, parsed) is collected before the next timed request, so that
  // the client's collector does not run inside the measurement.
  collectGarbage();
  for (let waited = 0; waited <= SETTLE_LIMIT_MS; waited += 250) {
    const response = await fetch(`${base}/v1/elastic?dtc=95&dts=170&rho=2.45`);
    await response.arrayBuffer();
    if (response.status !== 503) return;
    await sleep(250);
  }
  throw new Error(`the service still refused work (503) after ${SETTLE_LIMIT_MS} ms`);
};

/** SIGTERM, then SIGKILL if the process has not exited within the limit. */
export const stop = async (child: ChildProcess): Promise<void> => {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once("exit", resolve));
  child.kill("SIGTERM");
  const timer = setTimeout(() => child.kill("SIGKILL"), SHUTDOWN_LIMIT_MS);
  await exited;
  clearTimeout(timer);
};

/** A size line of /proc/<pid>/status (VmHWM: peak resident set, VmRSS: current; written in KiB), in MB of 10^6 bytes. */
export const residentMegabytes = (pid: number, line: "VmHWM" | "VmRSS"): number => {
  const status = readFileSync(`/proc/${pid}/status`, "utf8");
  const kibibytes = new RegExp(`^${line}:\\s+(\\d+) kB`, "m").exec(status)?.[1];
  if (kibibytes === undefined) throw new Error(`/proc/${pid}/status has no ${line} line`);
  return (Number(kibibytes) * 1024) / 1e6;
};

/** Clock ticks per second of /proc/<pid>/stat's times (USER_HZ): 100 on every Linux architecture in use. */
const TICKS_PER_SECOND = 100;

/** CPU time a process has used, user and system, in ms (fields 14 and 15 of /proc/<pid>/stat, proc(5)), at 10 ms resolution. */
export const cpuMilliseconds = (pid: number): number => {
  const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
  // The command name (field 2) is in parentheses and may hold spaces: count fields after its closing one.
  const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_SECOND;
};

/**
 * What writing fresh memory costs on this machine beside memory already written: 256 MiB allocated and filled
 * twice, in ms per MiB. Where the first pass costs many times the second (page faults; on a virtual machine,
 * pages its host takes back when freed), answers of hundreds of MB pay for it at both ends of the connection.
 */
export const firstTouchCost = (): { firstMsPerMiB: number; againMsPerMiB: number } => {
  const mebibytes = 256;
  const t0 = performance.now();
  const buffer = Buffer.allocUnsafeSlow(mebibytes * 2 ** 20);
  buffer.fill(1);
  const t1 = performance.now();
  buffer.fill(2);
  const t2 = performance.now();
  return { firstMsPerMiB: (t1 - t0) / mebibytes, againMsPerMiB: (t2 - t1) / mebibytes };
};

/**
 * Runs `use` against a bare Node server (bench/bare-stream.mjs) that reads a POST body and streams back
 * `answerBytes` bytes with no work at all, and stops the server afterwards: the floor any server meets on this
 * machine when it moves that much.
 */
export const withBareStream = async <T>(answerBytes: number, use: (base: string) => Promise<T>): Promise<T> => {
  const port = await freePort();
  const bare = await start("bare-stream", ["bench/bare-stream.mjs"], { PORT: String(port), ANSWER_BYTES: String(answerBytes) }, /ready/);
  try {
    return await use(`http://127.0.0.1:${port}`);
  } finally {
    await stop(bare);
  }
};
