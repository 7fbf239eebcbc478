import { randomUUID } from "node:crypto";
import { STATUS_CODES } from "node:http";
import type { Socket } from "node:net";
import { problemDocument, PROBLEM_MEDIA_TYPE, type ProblemSlug } from "../problems.js";

const BY_CODE: Record<string, [ProblemSlug, string]> = {
  ERR_HTTP_REQUEST_TIMEOUT: ["request-timeout", "The request (headers or body) did not arrive within the server's time limit; the connection is closed."],
  HPE_HEADER_OVERFLOW: [
    "header-too-large",
    "The request line and headers are larger than the server accepts (16 KiB, Node's default): send many samples as a POST body, not in the query string, and keep headers short.",
  ],
};

/**
 * Answers errors that happen before a request reaches Fastify (a slow or malformed request on the socket) with
 * an RFC 9457 problem document like every other error, then closes the connection. Replaces Fastify's default
 * `clientErrorHandler`, which answers them in its own JSON shape.
 */
export function clientErrorHandler(this: { log?: { info(object: object, message: string): void } } | undefined, error: Error & { code?: string }, socket: Socket): void {
  if (error.code === "ECONNRESET" || socket.destroyed) return;
  const [slug, detail] = BY_CODE[error.code ?? ""] ?? ["invalid-request", "The HTTP request could not be parsed; check the request line and headers."];
  // No request exists yet to carry an id; this one ties the answer to the log line, as every other 4xx is tied.
  const requestId = randomUUID();
  const document = problemDocument(slug, detail, { requestId });
  this?.log?.info({ request_id: requestId, code: error.code, status: document.status }, "request refused before it was read");
  const body = JSON.stringify(document);
  const status = document.status;
  if (socket.writable) {
    socket.write(
      `HTTP/1.1 ${status} ${STATUS_CODES[status]}\r\nContent-Type: ${PROBLEM_MEDIA_TYPE}\r\nContent-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
    );
  }
  socket.destroy(error);
}
