/** Arrow IPC in and out of `POST /v1/elastic`, beside the JSON path on the same data. */
import { Float64, Table, tableFromIPC, tableToIPC, vectorFromArray } from "apache-arrow";
import { request } from "undici";
import { ARROW_STREAM_MEDIA_TYPE } from "../server/arrow-codec.js";
import { settle } from "./processes.js";
import { median, milliseconds, yesOrNo, type Row } from "./report.js";
import type { SyntheticWell } from "./synthetic-well.js";

/** Arrow must be at least this many times faster than JSON (issue 6). */
const SPEED_UP_TARGET = 10;

const arrowBody = (well: SyntheticWell): Uint8Array => {
  const column = (values: Float64Array) => vectorFromArray(Array.from(values, (v) => (Number.isNaN(v) ? null : v)), new Float64());
  return tableToIPC(
    new Table({
      depth: column(well.depthMetres),
      dtc: column(well.dtcMicrosecondsPerFoot),
      dts: column(well.dtsMicrosecondsPerFoot),
      rho: column(well.rhobGramsPerCubicCentimetre),
    }),
    "stream",
  );
};

const sliceOf = (well: SyntheticWell, samples: number): SyntheticWell => ({
  depthMetres: well.depthMetres.subarray(0, samples),
  dtcMicrosecondsPerFoot: well.dtcMicrosecondsPerFoot.subarray(0, samples),
  dtsMicrosecondsPerFoot: well.dtsMicrosecondsPerFoot.subarray(0, samples),
  rhobGramsPerCubicCentimetre: well.rhobGramsPerCubicCentimetre.subarray(0, samples),
});

const postArrow = (base: string, body: Uint8Array) =>
  request(`${base}/v1/elastic`, {
    method: "POST",
    headers: { "content-type": ARROW_STREAM_MEDIA_TYPE, accept: ARROW_STREAM_MEDIA_TYPE },
    body,
  });

/** Rows of an Arrow answer; anything else is an error naming what came back. */
const answeredRows = async (response: Awaited<ReturnType<typeof postArrow>>): Promise<number> => {
  const bytes = new Uint8Array(await response.body.arrayBuffer());
  if (response.statusCode !== 200) throw new Error(`answered ${response.statusCode}: ${new TextDecoder().decode(bytes.subarray(0, 200))}`);
  const type = String(response.headers["content-type"] ?? "");
  if (!type.startsWith(ARROW_STREAM_MEDIA_TYPE)) throw new Error(`answered ${type || "no content type"} instead of ${ARROW_STREAM_MEDIA_TYPE}`);
  return tableFromIPC(bytes).numRows;
};

export const arrowCase = async (base: string, well: SyntheticWell, jsonMedianMs: number | undefined, runs: number): Promise<Row[]> => {
  const samples = well.depthMetres.length;
  const name = `Arrow IPC in and out, POST /v1/elastic, ${samples.toLocaleString("en")} samples (median of ${runs}, after one untimed request)`;
  const target = `≥ ${SPEED_UP_TARGET}× faster than JSON on the same data`;
  const probe = await postArrow(base, arrowBody(sliceOf(well, 3)));
  if (probe.statusCode === 415) {
    await probe.body.dump();
    return [{ case: name, measured: "not wired yet (POST /v1/elastic answers 415 to an Arrow body)", floor: "—", ratio: "—", target, met: "not measured" }];
  }
  if ((await answeredRows(probe)) !== 3) throw new Error("the Arrow answer to 3 samples does not have 3 rows");
  const body = arrowBody(well);
  // One untimed request of the full size first, as the JSON case has its smaller sizes before it: the worker
  // threads' compiler has then seen the Arrow path once.
  await settle(base);
  if ((await answeredRows(await postArrow(base, body))) !== samples) throw new Error("the warm-up answer has the wrong number of rows");
  const times: number[] = [];
  for (let run = 0; run < runs; run++) {
    await settle(base);
    const t0 = performance.now();
    const response = await postArrow(base, body);
    const rows = await answeredRows(response);
    times.push(performance.now() - t0);
    if (rows !== samples) throw new Error(`the answer has ${rows} rows for ${samples} samples`);
  }
  const arrow = median(times);
  return [
    {
      case: name,
      measured: `${milliseconds(arrow)} (${(body.length / 1e6).toFixed(0)} MB request)`,
      floor: jsonMedianMs === undefined ? "JSON case failed" : `${milliseconds(jsonMedianMs)} (JSON POST of the same samples, above)`,
      ratio: jsonMedianMs === undefined ? "—" : `${(jsonMedianMs / arrow).toFixed(1)}× faster`,
      target,
      met: jsonMedianMs === undefined ? "not measured" : yesOrNo(jsonMedianMs / arrow >= SPEED_UP_TARGET),
    },
  ];
};
