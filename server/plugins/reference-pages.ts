import swaggerUi from "@fastify/swagger-ui";
import type { FastifyInstance } from "fastify";
import { pageSecurityHeaders } from "./security-headers.js";

/**
 * The HTML reference at /docs (Swagger UI over the contract that @fastify/swagger builds) and its assets, in an
 * encapsulated context of their own with the security headers a browser page needs. Deliberately not wrapped in
 * fastify-plugin: the page headers and their per-request hooks stay on these routes and off the API's.
 * Register @fastify/swagger before it.
 */
export async function referencePages(app: FastifyInstance): Promise<void> {
  await app.register(pageSecurityHeaders);
  await app.register(swaggerUi, { routePrefix: "/docs", uiConfig: { docExpansion: "list", deepLinking: true } });
}
