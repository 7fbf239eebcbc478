/**
 * Memory over many requests, measured where a leak shows: the heap after a full garbage collection (the probe
 * service runs with --expose-gc). `npm run load` reports resident memory too, which also moves with V8's heap
 * sizing; this check is the one that can tell a leak from a collector that has not run yet.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Pool } from "undici";
import { forkProbeService, type ProbeService } from "./service-process.js";

const ROUNDS = 4;
const REQUESTS_PER_ROUND = 5_000;
/** A leak of even 200 bytes per request would add 4 MB over the rounds; the collector's noise stays far below 10 %. */
const GROWTH_LIMIT = 0.1;

let service: ProbeService;

beforeAll(async () => {
  service = await forkProbeService("warn");
});

afterAll(async () => {
  await service.stop();
});

/** The mix of `npm run load`: three single-point GETs to one POST of 100 samples (Kestrel Flats 3 slownesses, our demo well). */
const round = async (pool: Pool) => {
  const body = JSON.stringify({
    dtc: Array.from({ length: 100 }, (_, i) => 80 + (i % 20)),
    dts: Array.from({ length: 100 }, (_, i) => 150 + (i % 30)),
    rho: Array.from({ length: 100 }, () => 2.4),
  });
  const statuses = new Map<number, number>();
  const one = async (i: number) => {
    const answer =
      i % 4 === 3
        ? await pool.request({ method: "POST", path: "/v1/elastic", headers: { "content-type": "application/json" }, body })
        : await pool.request({ method: "GET", path: `/v1/elastic?dtc=${90 + (i % 7)}&dts=170&rho=2.45` });
    await answer.body.dump();
    statuses.set(answer.statusCode, (statuses.get(answer.statusCode) ?? 0) + 1);
  };
  for (let i = 0; i < REQUESTS_PER_ROUND; i += 20) await Promise.all(Array.from({ length: 20 }, (_, k) => one(i + k)));
  return statuses;
};

describe("many requests (issue 5, load and soak)", () => {
  it(`${ROUNDS} × ${REQUESTS_PER_ROUND.toLocaleString("en")} requests of the load mix: every answer 200, and the heap after a full collection grows less than ${GROWTH_LIMIT * 100} % from the first round to the last`, async () => {
    const pool = new Pool(service.base, { connections: 10 });
    try {
      const heaps: number[] = [];
      for (let r = 0; r < ROUNDS; r++) {
        expect([...(await round(pool)).entries()]).toEqual([[200, REQUESTS_PER_ROUND]]);
        heaps.push((await service.memory()).heapUsedBytes);
      }
      expect(heaps.at(-1) as number, `heap after each round: ${heaps.map((bytes) => (bytes / 2 ** 20).toFixed(1)).join(", ")} MB`).toBeLessThan(heaps[0] * (1 + GROWTH_LIMIT));
    } finally {
      await pool.close();
    }
  }, 240_000);
});
