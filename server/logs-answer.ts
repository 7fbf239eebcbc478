import { emptyZoneNotes, type DerivedColumn, type Zone } from "../core/index.js";
import { answerExtras, columnsAnswer, type UnitsChosen } from "./elastic-answer.js";
import { ProblemError } from "./problems.js";
import type { WellConversion } from "./well-conversion.js";

/** The depth column that places zones, or a 400 problem when zones were asked for a well without depth. */
const depthForZones = (conversion: WellConversion): Float64Array => {
  if (conversion.depth === undefined) {
    throw new ProblemError("unusable-file", "Zones were given but no depth curve was found; name it with depth_curve.");
  }
  return conversion.depth;
};

const nullable = (value: string | undefined): string | null => (value === undefined || value === "" ? null : value);

/** The JSON answer of `POST /v1/logs`: the columns of `/v1/elastic` plus how the file was read. */
export const logsAnswer = (conversion: WellConversion, zones: readonly Zone[] | undefined, derived: Map<string, DerivedColumn> | undefined) => {
  const { file, request, curves } = conversion;
  const slowness = [curves.vp, curves.vs].find((choice) => choice?.measure === "slowness");
  const units: UnitsChosen & { depth: WellConversion["depthUnit"] } = {
    velocity: request.velocityUnit,
    slowness: (slowness?.unit as UnitsChosen["slowness"] | undefined) ?? "us/ft",
    density: request.density.unit,
    modulus: request.modulusUnit,
    impedance: request.impedanceUnit,
    depth: conversion.depthUnit,
  };
  const well = file.format === "las" ? file.las.well : undefined;
  const depth = zones && depthForZones(conversion);
  const extras = answerExtras(conversion.log, request, zones, depth, derived);
  const zoneNotes = depth && extras.zones ? emptyZoneNotes(depth, extras.zones, conversion.depthUnit).map((message) => ({ message })) : [];
  return {
    ...columnsAnswer(conversion.log, request, units, { depth: conversion.depth }),
    input_format: file.format,
    well: {
      name: nullable(well?.wellName),
      company: nullable(well?.company),
      field: nullable(well?.field),
      location: nullable(well?.location),
      date: nullable(well?.date),
      unique_well_id: nullable(well?.uniqueWellId),
      las_version: file.format === "las" ? file.las.version : null,
      wrapped: file.format === "las" ? file.las.wrapped : null,
      null_value: conversion.nullValue,
    },
    curves: curves as Required<Pick<typeof curves, "vp">> & Omit<typeof curves, "vp">,
    input_curves: file.table.curves.map(({ mnemonic, unit, description }) => ({ mnemonic, unit, description })),
    warnings: [...conversion.warnings, ...zoneNotes],
    ...extras,
  };
};
