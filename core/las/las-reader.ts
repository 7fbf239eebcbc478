import { WellFileError } from "../well-file-error.js";
import { USUAL_NULL_VALUE, type CurveInfo } from "../well-table.js";
import { curvesFromItems } from "./las-curves.js";
import { createLasDataReader, type LasDataReader } from "./las-data-reader.js";
import {
  isItemSection,
  type LasDocument,
  type LasHeaderItem,
  type LasItemSection,
  type LasSection,
  type LasWarning,
} from "./las-document.js";
import { parseLasHeaderLine } from "./las-header-line.js";
import { createIndexCheck, type LasIndexCheck } from "./las-index-check.js";
import { recoverLegacyWellItem } from "./las-legacy-well-item.js";
import { summariseWell } from "./las-well-summary.js";
import { createLineSplitter } from "./text-line-splitter.js";

/** What a streaming reader knows once `~A` begins: the header sections and the curves they describe. */
export interface LasHeaderView {
  sections: LasSection[];
  curves: CurveInfo[];
  /** `~Well` NULL, when the file gives one. */
  nullValue: number | undefined;
  /** What the header's reading noticed, by line (the data's own warnings, such as the index checks, come with `end`). */
  warnings: readonly LasWarning[];
}

export interface LasReader {
  /** Reads the next piece of the text; pieces may split a line or a number anywhere. */
  push(chunk: string): void;
  /** The header, once the text has reached `~A`; undefined before. */
  header(): LasHeaderView | undefined;
  /**
   * Removes and returns the complete samples read so far, one array per curve (empty before `~A`), so that a
   * caller can convert a file of any length batch by batch; `end` then holds only the samples not yet taken.
   */
  takeRows(): Float64Array[];
  /** Reads the end of the text and returns the document; throws `WellFileError` when the file cannot be read. */
  end(): LasDocument;
}

export interface LasReaderOptions {
  /** The value marking an absent sample when the caller overrides the file's NULL (a request's null value). */
  nullValue?: number;
}

/** Only the first letter after the tilde names a section (CWLS LAS 2.0, Appendix 1 Part 3, "~"). */
const SECTION_KINDS: Record<string, LasSection["kind"]> = {
  V: "version",
  W: "well",
  C: "curve",
  P: "parameter",
  O: "other",
  A: "data",
};

const curveItemsOf = (sections: readonly LasSection[]): LasHeaderItem[] =>
  sections.flatMap((section) => (isItemSection(section) && section.kind === "curve" ? section.items : []));

const firstNonBlank = (text: string): number => {
  let i = 0;
  while (i < text.length && (text[i] === " " || text[i] === "\t")) i++;
  return i;
};

/**
 * Reads a LAS 1.2 or 2.0 file handed over in chunks. Header lines are kept; samples go straight
 * into one Float64Array per curve, so the whole text is never held.
 */
