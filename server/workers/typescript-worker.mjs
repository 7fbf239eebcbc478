// Development only (tsx, vitest): loads the TypeScript worker through tsx. The compiled service loads
// answer-worker.js directly and never reads this file.
import { tsImport } from "tsx/esm/api";

const worker = await tsImport("./answer-worker.ts", import.meta.url);

export const prepare = (task) => worker.prepare(task);
export const serialize = (task) => worker.serialize(task);
export const logs = (task) => worker.logs(task);
