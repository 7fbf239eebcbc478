export type CsvDelimiter = "," | ";" | "\t";

/** In order of preference when counts tie. */
const CANDIDATES: readonly CsvDelimiter[] = [",", ";", "\t"];

/**
 * The delimiter of a CSV file, judged from its header line: whichever of comma, semicolon and
 * tab occurs most often outside quotes; ties go to the earlier of comma, semicolon, tab, and a
 * header with none of them (a single column) is read with comma.
 */
export const detectDelimiter = (headerLine: string): CsvDelimiter => {
  const counts: Record<CsvDelimiter, number> = { ",": 0, ";": 0, "\t": 0 };
  let inQuotes = false;
  for (const character of headerLine) {
    if (character === '"') inQuotes = !inQuotes;
    else if (!inQuotes && CANDIDATES.includes(character as CsvDelimiter)) counts[character as CsvDelimiter]++;
  }
  return CANDIDATES.reduce((best, candidate) => (counts[candidate] > counts[best] ? candidate : best));
};
