import { readFileSync } from "node:fs";

const examples = new URL("../../examples/", import.meta.url);
const lines = (file: string): string[] => readFileSync(new URL(file, examples), "utf8").split(/\r?\n/);

/** The first `rows` samples of the demo well (Kestrel Flats 3) as LAS 2.0: its whole header, then ~A. */
export const demoLasCut = (rows: number): string => {
  const las = lines("demo-well.las");
  const data = las.findIndex((line) => line.startsWith("~A"));
  return `${las.slice(0, data + 1 + rows).join("\n")}\n`;
};

/**
 * The demo well's samples repeated to `rows` samples, the depth renumbered at its 0.1524 m step:
 * a long LAS file of realistic values for requests that must stay in flight a while.
 */
export const demoLasRepeated = (rows: number): string => {
  const las = lines("demo-well.las");
  const data = las.findIndex((line) => line.startsWith("~A"));
  const samples = las.slice(data + 1).filter((line) => line.trim() !== "");
  const body = Array.from({ length: rows }, (_, i) => {
    const values = samples[i % samples.length].trim().split(/\s+/);
    values[0] = (1450 + i * 0.1524).toFixed(4);
    return ` ${values.join(" ")}`;
  });
  return `${[...las.slice(0, data + 1), ...body].join("\n")}\n`;
};

/** The first `rows` samples of the demo well as CSV: the header row, then the rows. */
export const demoCsvCut = (rows: number): string => `${lines("demo-well.csv").slice(0, 1 + rows).join("\n")}\n`;

const LINE_BREAK = /\r\n|\r|\n/;

const valuesOnLine = (line: string): number => line.split(/[\u0000-\u0020]+/).filter((value) => value !== "").length;

/**
 * Samples in a LAS text, counted as CWLS LAS 2.0 defines `~A`: with WRAP NO one sample per line,
 * with WRAP YES (or a first data line shorter than the curve list) one sample per as many values as
 * `~Curve` lists curves; blank lines and `#` comments are not samples. Values are separated by spaces
 * or control characters. Text is as decoded (UTF-8).
 */
export const lasSampleCount = (text: string): number => {
  const all = text.replace(/^\uFEFF/, "").split(LINE_BREAK);
  let section = "";
  let curves = 0;
  let wrapped = false;
  let data = all.length;
  for (let n = 0; n < all.length; n++) {
    const line = all[n].trim();
    if (line === "" || line.startsWith("#")) continue;
    if (line.startsWith("~")) {
      section = line.charAt(1).toUpperCase();
      if (section === "A") {
        data = n + 1;
        break;
      }
    } else if (section === "C") curves++;
    else if (section === "V" && /^WRAP\s*\.\S*\s+Y/i.test(line)) wrapped = true;
  }
  const counts = all
    .slice(data)
    .filter((line) => !line.replace(/^[ \t]+/, "").startsWith("#"))
    .map(valuesOnLine)
    .filter((count) => count > 0);
  if (counts.length === 0) return 0;
  if (!wrapped && counts[0] >= curves) return counts.length;
  return counts.reduce((sum, count) => sum + count, 0) / curves;
};

/** The delimiter RFC 4180 files use here, judged from the header line as the README says: most frequent of , ; tab outside quotes. */
const headerDelimiter = (header: string): string => {
  const counts = new Map([[",", 0], [";", 0], ["\t", 0]]);
  let quoted = false;
  for (const character of header) {
    if (character === '"') quoted = !quoted;
    else if (!quoted && counts.has(character)) counts.set(character, (counts.get(character) ?? 0) + 1);
  }
  return [...counts].reduce((best, entry) => (entry[1] > best[1] ? entry : best))[0];
};

/**
 * Data records of a CSV text (RFC 4180 §2): records end at CR, LF or CRLF outside quotes, a quote
 * opens a quoted field only at the start of a field, `""` inside one is a quote; blank records,
 * blank or `#` comment lines before the header, and the header record itself are not rows.
 */
export const csvDataRecords = (text: string): number => {
  const body = text.replace(/^\uFEFF/, "");
  let i = 0;
  for (;;) {
    const lineEnd = body.slice(i).search(/[\r\n]/);
    const line = lineEnd === -1 ? body.slice(i) : body.slice(i, i + lineEnd);
    if (!/^[ \t]*(#|$)/.test(line)) break;
    if (lineEnd === -1) return 0;
    i += lineEnd + 1;
  }
  let headerEnd = i;
  for (let quotes = 0; headerEnd < body.length && (quotes % 2 === 1 || !/[\r\n]/.test(body[headerEnd])); headerEnd++) {
    if (body[headerEnd] === '"') quotes++;
  }
  const delimiter = headerDelimiter(body.slice(i, headerEnd));
  let records = 0;
  let fieldStart = true;
  let quoted = false;
  let blank = true;
  const endRecord = () => {
    if (!blank) records++;
    blank = true;
    fieldStart = true;
  };
  for (; i < body.length; i++) {
    const character = body[i];
    if (quoted) {
      if (character === '"' && body[i + 1] === '"') i++;
      else if (character === '"') quoted = false;
      continue;
    }
    if (character === "\r" || character === "\n") {
      if (character === "\r" && body[i + 1] === "\n") i++;
      endRecord();
      continue;
    }
    if (character === '"' && fieldStart) quoted = true;
    fieldStart = character === delimiter;
    if (character === delimiter || character === '"' || character.trim() !== "") blank = false;
  }
  endRecord();
  return Math.max(records - 1, 0);
};
