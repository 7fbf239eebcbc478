import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createCsvReader, parseCsv, type CsvDocument } from "../../../core/csv/csv-reader.js";
import { WellFileError } from "../../../core/well-file-error.js";

const fixture = (name: string): string => readFileSync(new URL(`../../fixtures/csv/${name}`, import.meta.url), "utf8");

const columnsOf = (document: CsvDocument): number[][] => document.table.columns.map((column) => Array.from(column));

const failure = (read: () => unknown): WellFileError => {
  try {
    read();
  } catch (error) {
    if (error instanceof WellFileError) return error;
    throw error;
  }
  throw new Error("expected a WellFileError");
};

const readInChunks = (text: string, cuts: number[]): CsvDocument => {
  const reader = createCsvReader();
  let from = 0;
  for (const cut of [...cuts].sort((a, b) => a - b)) {
    reader.push(text.slice(from, cut));
    from = cut;
  }
  reader.push(text.slice(from));
  return reader.end();
};

describe("parseCsv on the fictional well Kestrel Bight 2", () => {
  const comma = parseCsv(fixture("kestrel-bight-2.csv"));

  it("reads the header's names and bracketed units, with empty descriptions", () => {
    expect(comma.table.curves).toEqual([
      { mnemonic: "DEPT", unit: "m", description: "" },
      { mnemonic: "DTC", unit: "us/ft", description: "" },
      { mnemonic: "DTS", unit: "us/ft", description: "" },
      { mnemonic: "RHOB", unit: "g/cm3", description: "" },
      { mnemonic: "GR", unit: "gAPI", description: "" },
    ]);
    expect(comma.delimiter).toBe(",");
    expect(comma.table.nullValue).toBeUndefined();
  });

  it("reads every row as numbers, with NaN for empty and NA cells", () => {
    expect(comma.table.columns.map((column) => column.length)).toEqual([10, 10, 10, 10, 10]);
    expect(Array.from(comma.table.columns[0].slice(0, 3))).toEqual([1500, 1500.25, 1500.5]);
    expect(comma.table.columns[1][4]).toBeNaN();
    expect(comma.table.columns[4][2]).toBeNaN();
    expect(comma.table.columns[3][9]).toBe(2.401);
  });

  it("reads the same table from the semicolon (LF, no final line break) and tab versions", () => {
    const semicolon = parseCsv(fixture("kestrel-bight-2-semicolon.csv"));
    const tab = parseCsv(fixture("kestrel-bight-2.tsv"));
    expect(semicolon.delimiter).toBe(";");
    expect(tab.delimiter).toBe("\t");
    expect(semicolon.table.curves).toEqual(comma.table.curves);
    expect(tab.table.curves).toEqual(comma.table.curves);
    expect(columnsOf(semicolon)).toEqual(columnsOf(comma));
    expect(columnsOf(tab)).toEqual(columnsOf(comma));
  });

  it("gives the same table whatever chunk boundaries the text is pushed with", () => {
    const text = fixture("kestrel-bight-2.csv");
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: text.length }), { maxLength: 12 }), (cuts) => {
        const document = readInChunks(text, cuts);
        expect(document.table.curves).toEqual(comma.table.curves);
        expect(columnsOf(document)).toEqual(columnsOf(comma));
      }),
    );
  });

  it("keeps a null value given in the options, and keeps it in the columns as read", () => {
    const document = parseCsv("DEPT,DTC\n1,-999.25\n", { nullValue: -999.25 });
    expect(document.table.nullValue).toBe(-999.25);
    expect(document.table.columns[1][0]).toBe(-999.25);
  });
});

