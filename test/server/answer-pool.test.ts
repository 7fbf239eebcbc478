/**
 * The worker threads of large answers run at a lower scheduling priority than the event loop, so that probes and
 * small requests get a core first (Linux: a thread is a task whose nice value setpriority(2) sets alone; the value
 * is field 19 of /proc/<pid>/task/<tid>/stat, proc(5)).
 */
import { readFileSync, readdirSync } from "node:fs";
import { platform } from "node:os";
import { describe, expect, it } from "vitest";
import { AnswerPool } from "../../server/answer-pool.js";
import { WORKER_NICENESS } from "../../server/workers/answer-worker.js";

const niceValues = (): number[] =>
  readdirSync("/proc/self/task").map((tid) => {
    const stat = readFileSync(`/proc/self/task/${tid}/stat`, "utf8");
    return Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[16]);
  });

describe("AnswerPool", () => {
  it.skipIf(platform() !== "linux")(`its worker threads run at nice ${WORKER_NICENESS}, the event loop's thread keeps its own`, async () => {
    const before = niceValues().filter((nice) => nice === WORKER_NICENESS).length;
    const pool = new AnswerPool(1);
    try {
      const [text] = pool.serialize([Float64Array.of(1.5, NaN, 2)]);
      expect((await text).toString("latin1")).toBe("[1.5,null,2]");
      expect(niceValues().filter((nice) => nice === WORKER_NICENESS).length).toBe(before + 1);
      const self = readFileSync("/proc/thread-self/stat", "utf8");
      expect(Number(self.slice(self.lastIndexOf(")") + 2).split(" ")[16])).not.toBe(WORKER_NICENESS);
    } finally {
      await pool.close();
    }
  });
});