export const createLasReader = (options: LasReaderOptions = {}): LasReader => {
  const sections: LasSection[] = [];
  const warnings: LasWarning[] = [];
  let current: LasSection | undefined;
  let version: { value: string; major: number } | undefined;
  let wrapped: boolean | undefined;
  let data: { reader: LasDataReader; indexCheck: LasIndexCheck; line: number; header: LasHeaderView; samples: number } | undefined;
  const legacyItems: LasHeaderItem[] = [];
  let sawReplacementCharacter = false;
  let lastLine = 0;

  const versionItem = (item: LasHeaderItem): void => {
    const mnemonic = item.mnemonic.toUpperCase();
    if (mnemonic === "VERS") {
      const major = Math.trunc(Number.parseFloat(item.value));
      if (major === 3) {
        throw new WellFileError(
          "las_version_3_unsupported",
          `VERS ${item.value}: LAS 3.0 is not supported; convert the file to LAS 2.0`,
          item.line,
        );
      }
      if (major !== 1 && major !== 2) {
        warnings.push({ line: item.line, message: `VERS ${JSON.stringify(item.value)} is not a LAS version this reader knows; read as LAS 2.0` });
      }
      version = { value: item.value, major };
    } else if (mnemonic === "WRAP") {
      const answer = item.value.toUpperCase();
      wrapped = answer.startsWith("Y");
      if (answer !== "YES" && answer !== "NO") {
        warnings.push({ line: item.line, message: `WRAP ${JSON.stringify(item.value)} is neither YES nor NO; read as ${wrapped ? "YES" : "NO"}` });
      }
    }
  };

  const headerItem = (section: LasItemSection, text: string, line: number): void => {
    const parsed = parseLasHeaderLine(text, line);
    if (parsed === undefined) {
      if (section.kind === "curve") {
        throw new WellFileError("las_bad_curve_line", `${JSON.stringify(text.trim())} in ~Curve is not a MNEM.UNIT VALUE : DESCRIPTION line`, line);
      }
      warnings.push({ line, message: `${JSON.stringify(text.trim())} is not a MNEM.UNIT VALUE : DESCRIPTION line; ignored` });
      return;
    }
    let item = parsed;
    if (section.kind === "version") versionItem(item);
    if (section.kind === "well" && version?.major === 1) {
      const recovered = recoverLegacyWellItem(item);
      if (recovered !== undefined) {
        legacyItems.push(item);
        item = recovered;
      }
    }
    section.items.push(item);
  };

  const legacyWarnings = (): LasWarning[] =>
    legacyItems.length === 0
      ? []
      : [
          {
            line: legacyItems[0].line,
            message: `LAS 1.2 value/description swap detected in ~Well (${legacyItems.map((item) => item.mnemonic).join(", ")}): values taken from after the colon`,
          },
        ];

  const beginData = (line: number): void => {
    const curveCount = curveItemsOf(sections).length;
    if (curveCount === 0) {
      throw new WellFileError("las_no_curves", "~A begins but no ~Curve section describes any curve", line);
    }
    const versionLine = sections[0].line;
    if (version === undefined) warnings.push({ line: versionLine, message: "~Version has no VERS item; read as LAS 2.0" });
    if (wrapped === undefined) warnings.push({ line: versionLine, message: "~Version has no WRAP item; read as WRAP NO" });
    const { numbers, well, warnings: wellWarnings } = summariseWell(sections);
    // An absent depth is no depth: the index checks pass it over, as the conversion does.
    const indexCheck = createIndexCheck(numbers.STRT, numbers.STOP, numbers.STEP, options.nullValue ?? well.nullValue ?? USUAL_NULL_VALUE);
    const reader = createLasDataReader({
      curveCount,
      wrapped: wrapped ?? false,
      onSample: (index, sampleLine) => {
        if (data !== undefined) data.samples++;
        indexCheck.sample(index, sampleLine);
      },
      warn: (warningLine, message) => warnings.push({ line: warningLine, message }),
    });
    const { curves, warnings: curveWarnings } = curvesFromItems(curveItemsOf(sections));
    const headerWarnings = [...warnings, ...wellWarnings, ...curveWarnings, ...legacyWarnings()].sort((a, b) => a.line - b.line);
    const header = { sections, curves, nullValue: well.nullValue, warnings: headerWarnings };
    data = { reader, indexCheck, line, header, samples: 0 };
  };

  const startSection = (title: string, line: number): void => {
    const kind = SECTION_KINDS[title.charAt(1).toUpperCase()] ?? "unknown";
    if (sections.length === 0 && kind !== "version") {
      throw new WellFileError("las_missing_version_section", `the file starts with ${title} but a LAS file must start with ~Version`, line);
    }
    const section: LasSection =
      kind === "data"
        ? { kind, title, line }
        : kind === "other" || kind === "unknown"
          ? { kind, title, line, lines: [] }
          : { kind, title, line, items: [] };
    sections.push(section);
    current = section;
    if (kind === "data") beginData(line);
  };

  const dataLine = (reader: LasDataReader, text: string, line: number): void => {
    const start = firstNonBlank(text);
    // Comment lines belong above ~A (CWLS LAS 2.0; from memory): skipping one could drop a sample unseen.
    if (text[start] === "#") {
      throw new WellFileError(
        "las_comment_in_data",
        "a # comment line inside ~A, where LAS 2.0 allows none: delete the line (or restore the sample it comments out), or move the comment above ~A",
        line,
      );
    }
    if (text[start] === "~") {
      throw new WellFileError("las_section_after_data", `${text.trim()} follows ~A, which must be the last section`, line);
    }
    reader.line(text, line);
  };

  const headerLine = (text: string, line: number): void => {
    const trimmed = text.trim();
    if (trimmed === "" || trimmed.startsWith("#")) return;
    if (!sawReplacementCharacter && text.includes("\uFFFD")) {
      sawReplacementCharacter = true;
      warnings.push({ line, message: "the header has bytes that are not valid UTF-8 (shown as \uFFFD); read as they are" });
    }
    if (trimmed.startsWith("~")) return startSection(trimmed, line);
    if (current === undefined) {
      throw new WellFileError("las_missing_version_section", "a LAS file must start with ~Version; this line comes before any section", line);
    }
    if (isItemSection(current)) headerItem(current, text, line);
    else if (current.kind !== "data") current.lines.push({ text: text.trimEnd(), line });
  };

  const splitter = createLineSplitter((text, line) => {
    lastLine = line;
    if (data !== undefined) dataLine(data.reader, text, line);
    else headerLine(text, line);
  });

  const end = (): LasDocument => {
    splitter.end();
    if (sections.length === 0) {
      throw new WellFileError("las_missing_version_section", "the file has no ~Version section (no LAS header at all)", Math.max(lastLine, 1));
    }
    if (data === undefined) {
      throw new WellFileError("las_no_data_section", `the file ends at line ${lastLine} without an ~A section: a header with no samples`, lastLine);
    }
    const { columns, wrapped: dataWrapped } = data.reader.finish();
    const { well, warnings: wellWarnings } = summariseWell(sections);
    const { curves, warnings: curveWarnings } = curvesFromItems(curveItemsOf(sections));
    const allWarnings = [...warnings, ...wellWarnings, ...curveWarnings, ...data.indexCheck.finish(), ...legacyWarnings()];
    if (data.samples === 0) {
      throw new WellFileError("las_no_rows", "the ~A section holds no data rows (a header with no samples): add the samples after ~A", data.line);
    }
    allWarnings.sort((a, b) => a.line - b.line);
    return {
      version: version?.value ?? "2.0",
      wrapped: dataWrapped,
      sections,
      well,
      table: { curves, columns, nullValue: well.nullValue },
      warnings: allWarnings,
    };
  };

  const takeRows = (): Float64Array[] => data?.reader.take() ?? [];

  return { push: splitter.push, header: () => data?.header, takeRows, end };
};

/** Reads a whole LAS text at once (see `createLasReader`). */
export const parseLas = (text: string, options?: LasReaderOptions): LasDocument => {
  const reader = createLasReader(options);
  reader.push(text);
  return reader.end();
};