describe("parseCsv follows RFC 4180 §2", () => {
  it("reads quoted fields holding the delimiter, doubled quotes and line breaks (RFC 4180 §2 rules 5–7)", () => {
    const document = parseCsv('"aaa","b""bb","c,c","d\r\nd"\r\n"1",2,"3.5",4\r\n');
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["aaa", 'b"bb', "c,c", "d\r\nd"]);
    expect(columnsOf(document)).toEqual([[1], [2], [3.5], [4]]);
  });

  it("accepts CRLF (RFC 4180 §2 rule 1), and LF or lone CR as common practice, with or without a final line break (rule 2)", () => {
    const expected = [[1, 3], [2, 4]];
    for (const text of ["A,B\r\n1,2\r\n3,4\r\n", "A,B\n1,2\n3,4\n", "A,B\r1,2\r3,4\r", "A,B\r\n1,2\r\n3,4"]) {
      expect(columnsOf(parseCsv(text))).toEqual(expected);
    }
  });

  it("reads a CRLF split between two chunks as one line break", () => {
    const reader = createCsvReader();
    for (const chunk of ["A,B\r", "\n1,2\r", "\n3,4\r", "\n"]) reader.push(chunk);
    expect(columnsOf(reader.end())).toEqual([[1, 3], [2, 4]]);
  });

  it("reads a quoted field and a number split across chunks", () => {
    const reader = createCsvReader();
    for (const chunk of ['"DE', 'PT","D"', '"T"\n1.', "25,3", "\n"]) reader.push(chunk);
    const document = reader.end();
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["DEPT", 'D"T']);
    expect(columnsOf(document)).toEqual([[1.25], [3]]);
  });

  it("gives an empty last field to a record ending in a delimiter (RFC 4180 §2 rule 4)", () => {
    expect(columnsOf(parseCsv("A,B\n1,\n"))).toEqual([[1], [NaN]]);
  });
});

describe("parseCsv header rules (common practice)", () => {
  it("skips a byte order mark, # comment lines and blank lines before the header", () => {
    const document = parseCsv("\uFEFF# fictional well Kestrel Bight 2\r\n\r\n  \n# run 1\nDEPT,DTC\n1,2\n");
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["DEPT", "DTC"]);
    expect(columnsOf(document)).toEqual([[1], [2]]);
  });

  it("splits units written as NAME[unit], NAME [unit] and NAME (unit)", () => {
    const document = parseCsv("DEPT[m],DTC [us/ft], RHOB ( g/cm3 ) ,GR\n1,2,3,4\n");
    expect(document.table.curves.map(({ mnemonic, unit }) => [mnemonic, unit])).toEqual([
      ["DEPT", "m"],
      ["DTC", "us/ft"],
      ["RHOB", "g/cm3"],
      ["GR", ""],
    ]);
  });

  it("makes repeated names unique as DT, DT:2, dt:3", () => {
    const document = parseCsv("DT,DT,dt\n1,2,3\n");
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["DT", "DT:2", "dt:3"]);
  });

  it("names a column with an empty header cell by its position", () => {
    const document = parseCsv(",DEPT\n0,1500\n");
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["COL1", "DEPT"]);
  });

  it("judges the delimiter from the header, so commas inside quoted names do not count", () => {
    const document = parseCsv('"DT,corrected (us/ft)";RHOB\n90;2.4\n');
    expect(document.delimiter).toBe(";");
    expect(document.table.curves[0]).toEqual({ mnemonic: "DT,corrected", unit: "us/ft", description: "" });
  });
});

describe("parseCsv numbers", () => {
  it("reads .3665, 1.2E+03, a leading + and surrounding spaces as JavaScript's Number does (ECMA-262 StringToNumber)", () => {
    const document = parseCsv("A,B,C,D,E\n.3665,1.2E+03,+7, -2.5e-1 ,5.\n");
    expect(columnsOf(document)).toEqual([[0.3665], [1200], [7], [-0.25], [5]]);
  });

  it("reads empty cells, NA, NaN, null and - in any case as NaN", () => {
    const document = parseCsv("A,B,C,D,E,F\n,na,NAN,Null,-,\"\"\n");
    for (const column of document.table.columns) expect(column[0]).toBeNaN();
  });

  it("skips blank lines between data rows", () => {
    expect(columnsOf(parseCsv("A,B\n1,2\n\n   \r\n3,4\n"))).toEqual([[1, 3], [2, 4]]);
  });

  it("reads a quoted empty field of a one-column file as NaN rather than a blank line", () => {
    expect(columnsOf(parseCsv('A\n1\n""\n3\n'))).toEqual([[1, NaN, 3]]);
  });

  it("grows its columns past any initial size (5000 rows)", () => {
    const text = `DEPT,DTC\n${Array.from({ length: 5000 }, (_, i) => `${i},${i / 2}`).join("\n")}\n`;
    const document = parseCsv(text);
    expect(document.table.columns[0].length).toBe(5000);
    expect(document.table.columns[1][4999]).toBe(2499.5);
  });
});

