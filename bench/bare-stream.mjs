// The floor for /livez latency while a whole well is answered: a bare Node http server that reads a POST body
// and streams back ANSWER_BYTES bytes of text in 1 MiB writes, with no computation at all, and answers /livez.
import http from "node:http";
import { Readable } from "node:stream";

const answerBytes = Number(process.env.ANSWER_BYTES);
const piece = Buffer.alloc(1 << 20, "1");

const server = http.createServer((request, response) => {
  if (request.url === "/livez") return response.end('{"status":"ok"}');
  request.resume();
  request.on("end", () => {
    response.setHeader("content-type", "application/json");
    function* pieces() {
      for (let sent = 0; sent < answerBytes; sent += piece.length) yield piece.subarray(0, Math.min(piece.length, answerBytes - sent));
    }
    Readable.from(pieces(), { objectMode: false, highWaterMark: piece.length }).pipe(response);
  });
});
server.listen(Number(process.env.PORT), "127.0.0.1", () => process.stdout.write("ready\n"));
