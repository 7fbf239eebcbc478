/** The rows of BENCHMARKS.md and the arithmetic behind them. */

export interface Row {
  case: string;
  measured: string;
  floor: string;
  ratio: string;
  target: string;
  met: string;
}

export const median = (values: readonly number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

export const milliseconds = (ms: number): string => `${ms.toFixed(1)} ms`;

export const perSecond = (count: number, unit: string): string => `${(count / 1e6).toFixed(2)} M ${unit}/s`;

export const yesOrNo = (met: boolean): string => (met ? "yes" : "no");

/** Runs one case; a failure becomes its row, so that the other cases still run. */
export const attempt = async (rows: Row[], name: string, target: string, run: () => Promise<Row[]>): Promise<void> => {
  try {
    rows.push(...(await run()));
  } catch (error) {
    const message = (error instanceof Error ? error.message : String(error)).replace(/\s+/g, " ").replaceAll("|", "\\|").slice(0, 300);
    console.error(`${name}: ${message}`);
    rows.push({ case: name, measured: `failed: ${message}`, floor: "—", ratio: "—", target, met: "no (failed)" });
  }
};

export const markdownTable = (rows: readonly Row[]): string[] => [
  "| case | measured | floor or comparison | ratio | target | met |",
  "| --- | --- | --- | --- | --- | --- |",
  ...rows.map((r) => `| ${r.case} | ${r.measured} | ${r.floor} | ${r.ratio} | ${r.target} | ${r.met} |`),
];
