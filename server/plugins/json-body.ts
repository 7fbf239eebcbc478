import type { FastifyInstance } from "fastify";

/**
 * Takes JSON bodies as raw bytes: the route parses and validates them itself, on a worker thread when they
 * are large, so a million-sample body never blocks the event loop (see server/elastic-columns.ts).
 */
export const installRawJsonBodyParser = (app: FastifyInstance): void => {
  app.addContentTypeParser("application/json", { parseAs: "buffer" }, (_request, body, done) => done(null, body));
};