describe("parseCsv errors", () => {
  it("names the line and the column of a cell that is not a number (csv_not_a_number)", () => {
    const error = failure(() => parseCsv("# note\nDEPT,DTC\n1,2\n2,abc\n"));
    expect(error.code).toBe("csv_not_a_number");
    expect(error.line).toBe(4);
    expect(error.message).toContain("DTC");
    expect(error.message).toContain('"abc"');
  });

  it("shortens a long offending value to 40 characters in the message", () => {
    const error = failure(() => parseCsv(`A\n${"x".repeat(100)}\n`));
    expect(error.message).toContain(`"${"x".repeat(40)}…"`);
    expect(error.message).not.toContain("x".repeat(41));
  });

  it("counts lines inside quoted fields when naming a line", () => {
    const error = failure(() => parseCsv('"DE\nPT",DTC\n1,2\n2,x\n'));
    expect(error.line).toBe(4);
  });

  it("rejects a decimal comma, hexadecimal and other text the number grammar lacks; a decimal comma is told as such (csv_decimal_comma)", () => {
    for (const cell of ["0x10", "1e", "e5", "1.2.3", "--1", "inf"]) {
      expect(failure(() => parseCsv(`A;B\n1;${cell}\n`)).code).toBe("csv_not_a_number");
    }
    expect(failure(() => parseCsv("A;B\n1;1,5\n")).code).toBe("csv_decimal_comma");
  });

  it("names the line of a row with more or fewer fields than the header (csv_ragged_row)", () => {
    const more = failure(() => parseCsv("A,B\n1,2\n3,4,5\n"));
    expect([more.code, more.line]).toEqual(["csv_ragged_row", 3]);
    expect(more.message).toContain("3 fields but the header has 2");
    const fewer = failure(() => parseCsv("A,B\r\n1,2\r\n3\r\n4,5\r\n"));
    expect([fewer.code, fewer.line]).toEqual(["csv_ragged_row", 3]);
  });

  it("names the line where an unclosed quote opened (csv_unclosed_quote)", () => {
    const error = failure(() => parseCsv('A,B\n1,2\n3,"4\n5,6\n'));
    expect([error.code, error.line]).toEqual(["csv_unclosed_quote", 3]);
  });

  it("reports a header with no data rows (csv_no_rows)", () => {
    expect(failure(() => parseCsv("DEPT,DTC\r\n")).code).toBe("csv_no_rows");
    expect(failure(() => parseCsv("DEPT,DTC")).code).toBe("csv_no_rows");
    expect(failure(() => parseCsv("DEPT,DTC\n\n\n")).code).toBe("csv_no_rows");
  });

  it("reports a text with no header line (csv_no_header)", () => {
    for (const text of ["", "\r\n\n  \n", "# only a comment\n", "# only a comment", "   "]) {
      expect(failure(() => parseCsv(text)).code).toBe("csv_no_header");
    }
  });
});

describe("createCsvReader handing out rows as they are read (takeRows)", () => {
  it("the rows taken after each chunk, then those left at the end, are the rows of the whole text, whole records only (property: any split points)", () => {
    // A quoted header cell holding the delimiter, a quoted number, CRLF and LF, an empty cell, no final line break (RFC 4180 §2 rules 2, 5, 6).
    const text = '# a comment first\r\nDEPT[m],"DTC, sonic [us/ft]",RHOB[g/cm3]\r\n1000,100,2.3\r\n1000.5,"95",\n1001,90,2.4\r\n1001.5,88,2.45';
    const expected = parseCsv(text);
    expect(expected.table.columns[0]).toHaveLength(4);
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 10 }), (cuts) => {
        const points = [0, ...cuts.sort((a, b) => a - b), text.length];
        const reader = createCsvReader();
        const taken: number[][] = [];
        const take = (columns: Float64Array[]) => columns.forEach((column, c) => (taken[c] ??= []).push(...column));
        for (let i = 1; i < points.length; i++) {
          reader.push(text.slice(points[i - 1], points[i]));
          const rows = reader.takeRows();
          expect(new Set(rows.map((column) => column.length)).size).toBeLessThanOrEqual(1);
          take(rows);
        }
        const document = reader.end();
        take(document.table.columns);
        expect(reader.curves()).toEqual(expected.table.curves);
        expect(taken.map((column) => column.map(String))).toEqual(columnsOf(expected).map((column) => column.map(String)));
      }),
    );
  });
});
