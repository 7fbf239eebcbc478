import { execFile, spawn } from "node:child_process";
import { copyFileSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { afterAll, describe, expect, it } from "vitest";

const run = promisify(execFile);
const root = new URL("../..", import.meta.url).pathname;
const dockerfile = readFileSync(join(root, "Dockerfile"), "utf8");
const workdir = mkdtempSync(join(tmpdir(), "elastilog-image-"));

afterAll(() => rmSync(workdir, { recursive: true, force: true }));

/** Waits for the line pino writes when Fastify listens, and returns the address. */
const listeningAddress = (child: ReturnType<typeof spawn>): Promise<string> =>
  new Promise((resolve, reject) => {
    let seen = "";
    const timer = setTimeout(() => reject(new Error(`server did not start; output:\n${seen}`)), 30_000);
    child.stdout?.on("data", (chunk: Buffer) => {
      seen += chunk.toString();
      const match = /Server listening at (http:\/\/127\.0\.0\.1:\d+)/.exec(seen);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    });
    child.on("exit", (code) => reject(new Error(`server exited with ${code}; output:\n${seen}`)));
  });

// No container engine runs on the build machines, so this repeats the Dockerfile's recipe by hand.
describe("Dockerfile recipe", () => {
  it("is multi-stage on a Node LTS image, installs production dependencies only, runs as non-root, checks /livez", () => {
    expect(dockerfile.match(/^FROM node:\d+-[a-z-]+ AS \w+$/gm)).toHaveLength(2);
    expect(Number(/^FROM node:(\d+)/m.exec(dockerfile)?.[1]) % 2).toBe(0); // even majors are the LTS lines (Node.js release schedule)
    expect(dockerfile).toContain("npm ci --omit=dev");
    expect(dockerfile).toMatch(/^USER node$/m);
    expect(dockerfile).toMatch(/^HEALTHCHECK[\s\S]*\/livez/m);
    expect(dockerfile).toContain("HOST=0.0.0.0");
    expect(dockerfile).toContain('CMD ["node", "dist/server/main.js"]');
  });

  it(
    "its steps work: compile, production-only install in a clean folder, start, /livez answers, SIGTERM exits 0",
    async () => {
      await run("npx", ["tsc", "-p", "tsconfig.build.json", "--outDir", join(workdir, "dist")], { cwd: root });
      for (const file of ["package.json", "package-lock.json"]) copyFileSync(join(root, file), join(workdir, file));
      await run("npm", ["ci", "--omit=dev", "--ignore-scripts", "--no-audit", "--no-fund", "--prefer-offline"], { cwd: workdir });
      await expect(run("node", ["-e", "require.resolve('vitest')"], { cwd: workdir })).rejects.toThrow();

      const child = spawn("node", ["dist/server/main.js"], {
        cwd: workdir,
        env: { ...process.env, NODE_ENV: "production", PORT: "0", HOST: "127.0.0.1" },
        stdio: ["ignore", "pipe", "pipe"],
      });
      try {
        const base = await listeningAddress(child);
        const live = await fetch(`${base}/livez`);
        expect(live.status).toBe(200);
        const point = await fetch(`${base}/v1/elastic?vp=3000&vs=1500&rho=2.45`);
        expect(((await point.json()) as { E: number }).E).toBeCloseTo(14.7, 12);
        // Large enough to be parsed, computed and written on the compiled worker threads.
        const samples = 40_000;
        const large = await fetch(`${base}/v1/elastic`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ vp: Array(samples).fill(3000), vs: Array(samples).fill(1500), rho: Array(samples).fill(2.45) }),
        });
        const answer = (await large.json()) as { count: number; E: number[] };
        expect(answer.count).toBe(samples);
        expect(answer.E[samples - 1]).toBeCloseTo(14.7, 12);
      } finally {
        const exited = new Promise<number | null>((resolve) => child.once("exit", resolve));
        child.kill("SIGTERM");
        expect(await exited).toBe(0);
      }
    },
    180_000,
  );
});
