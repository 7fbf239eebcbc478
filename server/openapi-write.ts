import { writeFileSync } from "node:fs";
import { generateOpenApiYaml } from "./openapi-document.js";

/** `npm run openapi`: writes openapi.yaml from the routes' schemas (the committed file is checked by a test). */
writeFileSync(new URL("../openapi.yaml", import.meta.url), await generateOpenApiYaml());
console.log("openapi.yaml written");
