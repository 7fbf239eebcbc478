// The comparison point for single-point throughput: a bare Fastify route returning a constant.
import Fastify from "fastify";

const app = Fastify({ logger: false });
app.get("/constant", async () => ({ ok: true }));
await app.listen({ port: Number(process.env.PORT), host: "127.0.0.1" });
process.stdout.write("ready\n");
