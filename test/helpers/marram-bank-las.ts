/**
 * A small LAS 2.0 file of our own fictional well Marram Bank 7 (DEPT, DTC, DTS, RHOB; NULL -999.25): header on
 * lines 1–14, `~A` on line 15, the rows given from line 16.
 */
export const marramBankLas = (range: { start: string; stop: string; step: string }, ...rows: string[]): string =>
  [
    "~Version",
    "VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
    "WRAP. NO : ONE LINE PER DEPTH STEP",
    "~Well",
    `STRT.M ${range.start} : START DEPTH`,
    `STOP.M ${range.stop} : STOP DEPTH`,
    `STEP.M ${range.step} : STEP`,
    "NULL. -999.25 : NULL VALUE",
    "WELL. MARRAM BANK 7 : WELL",
    "~Curve",
    "DEPT.M : DEPTH",
    "DTC.US/F : COMPRESSIONAL SLOWNESS",
    "DTS.US/F : SHEAR SLOWNESS",
    "RHOB.G/C3 : BULK DENSITY",
    "~A",
    ...rows,
    "",
  ].join("\n");
