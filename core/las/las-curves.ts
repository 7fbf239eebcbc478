import { uniqueMnemonics } from "../unique-mnemonics.js";
import type { CurveInfo } from "../well-table.js";
import type { LasHeaderItem, LasWarning } from "./las-document.js";

/**
 * The curves of `~Curve`, in order, with repeated mnemonics made unique (`DT`, `DT:2`, `DT:3` …)
 * so that every column keeps a name of its own; each repetition is a warning.
 */
export const curvesFromItems = (items: readonly LasHeaderItem[]): { curves: CurveInfo[]; warnings: LasWarning[] } => {
  const names = uniqueMnemonics(items.map((item) => item.mnemonic));
  const firstLine = new Map<string, number>();
  const warnings: LasWarning[] = [];
  const curves = items.map((item, i) => {
    const key = item.mnemonic.toUpperCase();
    if (names[i] === item.mnemonic) firstLine.set(key, firstLine.get(key) ?? item.line);
    else {
      warnings.push({
        line: item.line,
        message: `curve ${item.mnemonic} is described again (first at line ${firstLine.get(key)}); this column is named ${names[i]}`,
      });
    }
    return { mnemonic: names[i], unit: item.unit, description: item.description };
  });
  return { curves, warnings };
};
