import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCsv } from "../../../core/csv/csv-reader.js";
import { AsciiText, SHORTEST } from "../../../core/ascii-numbers.js";
import { writeCsv, writeCsvRecords, type CsvTable } from "../../../core/csv/csv-writer.js";

const text = (table: CsvTable): string => [...writeCsv(table)].join("");

describe("writeCsv", () => {
  it("writes a NAME[unit] header, a bare name when the unit is empty, and CRLF after every record (RFC 4180 §2 rules 1 and 3)", () => {
    const table = {
      curves: [
        { name: "DEPT", unit: "m" },
        { name: "VPVS", unit: "" },
      ],
      columns: [Float64Array.of(1500, 1500.5), Float64Array.of(1.8, 1.75)],
    };
    expect(text(table)).toBe("DEPT[m],VPVS\r\n1500,1.8\r\n1500.5,1.75\r\n");
  });

  it("writes NaN as an empty cell", () => {
    const table = {
      curves: [
        { name: "A", unit: "" },
        { name: "B", unit: "" },
      ],
      columns: [Float64Array.of(NaN), Float64Array.of(2)],
    };
    expect(text(table)).toBe("A,B\r\n,2\r\n");
  });

  it("writes the shortest decimal that reads back as the same double (ECMA-262 Number::toString)", () => {
    const values = Float64Array.of(0.1 + 0.2, 1e21, 5e-7, -0, 123456789012345680000);
    const table = { curves: [{ name: "X", unit: "" }], columns: [values] };
    expect(text(table)).toBe("X\r\n0.30000000000000004\r\n1e+21\r\n5e-7\r\n0\r\n123456789012345680000\r\n");
  });

  it("quotes only fields holding a delimiter, a quote or a line break, doubling the quotes (RFC 4180 §2 rules 6–7)", () => {
    const curves = [
      { name: "plain", unit: "us/ft" },
      { name: 'say "hi"', unit: "" },
      { name: "a,b", unit: "" },
      { name: "two\nlines", unit: "" },
      { name: "semi;colon", unit: "" },
    ];
    const columns = curves.map(() => Float64Array.of(1));
    expect(text({ curves, columns })).toBe('plain[us/ft],"say ""hi""","a,b","two\nlines","semi;colon"\r\n1,1,1,1,1\r\n');
  });

  it("quotes a first header cell starting with # so that a reader does not take the header for a comment", () => {
    const table = { curves: [{ name: "#N", unit: "" }], columns: [Float64Array.of(3)] };
    expect(text(table)).toBe('"#N"\r\n3\r\n');
    expect(parseCsv(text(table)).table.curves[0].mnemonic).toBe("#N");
  });

  it('writes a one-column NaN record as "" so that it is not a blank line', () => {
    const table = { curves: [{ name: "A", unit: "" }], columns: [Float64Array.of(1, NaN, 3)] };
    expect(text(table)).toBe('A\r\n1\r\n""\r\n3\r\n');
  });

  it("yields chunks of about 64 KiB that join into the whole text", () => {
    const rows = 20_000;
    const columns = [
      Float64Array.from({ length: rows }, (_, i) => 1000 + i * 0.1524),
      Float64Array.from({ length: rows }, (_, i) => Math.sin(i)),
    ];
    const curves = [
      { name: "DEPT", unit: "ft" },
      { name: "S", unit: "" },
    ];
    const chunks = [...writeCsv({ curves, columns })];
    expect(chunks.length).toBeGreaterThan(5);
    for (const chunk of chunks.slice(0, -1)) {
      expect(chunk.length).toBeGreaterThanOrEqual(64 * 1024);
      expect(chunk.length).toBeLessThan(64 * 1024 + 100);
      expect(chunk.endsWith("\r\n")).toBe(true);
    }
    expect(parseCsv(chunks.join("")).table.columns[1][rows - 1]).toBe(Math.sin(rows - 1));
  });

  it("refuses columns of different lengths or a column count unlike the curve count", () => {
    const curves = [{ name: "A", unit: "" }, { name: "B", unit: "" }];
    expect(() => text({ curves, columns: [Float64Array.of(1), Float64Array.of(1, 2)] })).toThrow(RangeError);
    expect(() => text({ curves, columns: [Float64Array.of(1)] })).toThrow(RangeError);
  });
});

describe("writeCsv then parseCsv", () => {
  const name = fc.stringMatching(/^[A-Za-z_][A-Za-z0-9_ ,;"\t#]{0,7}[A-Za-z0-9_]$/);
  const unit = fc.constantFrom("", "m", "us/ft", "g/cm3", "GPa");
  const value = fc.oneof(fc.double(), fc.constant(NaN));

  it("gives back every name, unit and double, NaN and ±Infinity included (RFC 4180 round trip)", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(name, { minLength: 1, maxLength: 5, selector: (n) => n.toUpperCase() }),
        fc.integer({ min: 1, max: 30 }),
        fc.array(unit, { minLength: 5, maxLength: 5 }),
        fc.infiniteStream(value),
        (names, rows, units, values) => {
          const curves = names.map((n, i) => ({ name: n, unit: units[i] }));
          const columns = names.map(() => Float64Array.from({ length: rows }, () => values.next().value as number));
          const document = parseCsv(text({ curves, columns }));
          expect(document.delimiter).toBe(",");
          expect(document.table.curves.map(({ mnemonic, unit: u }) => ({ name: mnemonic, unit: u }))).toEqual(curves);
          expect(document.table.columns.map((column) => Array.from(column))).toEqual(
            columns.map((column) => Array.from(column, (v) => (Object.is(v, -0) ? 0 : v))),
          );
        },
      ),
    );
  });
});

describe("writeCsvRecords (batches of a streamed answer)", () => {
  it("writes full-precision doubles and a log's decimals alike as String(value) (ECMA-262 Number::toString), NaN empty, ±Infinity by name", () => {
    const fullDouble = fc.double({ min: -1e12, max: 1e12, noNaN: true });
    const logDecimal = fc.integer({ min: -1e7, max: 1e7 }).map((n) => n / 1e4);
    const value = (kind: fc.Arbitrary<number>) => fc.oneof({ weight: 8, arbitrary: kind }, { weight: 1, arbitrary: fc.constantFrom(NaN, Infinity, -Infinity, -0) });
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }).chain((rows) => fc.tuple(fc.array(value(fullDouble), { minLength: rows, maxLength: rows }), fc.array(value(logDecimal), { minLength: rows, maxLength: rows }))), ([computed, decimals]) => {
        const text = new AsciiText(8);
        writeCsvRecords(text, [Float64Array.from(computed), Float64Array.from(decimals)], [SHORTEST, SHORTEST]);
        const cell = (v: number) => (Number.isNaN(v) ? "" : String(v));
        const expected = computed.map((v, i) => `${cell(v)},${cell(decimals[i])}`);
        expect(Buffer.from(text.take()).toString("latin1")).toBe(expected.map((record) => `${record}\r\n`).join(""));
      }),
      { numRuns: 2000 },
    );
  });
});
