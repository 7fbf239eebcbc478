/**
 * A CSV written with decimal commas (`90,5`), as spreadsheets set to a decimal-comma locale export numbers, usually
 * with the semicolon as delimiter (common practice), is refused with a message that says so, names the line and a
 * cell, and says to write decimal points. RFC 4180 has no decimal separator of its own; numbers here are read with a
 * point. Data from our own fictional well, Marram Bank 7.
 */
import { describe, expect, it } from "vitest";
import { createCsvReader, parseCsv } from "../../../core/csv/csv-reader.js";
import { isDecimalCommaNumber, readCsvNumber } from "../../../core/csv/csv-number.js";
import { wellFileFailure } from "../../helpers/well-file-failure.js";

const failure = (text: string) => wellFileFailure(parseCsv, text);

const HEADER = "DEPT[m];DTC[us/ft];DTS[us/ft];RHOB[g/cm3]";

describe("isDecimalCommaNumber", () => {
  it("recognises a number written with a decimal comma, which readCsvNumber refuses", () => {
    for (const cell of ["90,5", "-0,25", "+2,40", ",5", " 160,2 ", "1,5E+03", "2,4e-1"]) {
      expect(isDecimalCommaNumber(cell), cell).toBe(true);
      expect(readCsvNumber(cell), cell).toBeUndefined();
    }
  });

  it("passes over numbers with a point, words, units and cells with two commas", () => {
    for (const cell of ["90.5", "90", "", "NA", "us/ft", "1,2,3", "90,", "a,5", "1.234,5"]) expect(isDecimalCommaNumber(cell), cell).toBe(false);
  });
});

describe("a CSV with decimal commas (semicolon-delimited, the usual export of a decimal-comma locale)", () => {
  it("is refused at the first data row with a decimal-comma message, not taken for a row of units", () => {
    const error = failure(`${HEADER}\n100,0;90,5;160,2;2,40\n100,2;90,6;160,1;2,41\n`);
    expect(error.code).toBe("csv_decimal_comma");
    expect(error.line).toBe(2);
    expect(error.message).toBe(
      'line 2: the file uses decimal commas (the value "100,0" in column DEPT), which are not read here: ' +
        "write numbers with a decimal point (100.0), e.g. export the file with the point as decimal separator; the delimiter may stay as it is",
    );
    expect(error.message).not.toContain("units");
  });

  it("names the line and cell of the first decimal comma when the rows before it hold whole numbers", () => {
    const error = failure(`${HEADER}\r\n100;90;160;2\r\n100,2;90,6;160,1;2,41\r\n`);
    expect(error).toMatchObject({ code: "csv_decimal_comma", line: 3 });
    expect(error.message).toContain('(the value "100,2" in column DEPT)');
    expect(failure(`${HEADER}\n100;90;160;2\n101;90,6;160;2\n`).message).toContain('(the value "90,6" in column DTC)');
  });

  it("is told the same with a tab delimiter, and with quoted cells in a comma-delimited file (RFC 4180 §2: a quoted field may hold the delimiter)", () => {
    expect(failure("DEPT\tDTC\n100\t90,5\n")).toMatchObject({ code: "csv_decimal_comma", line: 2 });
    expect(failure('DEPT,DTC\n100,"90,5"\n')).toMatchObject({ code: "csv_decimal_comma", line: 2 });
  });

  it("gives the same answer whatever the chunks", () => {
    const text = `${HEADER}\r\n100,0;90,5;160,2;2,40\r\n`;
    const whole = failure(text);
    const reader = createCsvReader();
    let chunked: unknown;
    try {
      for (const character of text) reader.push(character);
      reader.end();
    } catch (caught) {
      chunked = caught;
    }
    expect(chunked).toMatchObject({ code: whole.code, line: whole.line, message: whole.message });
  });

  it("leaves a real row of units and a plain bad value as they were told", () => {
    expect(failure("DEPT;DTC\nm;us/ft\n100;90\n").code).toBe("csv_units_row");
    expect(failure("DEPT;DTC\n100;9O\n").code).toBe("csv_not_a_number");
  });

  it("reads the same file once written with decimal points, semicolons kept", () => {
    const { table, delimiter } = parseCsv(`${HEADER}\n100.0;90.5;160.2;2.40\n100.2;90.6;160.1;2.41\n`);
    expect(delimiter).toBe(";");
    expect(table.columns[1]).toEqual(new Float64Array([90.5, 90.6]));
  });
});
