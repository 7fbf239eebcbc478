/**
 * A name given twice in one object of a JSON body is a 400 problem naming its path, on the event loop and on the
 * worker threads (bodies over 64 KiB), whether the fast reader or the standard parser read the body. RFC 8259,
 * section 4: names within an object SHOULD be unique, and parsers differ on duplicates (JSON.parse keeps the last).
 */
import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/** Rows of a fictional well of our own, repeated to pass the 64 KiB above which a body goes to a worker thread. */
const columnsText = (rows: number) => {
  const of = (values: number[]) => JSON.stringify(Array.from({ length: rows }, (_, i) => values[i % values.length]));
  return `"dtc":${of([95, 88.4, 101.2])},"dts":${of([170, 161.5, 182.9])},"rho":${of([2.4, 2.45, 2.38])}`;
};
const SMALL = columnsText(3);
const LARGE = columnsText(6000);

const post = async (body: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: "/v1/elastic", payload: body, headers: { "content-type": "application/json" } });
};

/** Checks the RFC 9457 problem of a repeated name at `field`, and returns it. */
const expectDuplicateProblem = async (body: string, field: string) => {
  const response = await post(body);
  expect(response.statusCode, body.slice(0, 120)).toBe(400);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/); // RFC 9457, section 3
  const problem = response.json();
  expect(problem.type).toBe("/problems/invalid-request");
  expect(problem.errors).toStrictEqual([{ field, message: expect.stringContaining("is given more than once in one object; send each name once") }]);
  expect(problem.detail).toContain(field.replace(/^body\./, ""));
  return problem;
};

describe("names given twice in a JSON body of POST /v1/elastic (RFC 8259, section 4)", () => {
  for (const [size, columns] of [["a small body", SMALL], ["a body over 64 KiB (worker thread)", LARGE]] as const) {
    it(`refuses a column given twice in ${size}, instead of keeping the last`, async () => {
      expect(columns.length > 64 * 1024).toBe(size !== "a small body");
      const problem = await expectDuplicateProblem(`{${columns},"dtc":[100]}`, "body.dtc");
      expect(problem.errors[0].message).toContain('"dtc"');
    });

    it(`refuses a name given twice in a nested object or in an array's object in ${size}`, async () => {
      await expectDuplicateProblem(`{${columns},"units":{"slowness":"us/m","slowness":"us/ft"}}`, "body.units.slowness");
      await expectDuplicateProblem(`{${columns},"zones":[{"name":"A","top":0,"base":1},{"name":"B","top":1,"\\u0074op":2,"base":3}]}`, "body.zones[1].top");
    });

    it(`refuses a name given twice below nesting too deep for the fast reader (standard parser's path) in ${size}`, async () => {
      const depth = 20_000;
      await expectDuplicateProblem(`{${columns},"x":${"[".repeat(depth)}{"a":1,"a":2}${"]".repeat(depth)}}`, `body.x${"[0]".repeat(7)}…(${depth + 2 - 16} levels)…${"[0]".repeat(7)}.a`);
    });

    it(`still answers ${size} whose names are each given once, the same name in different objects included`, async () => {
      const response = await post(`{${columns},"units":{"slowness":"us/ft"},"limits":{"vp_vs_max":3}}`);
      expect(response.statusCode).toBe(200);
      expect(response.json().E.length).toBe(size === "a small body" ? 3 : 6000);
    });
  }

  it("reports a syntax error before a repeated name (the body is not JSON at all)", async () => {
    const response = await post(`{${SMALL},"dtc":[100]`);
    expect(response.statusCode).toBe(400);
    expect(response.json().type).toBe("/problems/malformed-body");
  });
});
