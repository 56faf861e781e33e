/**
 * Headroom's cell functions: the add-in's public interface (namespace HEADROOM, e.g. =HEADROOM.FRICTION(...)).
 *
 * Each function lives with its topic: ./supply, ./demand, ./piping, ./decision, ./pump, ./units. There, a function's
 * wrapper (its JSDoc is what Excel shows), its argument reading, its named output columns and its spill shape sit
 * together. The metadata generator reads every file of src/functions/ that holds a `@customfunction`
 * (scripts/function-files.mjs gives the list to the build and to the tests); this file is the add-in's entry and
 * the one module the preview host and the tests import. Names and argument orders follow the vocabulary.
 */
import { AREADEMAND_SPILL, GRIDDEMAND_SPILL, HEADSDEMAND_SPILL } from "./demand";
import { PIPERUN_SPILL } from "./piping";
import { PUMPSIZE_SPILL } from "./pump";
import type { SpillShape } from "./shapes";
import { SITETEST_SPILL, SUPPLYCURVE_SPILL } from "./supply";

export * from "./supply";
export * from "./demand";
export * from "./piping";
export * from "./decision";
export * from "./pump";
export * from "./units";

/**
 * The spill shape of every spilling function, keyed by its cell name (the preview host sizes spills from these, and
 * refuses to start when a spilling function in the metadata has none).
 */
export const SPILL_SHAPES: Readonly<Record<string, SpillShape>> = {
  PIPERUN: PIPERUN_SPILL,
  SUPPLYCURVE: SUPPLYCURVE_SPILL,
  AREADEMAND: AREADEMAND_SPILL,
  HEADSDEMAND: HEADSDEMAND_SPILL,
  GRIDDEMAND: GRIDDEMAND_SPILL,
  PUMPSIZE: PUMPSIZE_SPILL,
  SITETEST: SITETEST_SPILL,
};
