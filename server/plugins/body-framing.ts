import type { FastifyInstance } from "fastify";
import fp from "fastify-plugin";
import { ProblemError } from "../problems.js";

/** A request that carries content (RFC 9112 §6.3: Transfer-Encoding, or a Content-Length above zero). */
const hasBody = (headers: { "content-length"?: string; "transfer-encoding"?: string }): boolean =>
  headers["transfer-encoding"] !== undefined || (headers["content-length"] !== undefined && headers["content-length"] !== "0");

/**
 * Refuses, before any body is read, what would otherwise be read wrongly or not at all: a body in a content
 * coding (gzip, br…) this service does not decode, which would be read as bytes of the file (RFC 9110 §15.5.16:
 * 415 for an unsupported content coding), and a body on GET or HEAD, which no route reads (RFC 9110 §9.3.1: such
 * content has no defined meaning). Both are told, never ignored. A callback hook: it runs on every request.
 */
async function bodyFramingPlugin(app: FastifyInstance): Promise<void> {
  app.addHook("onRequest", (request, _reply, done) => {
    const coding = request.headers["content-encoding"];
    if (coding !== undefined && coding.trim().toLowerCase() !== "identity") {
      done(new ProblemError("unsupported-media-type", `Content-Encoding "${coding}" is not read here: send the body uncompressed, without a Content-Encoding header.`));
      return;
    }
    if ((request.method === "GET" || request.method === "HEAD") && hasBody(request.headers)) {
      done(
        new ProblemError("invalid-request", `${request.method} reads no body here: leave it empty. Data goes in the query string of a GET, or in the body of a POST where the path takes one (POST /v1/elastic, POST /v1/logs).`, [
          { field: "body", message: "leave the body empty on GET, or use POST" },
        ]),
      );
      return;
    }
    done();
  });
}

export const bodyFraming = fp(bodyFramingPlugin, { fastify: "5.x", name: "elastilog-body-framing" });
