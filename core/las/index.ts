export * from "./las-document.js";
export * from "./las-reader.js";
export * from "./las-writer.js";
export type { LasItemToWrite } from "./las-header-writer.js";
export { formatLasNumber, type LasNumberFormat } from "./las-number-format.js";
export * from "./las-curve-names.js";
export { lasAscii } from "./las-ascii.js";
