import type { FastifyInstance } from "fastify";
import { afterEach } from "vitest";
import { buildApp, type AppOptions } from "../../server/app.js";

const open: FastifyInstance[] = [];

afterEach(async () => {
  await Promise.all(open.splice(0).map((app) => app.close()));
});

/** A fresh app for one test, closed after it; silent unless a logger is given. */
export const build = async (options: AppOptions = {}): Promise<FastifyInstance> => {
  const app = await buildApp({ logger: false, ...options });
  open.push(app);
  await app.ready();
  return app;
};
