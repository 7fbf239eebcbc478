import { uniqueMnemonics } from "../unique-mnemonics.js";
import { withInputName } from "./las-curve-names.js";
import { isItemSection, type LasSection } from "./las-document.js";
import { parseLasHeaderLine } from "./las-header-line.js";
import { parseLasNumber } from "./las-number.js";

/** A header item to write; empty strings stand for what is left out. */
export interface LasItemToWrite {
  readonly mnemonic: string;
  readonly unit?: string;
  readonly value?: string;
  readonly description?: string;
}

export interface LasHeaderToWrite {
  /** Sections of the file the curves come from (without `~A`, which is always written last); empty for a new file. */
  sections: readonly LasSection[];
  /** Becomes the whole `~Curve` section. */
  curves: readonly LasItemToWrite[];
  /** STRT, STOP and STEP of a new file. */
  indexItems: readonly LasItemToWrite[];
  nullValue: string;
  /** Replace the `~Well` item of the same mnemonic, or are added to `~Well`. */
  wellItems: readonly LasItemToWrite[];
  parameters: readonly LasItemToWrite[];
  otherLines: readonly string[];
}

const VERSION_ITEMS: readonly LasItemToWrite[] = [
  { mnemonic: "VERS", value: "2.0", description: "CWLS LOG ASCII STANDARD - VERSION 2.0" },
  { mnemonic: "WRAP", value: "NO", description: "ONE LINE PER DEPTH STEP" },
];

/**
 * Items every `~Well` must have (CWLS LAS 2.0, Appendix 1 Part 4, ~W), besides STRT, STOP, STEP and NULL; of the
 * location items the standard asks for PROV, or CNTY, STAT and CTRY (from memory of its text): PROV is written, empty.
 */
const REQUIRED_WELL_ITEMS: readonly LasItemToWrite[] = [
  { mnemonic: "COMP", description: "COMPANY" },
  { mnemonic: "WELL", description: "WELL" },
  { mnemonic: "FLD", description: "FIELD" },
  { mnemonic: "LOC", description: "LOCATION" },
  { mnemonic: "PROV", description: "PROVINCE" },
  { mnemonic: "SRVC", description: "SERVICE COMPANY" },
  { mnemonic: "DATE", description: "LOG DATE" },
  { mnemonic: "UWI", description: "UNIQUE WELL ID" },
];

const sameMnemonic = (a: LasItemToWrite, b: LasItemToWrite): boolean =>
  a.mnemonic.toUpperCase() === b.mnemonic.toUpperCase();

/** `items` with each of `updates` replacing the item of the same mnemonic, or appended. */
const withItems = (items: readonly LasItemToWrite[], updates: readonly LasItemToWrite[]): LasItemToWrite[] => {
  const result = [...items];
  for (const update of updates) {
    const at = result.findIndex((item) => sameMnemonic(item, update));
    if (at < 0) result.push(update);
    else result[at] = { ...result[at], ...update };
  }
  return result;
};

/**
 * Header lines laid out in columns. Each line is read back with the reader's own rule and must give
 * the same item, so an item the LAS grammar cannot carry (a blank in a unit, a colon in a
 * description, a dot in a mnemonic) is refused with a `RangeError` rather than written wrong.
 */
const itemLines = (items: readonly LasItemToWrite[]): string[] => {
  const fields = items.map((item) => ({
    mnemonic: item.mnemonic.trim(),
    unit: (item.unit ?? "").trim(),
    value: (item.value ?? "").trim(),
    description: (item.description ?? "").trim(),
  }));
  const width = (pick: (field: (typeof fields)[number]) => string) => Math.max(0, ...fields.map((f) => pick(f).length));
  const mnemonicWidth = width((f) => f.mnemonic);
  const unitWidth = width((f) => f.unit);
  const valueWidth = width((f) => f.value);
  return fields.map((field) => {
    const name = `${field.mnemonic.padEnd(mnemonicWidth)}.${field.unit.padEnd(unitWidth)}`;
    const text = ` ${name}  ${field.value.padEnd(valueWidth)} : ${field.description}`.trimEnd();
    const back = parseLasHeaderLine(text, 0);
    if (
      back === undefined ||
      back.mnemonic !== field.mnemonic ||
      back.unit !== field.unit ||
      back.value !== field.value ||
      back.description !== field.description
    ) {
      throw new RangeError(`the header item ${JSON.stringify(field)} cannot be written as a LAS line MNEM.UNIT VALUE : DESCRIPTION`);
    }
    return text;
  });
};

const textLines = (lines: readonly string[]): string[] =>
  lines.map((line) => {
    if (line.trimStart().startsWith("~")) throw new RangeError(`a ~Other line cannot start with a tilde: ${JSON.stringify(line)}`);
    if (/[\r\n]/.test(line)) throw new RangeError(`a ~Other line cannot hold a line break: ${JSON.stringify(line)}`);
    return line;
  });

/**
 * The input's ~Parameter items with those named like an added parameter (EL_NEG_PR of an answer sent back in) renamed
 * `_2`, `_3` … as curves are, unique among all parameters, the original name in the description: two items of one
 * name would contradict each other. Their values are kept; the other items are left as they are.
 */
