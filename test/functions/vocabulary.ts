/**
 * The cell functions Headroom registers, by their cell names (upper case), as ../shared/spec/functions.md names them.
 * test/functions/metadata.test.ts checks that the metadata generator finds exactly these in the cell-function files,
 * each with a description and a description for every parameter. Add a function's name here when you add the
 * function.
 */
export const VOCABULARY: string[] = [
  // Water supply
  "SUPPLYAT",
  "FLOWAT",
  "PITOTFLOW",
  "SITETEST",
  // Demand
  "HEADFLOW",
  "HEADPRESSURE",
  "HEADCOUNT",
  "HEADSPERLINE",
  // Piping
  "FRICTION",
  "FRICTIONRATE",
  "VELOCITY",
  "ELEVATION",
  // Decision
  "MARGIN",
  "VERDICT",
  "PUMPBOOST",
  // Units
  "UNIT",
  // Trade tables
  "PIPEID",
  "CFACTOR",
  "FITTINGLENGTH",
  "FITTINGS",
  "DESIGNDENSITY",
  "DESIGNAREA",
  "ADJUSTAREA",
  "HOSEALLOWANCE",
  "DURATION",
  // Range functions and solvers
  "PIPERUN",
  "SUPPLYCURVE",
  "AREADEMAND",
  "HEADSDEMAND",
  "GRIDDEMAND",
  "SIZEFOR",
  "PUMPSIZE",
  "PUMPCURVE",
  "PUMPSUCTION",
];
