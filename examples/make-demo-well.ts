/**
 * Writes the demonstration well Kestrel Flats 3 — a fictional onshore well of our own — as
 * examples/demo-well.las, examples/demo-well.csv and examples/zones.json.
 * Deterministic: the same seed gives the same files. Run with `npx tsx examples/make-demo-well.ts`.
 */
import { writeFileSync } from "node:fs";
import { formatLasNumber, writeLas, type LasCurveToWrite, type LasNumberFormat } from "../core/las/index.js";

const SEED = 20260112;
const SAMPLES = 3000;
const TOP_METRES = 1450;
/** Half a foot in metres, the usual wireline sampling interval. */
const STEP_METRES = 0.1524;
const NULL_VALUE = -999.25;

/** mulberry32 (Tommy Ettinger, public domain): a small 32-bit generator, ample for demo noise. */
const mulberry32 = (seed: number) => () => {
  seed = (seed + 0x6d2b79f5) | 0;
  let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
  t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
};
const random = mulberry32(SEED);
const uniform = (low: number, high: number) => low + (high - low) * random();
/** Box–Muller transform: a standard normal deviate from two uniform ones. */
const gaussian = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());

type Lithology = "shale" | "sand" | "limestone";

/** Mean and spread of each curve per lithology (common practice ranges for brine-filled rocks at these depths). */
const ROCK: Record<Lithology, { dtc: [number, number]; vpVs: [number, number]; rhob: [number, number]; gr: [number, number] }> = {
  shale: { dtc: [100, 3.5], vpVs: [1.95, 0.04], rhob: [2.52, 0.025], gr: [112, 9] },
  sand: { dtc: [85, 3.5], vpVs: [1.71, 0.03], rhob: [2.3, 0.035], gr: [38, 6] },
  limestone: { dtc: [55, 1.6], vpVs: [1.86, 0.03], rhob: [2.655, 0.02], gr: [22, 4] },
};
/** Ranges each lithology's curves stay within (outside the washout and the mispicked shear). */
const LIMITS: Record<Lithology, { dtc: number[]; dts: number[]; rhob: number[] }> = {
  shale: { dtc: [90, 110], dts: [170, 220], rhob: [2.45, 2.6] },
  sand: { dtc: [75, 95], dts: [130, 160], rhob: [2.2, 2.4] },
  limestone: { dtc: [50, 60], dts: [95, 110], rhob: [2.6, 2.71] },
};

const bottomMetres = Number((TOP_METRES + (SAMPLES - 1) * STEP_METRES).toFixed(4));
const ZONES: { name: string; top: number; base: number; lithology: Lithology }[] = [
  { name: "Brackwater Shale", top: TOP_METRES, base: 1522.4, lithology: "shale" },
  { name: "Linnet Sand", top: 1522.4, base: 1561.8, lithology: "sand" },
  { name: "Sorrel Shale", top: 1561.8, base: 1640.3, lithology: "shale" },
  { name: "Tarnbeck Limestone", top: 1640.3, base: 1702.9, lithology: "limestone" },
  { name: "Wrenfold Sand", top: 1702.9, base: 1771.6, lithology: "sand" },
  { name: "Ashcombe Shale", top: 1771.6, base: 1834.0, lithology: "shale" },
  { name: "Greyling Limestone", top: 1834.0, base: bottomMetres, lithology: "limestone" },
];
/** Thin beds inside the formations, so that the logs are not blocky. */
const THIN_BEDS: { top: number; base: number; lithology: Lithology }[] = [
  { top: 1540.0, base: 1541.6, lithology: "shale" },
  { top: 1615.0, base: 1617.4, lithology: "sand" },
  { top: 1752.2, base: 1753.3, lithology: "shale" },
  { top: 1801.5, base: 1803.0, lithology: "limestone" },
];
const WASHOUT = { top: 1598.0, base: 1606.5 };
const MISPICKED_SHEAR = { top: 1735.0, base: 1742.0 };
const SHEAR_LOGGED_FROM = 1461.0;
const DENSITY_GAP = { top: 1680.0, base: 1681.5 };

