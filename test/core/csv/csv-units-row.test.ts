/**
 * A CSV whose first data row holds units (`m,us/ft,us/ft,g/cm3`, a common export layout; common practice) is refused
 * with a message that says so and shows the header that carries them. Data from our own fictional well, Marram Bank 7.
 */
import { describe, expect, it } from "vitest";
import { createCsvReader, parseCsv } from "../../../core/csv/csv-reader.js";
import { wellFileFailure } from "../../helpers/well-file-failure.js";

const failure = (text: string) => wellFileFailure(parseCsv, text);

describe("a row of units under the header (RFC 4180 §2: a header line, then records; units belong in the header here)", () => {
  it("says the first data row looks like a row of units and shows the header with units in brackets", () => {
    const error = failure("DEPT,DTC,DTS,RHOB\nm,us/ft,us/ft,g/cm3\n1510,95,170,2.45\n");
    expect(error.code).toBe("csv_units_row");
    expect(error.line).toBe(2);
    expect(error.message).toBe(
      'line 2: the first data row ("m", "us/ft", "us/ft", "g/cm3") holds no number: it looks like a row of units. ' +
        "Put the units in the header line instead, e.g. DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3] (also NAME [unit] or NAME (unit)), and delete this row",
    );
  });

  it("an empty or missing cell among the units (a curve without a unit) is no number either; the header shown leaves that curve bare", () => {
    const error = failure("# Marram Bank 7\nDEPT,GR,DTC\nm,,us/ft\n1510,80,95\n");
    expect(error.code).toBe("csv_units_row");
    expect(error.line).toBe(3);
    expect(error.message).toContain("e.g. DEPT[m],GR,DTC[us/ft] ");
  });

  it("a first row with a number is a plain bad value (csv_not_a_number), as is a later row of words", () => {
    expect(failure("DEPT,DTC\n1510,us/ft\n")).toMatchObject({ code: "csv_not_a_number", line: 2 });
    expect(failure("DEPT,DTC\n1510,95\nm,us/ft\n")).toMatchObject({ code: "csv_not_a_number", line: 3 });
  });

  it("a first row of absent values only (NA, empty) is read as before", () => {
    const table = parseCsv("DEPT,DTC\nNA,\n1510,95\n").table;
    expect(table.columns[1]).toEqual(new Float64Array([NaN, 95]));
  });

  it("lists at most six cells, and the same whatever the chunks", () => {
    const error = failure("A,B,C,D,E,F,G\nm,s,kg,a,b,c,d\n1,2,3,4,5,6,7\n");
    expect(error.message).toContain('("m", "s", "kg", "a", "b", "c", …)');
    expect(error.message).toContain("A[m],B[s],C[kg],D[a],E[b],F[c],… ");
    const text = "A,B,C,D,E,F,G\r\nm,s,kg,a,b,c,d\r\n1,2,3,4,5,6,7\r\n";
    const reader = createCsvReader();
    let chunked: unknown;
    try {
      for (const character of text) {
        reader.push(character);
        reader.takeRows();
      }
      reader.end();
    } catch (caught) {
      chunked = caught;
    }
    expect(chunked).toMatchObject({ code: "csv_units_row", line: 2, message: error.message });
  });
});