const parametersBeside = (header: LasHeaderToWrite): ((items: readonly LasItemToWrite[]) => LasItemToWrite[]) => {
  const added = new Set(header.parameters.map((item) => item.mnemonic.trim().toUpperCase()));
  const inputs = header.sections.flatMap((section) => (isItemSection(section) && section.kind === "parameter" ? section.items : []));
  const clashing = inputs.filter((item) => added.has(item.mnemonic.toUpperCase()));
  const others = inputs.filter((item) => !added.has(item.mnemonic.toUpperCase())).map((item) => item.mnemonic);
  const names = uniqueMnemonics(
    clashing.map((item) => item.mnemonic),
    { separator: "_", reserved: [...added, ...others] },
  );
  const renamed = new Map<LasItemToWrite, string>(clashing.map((item, i) => [item, names[i]]));
  return (items) =>
    items.map((item) => {
      const mnemonic = renamed.get(item);
      return mnemonic === undefined ? item : { ...item, mnemonic, description: withInputName(item.description ?? "", item.mnemonic) };
    });
};

type Slot = { kind: Exclude<LasSection["kind"], "data">; title: string; source?: LasSection };

const DEFAULT_TITLES = {
  version: "~Version Information",
  well: "~Well Information",
  curve: "~Curve Information",
  parameter: "~Parameter Information",
  other: "~Other Information",
} as const;

/** The sections to write, in order: the original ones, and after their neighbours those a valid file needs. */
const slotsFor = (header: LasHeaderToWrite): Slot[] => {
  const slots: Slot[] = header.sections.flatMap((section) =>
    section.kind === "data" ? [] : [{ kind: section.kind, title: section.title, source: section }],
  );
  const insertAfter = (kind: keyof typeof DEFAULT_TITLES, after: Slot["kind"] | undefined): void => {
    if (slots.some((slot) => slot.kind === kind)) return;
    const at = after === undefined ? -1 : slots.findIndex((slot) => slot.kind === after);
    slots.splice(at + 1, 0, { kind, title: DEFAULT_TITLES[kind] });
  };
  insertAfter("version", undefined);
  insertAfter("well", "version");
  insertAfter("curve", "well");
  if (header.parameters.length > 0) insertAfter("parameter", "curve");
  if (header.otherLines.length > 0 && !slots.some((slot) => slot.kind === "other")) {
    slots.push({ kind: "other", title: DEFAULT_TITLES.other });
  }
  return slots;
};

/** Items of the original `~Well` with NULL saying the null value written (its text kept when it already does). */
const updatedWellItems = (items: readonly LasItemToWrite[], header: LasHeaderToWrite): LasItemToWrite[] => {
  const nullItem = items.find((item) => item.mnemonic.toUpperCase() === "NULL");
  const nullUpdate =
    nullItem === undefined
      ? [{ mnemonic: "NULL", value: header.nullValue, description: "NULL VALUE" }]
      : parseLasNumber(nullItem.value ?? "") === Number(header.nullValue)
        ? []
        : [{ mnemonic: nullItem.mnemonic, value: header.nullValue }];
  return withItems(items, [...nullUpdate, ...header.wellItems]);
};

const newWellItems = (header: LasHeaderToWrite): LasItemToWrite[] => [
  ...header.indexItems,
  { mnemonic: "NULL", value: header.nullValue, description: "NULL VALUE" },
  ...withItems(REQUIRED_WELL_ITEMS, header.wellItems),
];

/**
 * The header of a LAS 2.0 file, one string per line: the original sections in their order with
 * `~Version` set to VERS 2.0 / WRAP NO, `~Well` NULL set to the null value written, `~Curve`
 * rewritten for the curves written, extra parameters and other lines appended to the first
 * `~Parameter` and `~Other` (an input parameter of an added one's name renamed, see `parametersBeside`);
 * sections a valid file needs (CWLS LAS 2.0, Appendix 1 Part 2) and the original lacks are added.
 * A second `~Version` or `~Curve` is left out.
 */
export const writeLasHeader = (header: LasHeaderToWrite): string[] => {
  const seen = new Set<Slot["kind"]>();
  const lines: string[] = [];
  const inputParameters = parametersBeside(header);
  for (const slot of slotsFor(header)) {
    const first = !seen.has(slot.kind);
    seen.add(slot.kind);
    const source = slot.source;
    const items = source !== undefined && "items" in source ? source.items : [];
    const kept = source !== undefined && "lines" in source ? source.lines.map((line) => line.text) : [];
    let body: string[] | undefined;
    switch (slot.kind) {
      case "version": {
        const others = items.filter((item) => !VERSION_ITEMS.some((required) => sameMnemonic(item, required)));
        if (first) body = itemLines([...VERSION_ITEMS, ...others]);
        break;
      }
      case "well":
        if (source === undefined) body = itemLines(newWellItems(header));
        else body = itemLines(first ? updatedWellItems(items, header) : items);
        break;
      case "curve":
        if (first) body = itemLines(header.curves);
        break;
      case "parameter":
        body = itemLines(first ? [...inputParameters(items), ...header.parameters] : inputParameters(items));
        break;
      case "other":
        body = first ? [...kept, ...textLines(header.otherLines)] : kept;
        break;
      case "unknown":
        body = kept;
        break;
    }
    if (body !== undefined) lines.push(slot.title, ...body);
  }
  return lines;
};
