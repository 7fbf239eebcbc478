import { buildApp } from "./app.js";

/** The OpenAPI document as the routes' zod schemas produce it, as YAML. */
export const generateOpenApiYaml = async (): Promise<string> => {
  const app = await buildApp({ logger: false });
  await app.ready();
  const yaml = app.swagger({ yaml: true });
  await app.close();
  return yaml;
};