const depth = Float64Array.from({ length: SAMPLES }, (_, i) => Number((TOP_METRES + i * STEP_METRES).toFixed(4)));
const inside = (z: number, interval: { top: number; base: number }) => z >= interval.top && z < interval.base;
const lithologyAt = (z: number): Lithology =>
  THIN_BEDS.find((bed) => inside(z, bed))?.lithology ?? ZONES.find((zone) => z >= zone.top && z <= zone.base)!.lithology;

/** Correlated noise (AR(1), unit variance), as logs vary smoothly over a few samples. */
const correlatedNoise = (correlation: number): Float64Array => {
  const noise = new Float64Array(SAMPLES);
  let previous = gaussian();
  for (let i = 0; i < SAMPLES; i++) {
    previous = correlation * previous + Math.sqrt(1 - correlation * correlation) * gaussian();
    noise[i] = previous;
  }
  return noise;
};

/** A per-sample mean smoothed over about a metre, as a tool reads across a bed boundary. */
const smoothed = (pick: (lithology: Lithology) => number): Float64Array => {
  const raw = Array.from(depth, (z) => pick(lithologyAt(z)));
  const half = 3;
  return Float64Array.from(raw, (_, i) => {
    const window = raw.slice(Math.max(0, i - half), i + half + 1);
    return window.reduce((sum, value) => sum + value, 0) / window.length;
  });
};
/** Squeezes a value smoothly into (low, high), leaving values near the middle almost unchanged. */
const withinRange = (value: number, [low, high]: number[]) => {
  const middle = (low + high) / 2;
  const half = (high - low) / 2;
  return middle + half * Math.tanh((value - middle) / half);
};

const dtcNoise = correlatedNoise(0.8);
const ratioNoise = correlatedNoise(0.7);
const rhobNoise = correlatedNoise(0.75);
const grNoise = correlatedNoise(0.85);
const meanDtc = smoothed((rock) => ROCK[rock].dtc[0]);
const meanVpVs = smoothed((rock) => ROCK[rock].vpVs[0]);
const meanRhob = smoothed((rock) => ROCK[rock].rhob[0]);
const meanGr = smoothed((rock) => ROCK[rock].gr[0]);

const dtc = new Float64Array(SAMPLES);
const dts = new Float64Array(SAMPLES);
const rhob = new Float64Array(SAMPLES);
const gr = new Float64Array(SAMPLES);
for (let i = 0; i < SAMPLES; i++) {
  const rock = lithologyAt(depth[i]);
  const { dtc: dtcSpread, vpVs, rhob: rhobSpread, gr: grSpread } = ROCK[rock];
  dtc[i] = withinRange(meanDtc[i] + dtcSpread[1] * dtcNoise[i], LIMITS[rock].dtc);
  dts[i] = withinRange(dtc[i] * (meanVpVs[i] + vpVs[1] * ratioNoise[i]), LIMITS[rock].dts);
  // Slower rock is lighter: density follows the sonic a little.
  rhob[i] = withinRange(meanRhob[i] + rhobSpread[1] * rhobNoise[i] - 0.002 * (dtc[i] - meanDtc[i]), LIMITS[rock].rhob);
  gr[i] = Math.max(5, meanGr[i] + grSpread[1] * grNoise[i]);
}

for (let i = 0; i < SAMPLES; i++) {
  const z = depth[i];
  if (inside(z, WASHOUT)) {
    rhob[i] -= uniform(0.3, 0.55);
    dtc[i] += uniform(20, 35);
    dts[i] += uniform(10, 25);
  }
  if (inside(z, MISPICKED_SHEAR)) dts[i] = dtc[i] * uniform(1.18, 1.38);
  if (z < SHEAR_LOGGED_FROM) dts[i] = NaN;
  if (inside(z, DENSITY_GAP)) rhob[i] = NaN;
}
for (let k = 0; k < 14; k++) dts[Math.floor(uniform(100, SAMPLES))] = NaN;
for (let k = 0; k < 10; k++) rhob[Math.floor(uniform(0, SAMPLES))] = NaN;
const mispicked = Array.from(depth.keys()).filter((i) => inside(depth[i], MISPICKED_SHEAR) && !Number.isNaN(dts[i]));
for (let k = 0; k < 6; k++) {
  const [i] = mispicked.splice(Math.floor(random() * mispicked.length), 1);
  dts[i] = dtc[i] * uniform(0.86, 0.97);
}

