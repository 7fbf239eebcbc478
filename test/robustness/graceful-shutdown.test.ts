import { Agent, request } from "node:http";
import { setTimeout as sleep } from "node:timers/promises";
import { afterEach, describe, expect, it } from "vitest";
import { withinBound } from "./answer-checks.js";
import { getFresh, killService, startService, waitForOutput, type Reply, type ServiceProcess } from "./service-process.js";
import { demoLasRepeated } from "./well-texts.js";

const SAMPLES = 20_000;
const UPLOADS = 4;
const CHUNKS = 12;
const CHUNK_PAUSE_MS = 100;

let service: ServiceProcess | undefined;

afterEach(async () => {
  await killService(service);
  service = undefined;
});

interface SlowUpload {
  /** Resolves once the server has read the request head and asked for the body (RFC 9110 §10.1.1, 100-continue). */
  accepted: Promise<void>;
  /** Sends the rest of the body, slowly. */
  finish: () => Promise<void>;
  reply: Promise<Reply>;
}

/**
 * A POST /v1/logs whose body goes out in `CHUNKS` pieces `CHUNK_PAUSE_MS` apart, the first only after
 * the server's 100 Continue, so the request is certainly in flight before the test sends SIGTERM.
 * The connection is kept alive afterwards, as a load balancer's would be.
 */
const slowUpload = (base: string, file: Buffer, agent: Agent): SlowUpload => {
  let accept: () => void = () => undefined;
  const accepted = new Promise<void>((resolve) => (accept = resolve));
  const outgoing = request(`${base}/v1/logs`, {
    method: "POST",
    agent,
    headers: { "content-type": "application/x-las", "content-length": String(file.length), expect: "100-continue" },
  });
  const reply = new Promise<Reply>((resolve, reject) => {
    outgoing.on("response", (response) => {
      let body = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (body += chunk));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, headers: response.headers, body }));
      response.on("error", reject);
    });
    outgoing.on("error", reject);
  });
  // Handled here too, so a test that fails early (and kills the process) leaves no unhandled rejection behind.
  reply.catch(() => undefined);
  const piece = Math.ceil(file.length / CHUNKS);
  outgoing.on("continue", () => {
    outgoing.write(file.subarray(0, piece));
    accept();
  });
  const finish = async () => {
    for (let start = piece; start < file.length; start += piece) {
      await sleep(CHUNK_PAUSE_MS);
      outgoing.write(file.subarray(start, start + piece));
    }
    outgoing.end();
  };
  return { accepted, finish, reply };
};

describe("graceful shutdown of the real process (issue 5, item 5), with the default grace period", () => {
  it.each([
    { clients: "clients that close their connections", keepAlive: false },
    { clients: "keep-alive clients such as load balancers", keepAlive: true },
  ])(
    "on SIGTERM with $clients: readiness fails or the listener closes, every in-flight upload completes with 200 and all its rows, and the exit code is 0",
    async ({ keepAlive }) => {
      service = await startService();
      const { base, child } = service;
      const file = Buffer.from(demoLasRepeated(SAMPLES));
      const agent = new Agent({ keepAlive, maxSockets: UPLOADS });
      const uploads = Array.from({ length: UPLOADS }, () => slowUpload(base, file, agent));
      await withinBound(Promise.all(uploads.map((upload) => upload.accepted)), 10_000, "100 Continue for every upload");

      child.kill("SIGTERM");
      const sending = uploads.map((upload) => upload.finish());
      // The signal arrives on its own schedule: probe readiness once main.ts has begun its shutdown.
      await waitForOutput(service, /shutting down/);

      const readiness = await getFresh(`${base}/readyz`).then(
        (reply) => reply.status,
        (error: NodeJS.ErrnoException) => error.code,
      );
      // Refused or reset: the listener is closing (a connection the kernel had queued is reset); 503: still listening, not ready.
      expect(["ECONNREFUSED", "ECONNRESET", 503], "a fresh /readyz after SIGTERM").toContain(readiness);

      await withinBound(Promise.all(sending), 30_000, "sending the rest of every upload");
      const replies = await withinBound(Promise.all(uploads.map((upload) => upload.reply)), 60_000, "the answers to the in-flight uploads");
      for (const reply of replies) {
        expect(reply.status, reply.body.slice(0, 300)).toBe(200);
        const json = JSON.parse(reply.body) as { count: number; E: unknown[] };
        expect(json.count).toBe(SAMPLES);
        expect(json.E.length).toBe(SAMPLES);
      }
      // Bounded beyond the default SHUTDOWN_GRACE_MS (25 s), after which main.ts exits 1 by design.
      const code = await withinBound(service.exited, 40_000, "exit after SIGTERM");
      agent.destroy();
      expect(code, service.output().slice(-1500)).toBe(0);
    },
    120_000,
  );
});
