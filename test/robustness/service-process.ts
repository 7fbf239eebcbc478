import { fork, spawn, type ChildProcess } from "node:child_process";
import { once } from "node:events";
import { request, type IncomingMessage } from "node:http";
import { setTimeout as sleep } from "node:timers/promises";
import { fileURLToPath } from "node:url";
import { withinBound } from "./within-bound.js";

const root = fileURLToPath(new URL("../..", import.meta.url));

export interface ServiceProcess {
  child: ChildProcess;
  /** `http://127.0.0.1:<port>` */
  base: string;
  port: number;
  /** Everything the process wrote so far (pino JSON lines and any stderr). */
  output: () => string;
  /** Resolves with the exit code (null when killed by a signal). */
  exited: Promise<number | null>;
}

/**
 * Starts the real entry point (`server/main.ts`, run by tsx as `npm run dev` does) on 127.0.0.1 and a
 * free port, and waits for the line Fastify logs when it listens. `env` adds settings (README, "Limits").
 */
export const startService = (env: Record<string, string> = {}, boundMs = 30_000): Promise<ServiceProcess> => {
  const child = spawn(process.execPath, ["--import", "tsx", "server/main.ts"], {
    cwd: root,
    env: { ...process.env, PORT: "0", HOST: "127.0.0.1", LOG_LEVEL: "info", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let seen = "";
  child.stdout?.on("data", (chunk: Buffer) => (seen += chunk.toString()));
  child.stderr?.on("data", (chunk: Buffer) => (seen += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      reject(new Error(`the service did not start within ${boundMs} ms; output:\n${seen}`));
    }, boundMs);
    const look = () => {
      const match = /Server listening at http:\/\/127\.0\.0\.1:(\d+)/.exec(seen);
      if (match === null) return;
      clearTimeout(timer);
      child.stdout?.off("data", look);
      resolve({ child, base: `http://127.0.0.1:${match[1]}`, port: Number(match[1]), output: () => seen, exited });
    };
    child.stdout?.on("data", look);
    void exited.then((code) => {
      clearTimeout(timer);
      reject(new Error(`the service exited with ${code} before listening; output:\n${seen}`));
    });
  });
};

/** Resolves once the process has written a line matching `pattern`; looks every 20 ms, for at most `boundMs`. */
export const waitForOutput = async (service: ServiceProcess, pattern: RegExp, boundMs = 10_000): Promise<void> => {
  for (let waited = 0; !pattern.test(service.output()); waited += 20) {
    if (waited >= boundMs) throw new Error(`no output matching ${pattern} within ${boundMs} ms; output:\n${service.output().slice(-1500)}`);
    await sleep(20);
  }
};

/** Kills the process if it still runs (a test that failed half-way must not leave it behind). */
export const killService = async (service: ServiceProcess | undefined): Promise<void> => {
  if (service === undefined || service.child.exitCode !== null || service.child.signalCode !== null) return;
  service.child.kill("SIGKILL");
  await service.exited;
};

export interface Reply {
  status: number;
  headers: IncomingMessage["headers"];
  body: string;
}

/** One GET on a fresh connection (no keep-alive), bounded; rejects on a connection error such as ECONNREFUSED. */
export const getFresh = (url: string, boundMs = 10_000): Promise<Reply> =>
  new Promise((resolve, reject) => {
    const outgoing = request(url, { agent: false, timeout: boundMs }, (response) => {
      let body = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (body += chunk));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, headers: response.headers, body }));
      response.on("error", reject);
    });
    outgoing.on("timeout", () => outgoing.destroy(new Error(`no answer from ${url} within ${boundMs} ms`)));
    outgoing.on("error", reject);
    outgoing.end();
  });

export interface Memory {
  heapUsedBytes: number;
  arrayBuffersBytes: number;
  rssBytes: number;
  /** Largest resident set size the process has had so far. */
  peakRssBytes: number;
}

export interface ProbeService {
  base: string;
  /** Memory in use after two forced garbage collections. */
  memory: () => Promise<Memory>;
  /** What the service has logged so far at `logLevel` and above. */
  logged: () => string;
  stop: () => Promise<void>;
}

/** The app of `heap-probe-service.ts` in a child process with --expose-gc, so its memory is its own and can be read after a collection. */
export const forkProbeService = async (logLevel = "silent"): Promise<ProbeService> => {
  const child = fork(fileURLToPath(new URL("./heap-probe-service.ts", import.meta.url)), [], {
    execArgv: ["--expose-gc", "--import", "tsx"],
    env: { ...process.env, LOG_LEVEL: logLevel },
    stdio: ["ignore", "pipe", "pipe", "ipc"],
  });
  let logged = "";
  child.stdout?.on("data", (chunk: Buffer) => (logged += chunk.toString()));
  child.stderr?.on("data", (chunk: Buffer) => (logged += chunk.toString()));
  const exited = once(child, "exit");
  const [message] = (await withinBound(once(child, "message"), 30_000, "the probe service to listen")) as [{ address: string }];
  const memory = async (): Promise<Memory> => {
    const reply = once(child, "message");
    child.send("memory");
    const [usage] = (await withinBound(reply, 30_000, "a memory reading")) as [Memory];
    return usage;
  };
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    child.disconnect();
    await withinBound(exited, 10_000, "the probe service to stop").catch(() => child.kill("SIGKILL"));
  };
  return { base: message.address, memory, logged: () => logged, stop };
};
