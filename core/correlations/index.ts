export * from "./calibration-range.js";
export * from "./option-range.js";
export * from "./physical-domain.js";
export * from "./correlation.js";
export * from "./published-units.js";
export { defineCorrelation, type CorrelationSpec, type ResolvedOptions } from "./define-correlation.js";
export * from "./catalogue.js";
export * from "./describe-correlation.js";
export * from "./fill-gaps.js";
