export * from "./csv-delimiter.js";
export * from "./csv-header.js";
export * from "./csv-number.js";
export * from "./csv-reader.js";
export * from "./csv-writer.js";