const curve = (mnemonic: string, unit: string, description: string, values: Float64Array, decimals: number): LasCurveToWrite => ({
  mnemonic,
  unit,
  description,
  values,
  format: { kind: "decimals", decimals },
});
const curves = [
  curve("DEPT", "M", "MEASURED DEPTH", depth, 4),
  curve("DTC", "US/F", "COMPRESSIONAL SLOWNESS", dtc, 2),
  curve("DTS", "US/F", "SHEAR SLOWNESS", dts, 2),
  curve("RHOB", "G/C3", "BULK DENSITY", rhob, 3),
  curve("GR", "GAPI", "GAMMA RAY", gr, 2),
];

const interval = ({ top, base }: { top: number; base: number }) => `${top.toFixed(1)} to ${base.toFixed(1)} m`;
const las = writeLas({
  curves,
  nullValue: NULL_VALUE,
  wellItems: [
    { mnemonic: "COMP", value: "HALYARD RIDGE PETROLEUM (FICTIONAL)" },
    { mnemonic: "WELL", value: "KESTREL FLATS 3" },
    { mnemonic: "FLD", value: "KESTREL FLATS" },
    { mnemonic: "LOC", value: "LOT 14 RANGE 9 (FICTIONAL)" },
    { mnemonic: "SRVC", value: "COBBLESTONE WIRELINE (FICTIONAL)" },
    { mnemonic: "DATE", value: "2026-01-12" },
    { mnemonic: "UWI", value: "KF-0003-DEMO" },
  ],
  parameters: [
    { mnemonic: "EKB", unit: "M", value: "312.40", description: "ELEVATION KELLY BUSHING" },
    { mnemonic: "BS", unit: "MM", value: "215.9", description: "BIT SIZE" },
    { mnemonic: "MUD", value: "WATER BASED", description: "MUD TYPE" },
    ...ZONES.map((zone, z) => ({
      mnemonic: `TOP${z + 1}`,
      unit: "M",
      value: zone.top.toFixed(2),
      description: `TOP OF ${zone.name.toUpperCase()}`,
    })),
  ],
  otherLines: [
    "Demonstration well of our own: every name and number here is fictional.",
    `Generated by examples/make-demo-well.ts with seed ${SEED}.`,
    `Washout (low RHOB, high DTC): ${interval(WASHOUT)}.`,
    `Shear mispicked (Vp/Vs below sqrt(2), a few samples with DTS < DTC): ${interval(MISPICKED_SHEAR)}.`,
    `DTS absent above ${SHEAR_LOGGED_FROM.toFixed(1)} m; RHOB absent ${interval(DENSITY_GAP)}; scattered nulls in both.`,
  ],
});
writeFileSync(new URL("./demo-well.las", import.meta.url), [...las].join(""));

const CSV_HEADER = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3],GR[gAPI]";
const cell = (value: number, format: LasNumberFormat | undefined) =>
  Number.isFinite(value) ? formatLasNumber(value, format ?? { kind: "shortest" }) : "";
const rows = Array.from(depth, (_, i) => curves.map((c) => cell(c.values[i], c.format)).join(","));
writeFileSync(new URL("./demo-well.csv", import.meta.url), [CSV_HEADER, ...rows].join("\r\n") + "\r\n");

const zones = ZONES.map(({ name, top, base }) => ({ name, top, base }));
writeFileSync(new URL("./zones.json", import.meta.url), JSON.stringify(zones, null, 2) + "\n");
