import { uniqueMnemonics } from "../unique-mnemonics.js";

/** A curve's `~Curve` line as far as its names go. */
export interface LasCurveName {
  readonly mnemonic: string;
  readonly unit: string;
  readonly description: string;
}

/**
 * A LAS 2.0 mnemonic for any name. The mnemonic runs to the first dot and holds no blank, dot or colon
 * (CWLS LAS 2.0, Appendix 1 Part 3; from memory), and a line starting with `~` or `#` is a section or a
 * comment: any of these, and anything but printable ASCII (LAS is an ASCII standard), becomes `_`.
 */
export const lasMnemonic = (name: string): string => {
  const safe = name.replace(/[^\x21-\x7e]|[.:]/gu, "_").replace(/^[~#]/, "_");
  return safe === "" ? "_" : safe;
};

/** A LAS unit runs from the dot to the first blank (CWLS LAS 2.0, Appendix 1 Part 3): blanks and line breaks become `_`. */
export const lasUnit = (unit: string): string => unit.replace(/\s/gu, "_");

/** Text as a JSON string with its colons escaped, which a description can carry whole (a colon would end the value field). */
const quoted = (text: string): string => JSON.stringify(text).replaceAll(":", "\\u003a");

/** A description with a note of what the input had appended (`BIT SIZE; INPUT NAME "BS"`); unchanged without one. */
const withNote = (description: string, note: string | undefined): string =>
  note === undefined ? description : [description, note].filter((part) => part !== "").join("; ");

/** A description with the name an item had in the input noted after it: `BIT SIZE; INPUT NAME "BS"`. */
export const withInputName = (description: string, name: string): string => withNote(description, `INPUT NAME ${quoted(name)}`);

/**
 * `~Curve` names for curves named anyhow: mnemonics made valid (`lasMnemonic`) and unique without regard to case
 * by `_2`, `_3` … (`reserved` names are never taken: the service's own curves keep theirs; a valid name is kept
 * before a changed one), units made valid (`lasUnit`). A curve whose mnemonic or unit changed keeps the original
 * in its description, as a JSON string: `INPUT NAME "GR.RAW"`, `INPUT UNIT "a b"`.
 */
export const lasCurveNames = <T extends LasCurveName>(curves: readonly T[], reserved: readonly string[] = []): T[] => {
  const valid = curves.map((curve) => lasMnemonic(curve.mnemonic));
  // Names valid as they are come first, so that a changed name (GR.RAW → GR_RAW) never takes one a curve has (GR_RAW).
  const order = curves.map((_, c) => c).sort((a, b) => Number(valid[a] !== curves[a].mnemonic) - Number(valid[b] !== curves[b].mnemonic));
  const unique = uniqueMnemonics(
    order.map((c) => valid[c]),
    { separator: "_", reserved: reserved.map(lasMnemonic) },
  );
  const mnemonics: string[] = [];
  order.forEach((c, i) => (mnemonics[c] = unique[i]));
  return curves.map((curve, c) => {
    const unit = lasUnit(curve.unit);
    const named = mnemonics[c] === curve.mnemonic ? curve.description : withInputName(curve.description, curve.mnemonic);
    return { ...curve, mnemonic: mnemonics[c], unit, description: withNote(named, unit === curve.unit ? undefined : `INPUT UNIT ${quoted(curve.unit)}`) };
  });
};
