/**
 * The sample estimates, described as data: three scenarios of our own invention (invented sites, firms and flow
 * tests), each filled into the estimate template (src/workbook/template.ts) by `npm run samples`
 * (samples/build.ts), which computes every value with the preview engine and writes the .xlsx files beside this one.
 *
 * The numbers are demo inputs, not check values: they were chosen so that each workbook tells its own story.
 */
import type { Scenario } from "../src/workbook/scenario";

export interface SampleSpec {
  /** file name in samples/ */
  file: string;
  /** the title the preview's sample picker shows */
  title: string;
  /** one line for samples/README.md */
  story: string;
  scenario: Scenario;
}

/** A light-hazard office building on a strong street main: the supply suffices with room to spare. */
const office: Scenario = {
  units: "US",
  values: "sample",
  site: "Quill Street offices, three storeys (sample)",
  address: "40 Quill Street, Sampleford",
  preparedBy: "Placeholder Fire Engineering (sample)",
  flowTests: [
    {
      when: "2026-04-08 09:15, hydrant H-12 at Quill Street and Fourth Avenue (sample)",
      static: 82,
      residual: 71,
      flow: null,
      pitot: 18,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: 0,
    },
    {
      when: "2026-04-08 10:05, hydrant H-15 on Quill Street, further along the main (sample)",
      static: 80,
      residual: 66,
      flow: 1050,
      pitot: null,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: 3,
    },
  ],
  derate: 0,
  hazard: "LH",
  designArea: null,
  sprinkler: { kFactor: 5.6, coverage: 196, spacing: 14, minPressure: 7 },
  branch: { nominal: "1-1/2", schedule: "40" },
  crossMain: { nominal: 3, schedule: "40" },
  material: "steel",
  system: "wet",
  design: { kind: "area" },
  areaFittings: "T",
  velocityLimit: 20,
  insideHose: null,
  hydrantsDownstream: false,
  run: [
    { label: "Cross main to the riser, third floor", nominal: 3, schedule: "40", material: "steel", fittings: "2E T", length: 48, rise: 0, fixedLoss: 0, insideHose: false },
    { label: "Riser down to the ground floor", nominal: 4, schedule: "40", material: "steel", fittings: "E T GV", length: 30, rise: 26, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer and alarm valve", nominal: 4, schedule: "40", material: "steel", fittings: "2GV CV", length: 6, rise: 0, fixedLoss: 7, insideHose: true },
    { label: "Underground to the street main", nominal: 6, schedule: "DR14", material: "plastic", fittings: "E GV", length: 140, rise: 5, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 10,
  pump: null,
  suctionMinimum: 20,
  duration: null,
};

/** An ordinary hazard group 2 light-manufacturing building at the end of a long, weak main: it needs a pump. */
const manufacturing: Scenario = {
  units: "US",
  values: "sample",
  site: "Unit 4, Tinker Row light manufacturing (sample)",
  address: "4 Tinker Row, Exampleton Industrial Estate",
  preparedBy: "Sample Sprinkler Design Ltd. (sample)",
  flowTests: [
    {
      when: "2026-02-19 14:40, hydrant at the end of Tinker Row, dead-end main (sample)",
      static: 90,
      residual: 75,
      flow: 920,
      pitot: null,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: -4,
    },
  ],
  derate: 0,
  hazard: "OH2",
  designArea: null,
  sprinkler: { kFactor: 5.6, coverage: 130, spacing: 12, minPressure: 7 },
  branch: { nominal: "1-1/4", schedule: "40" },
  crossMain: { nominal: "2-1/2", schedule: "40" },
  material: "steel",
  system: "wet",
  design: { kind: "area" },
  areaFittings: "T",
  velocityLimit: 20,
  insideHose: null,
  hydrantsDownstream: false,
  run: [
    { label: "Cross main to the riser", nominal: "2-1/2", schedule: "40", material: "steel", fittings: "2E T", length: 90, rise: 0, fixedLoss: 0, insideHose: false },
    { label: "Riser with its valves", nominal: 4, schedule: "40", material: "steel", fittings: "E GV CV", length: 22, rise: 18, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer", nominal: 4, schedule: "40", material: "steel", fittings: "2GV", length: 5, rise: 0, fixedLoss: 8, insideHose: true },
    { label: "Underground to the street main", nominal: 6, schedule: "DR14", material: "plastic", fittings: "2E GV", length: 260, rise: 3, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 10,
  pump: null,
  suctionMinimum: 20,
  duration: null,
};

/** A workshop and store worked in SI units (bar, L/min, mm, DN sizes). */
const workshopSI: Scenario = {
  units: "SI",
  values: "sample",
  site: "Kiln Lane workshop and store (sample)",
  address: "9 Kiln Lane, Sampleburgh",
  preparedBy: "Example Fire Consultants (sample)",
  flowTests: [
    {
      when: "2026-05-06 11:00, hydrant at the Kiln Lane junction (sample)",
      static: 6.4,
      residual: 5.3,
      flow: null,
      pitot: 1.1,
      outletDiameter: 63.5,
      outletCoefficient: 0.9,
      rise: 0,
    },
  ],
  derate: 0,
  hazard: "OH1",
  designArea: null,
  sprinkler: { kFactor: 80, coverage: 12, spacing: 3.5, minPressure: 0.5 },
  branch: { nominal: 32, schedule: "40" },
  crossMain: { nominal: 65, schedule: "40" },
  material: "steel",
  system: "wet",
  design: { kind: "area" },
  areaFittings: "T",
  velocityLimit: 6,
  insideHose: null,
  hydrantsDownstream: false,
  run: [
    { label: "Cross main to the riser", nominal: 65, schedule: "40", material: "steel", fittings: "2E T", length: 18, rise: 0, fixedLoss: 0, insideHose: false },
    { label: "Riser with its valves", nominal: 100, schedule: "40", material: "steel", fittings: "E GV CV", length: 7, rise: 6, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer", nominal: 100, schedule: "40", material: "steel", fittings: "2GV", length: 1.5, rise: 0, fixedLoss: 0.5, insideHose: true },
    { label: "Underground to the street main", nominal: 150, schedule: "DR14", material: "plastic", fittings: "E GV", length: 45, rise: 1, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 0.7,
  pump: null,
  suctionMinimum: 1.4,
  duration: null,
};

/**
 * A parking deck over shops, its sprinklers on a dry-pipe system (the deck is open to frost): ordinary hazard group 1,
 * galvanized pipe, and the design area flowed 30 % larger (ADJUSTAREA) at the density read at the unadjusted area.
 */
const parkingDry: Scenario = {
  units: "US",
  values: "sample",
  site: "Linden Yard parking deck over shops (sample)",
  address: "2 Linden Yard, Exampleford",
  preparedBy: "Sample Sprinkler Design Ltd. (sample)",
  flowTests: [
    {
      when: "2026-01-27 13:20, hydrant at Linden Yard and Mill Road (sample)",
      static: 76,
      residual: 60,
      flow: 1150,
      pitot: null,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: 0,
    },
  ],
  derate: 0,
  hazard: "OH1",
  designArea: null,
  sprinkler: { kFactor: 5.6, coverage: 130, spacing: 12, minPressure: 7 },
  branch: { nominal: "1-1/4", schedule: "40" },
  crossMain: { nominal: 3, schedule: "40" },
  material: "galvanized",
  system: "dry",
  design: { kind: "area" },
  areaFittings: "T",
  velocityLimit: 20,
  insideHose: null,
  hydrantsDownstream: false,
  run: [
    { label: "Cross main to the dry-pipe valve", nominal: 3, schedule: "40", material: "galvanized", fittings: "2E T", length: 70, rise: 0, fixedLoss: 0, insideHose: false },
    { label: "Riser and dry-pipe valve", nominal: 4, schedule: "40", material: "galvanized", fittings: "E GV CV", length: 24, rise: 20, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer", nominal: 4, schedule: "40", material: "steel", fittings: "2GV", length: 5, rise: 0, fixedLoss: 7, insideHose: true },
    { label: "Underground to the street main", nominal: 6, schedule: "DR14", material: "plastic", fittings: "E GV", length: 150, rise: 3, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 10,
  pump: null,
  suctionMinimum: 20,
  duration: null,
};

/**
 * A distribution centre with rack storage under the roof, designed by number of sprinklers: 12 early-suppression
 * sprinklers, four on each of three lines, at the pressure the (invented) listing gives; hose and duration typed from
 * the storage chapter.
 */
const storage: Scenario = {
  units: "US",
  values: "sample",
  site: "Harrow Row distribution centre, rack storage (sample)",
  address: "11 Harrow Row, Sampleton Park",
  preparedBy: "Example Fire Consultants (sample)",
  flowTests: [
    {
      when: "2026-06-02 08:45, hydrant at the Harrow Row entrance (sample)",
      static: 92,
      residual: 70,
      flow: 1900,
      pitot: null,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: 0,
    },
  ],
  derate: 0,
  hazard: "",
  designArea: null,
  sprinkler: { kFactor: 16.8, coverage: 100, spacing: 10, minPressure: 52 },
  branch: { nominal: 3, schedule: "10" },
  crossMain: { nominal: 6, schedule: "10" },
  material: "steel",
  system: "wet",
  design: {
    kind: "heads",
    storage: "rack storage of cartoned goods to 25 ft under a 30 ft roof (sample)",
    heads: 12,
    headsPerLine: 4,
    lineSpacing: 10,
    hose: 250,
    duration: 60,
  },
  areaFittings: "T",
  velocityLimit: 20,
  insideHose: 100,
  hydrantsDownstream: false,
  run: [
    { label: "Cross main to the riser", nominal: 6, schedule: "10", material: "steel", fittings: "2E T", length: 120, rise: 0, fixedLoss: 0, insideHose: false },
    { label: "Riser with its valves", nominal: 6, schedule: "10", material: "steel", fittings: "E GV CV", length: 32, rise: 30, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer", nominal: 6, schedule: "40", material: "steel", fittings: "2GV", length: 5, rise: 0, fixedLoss: 8, insideHose: true },
    { label: "Underground to the street main", nominal: 8, schedule: "DR14", material: "plastic", fittings: "E GV", length: 220, rise: 4, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 10,
  pump: null,
  suctionMinimum: 20,
  duration: null,
  areaName: "Rack storage hall",
  // the building's other areas, as their own (invented) estimates give them: demand at the supply with hose
  candidates: [
    { name: "Office block, light hazard", flow: 400, pressure: 58, pumpFlow: null },
    { name: "Dock canopy, dry pipe", flow: 900, pressure: 84, pumpFlow: 750 },
  ],
};

/**
 * A large single-storey assembly hall on a gridded system: both ends of every branch line tied into a cross main, the
 * riser at a corner. Solved as a grid (GRIDDEMAND) its demand sits inside the supply, with less than the required margin
 * (Marginal); the same area as a tree, which the sheet shows beside it, would need a pump.
 */
const assemblyGrid: Scenario = {
  units: "US",
  values: "sample",
  site: "Fallow Road assembly hall, single storey (sample)",
  address: "2 Fallow Road, Sampleford",
  preparedBy: "Sample Hydraulics Office (sample)",
  flowTests: [
    {
      when: "2026-09-08 09:15, hydrant on Fallow Road opposite the gate (sample)",
      static: 66,
      residual: 50,
      flow: 1050,
      pitot: null,
      outletDiameter: 2.5,
      outletCoefficient: 0.9,
      rise: 0,
    },
  ],
  derate: 0,
  hazard: "OH2",
  designArea: null,
  sprinkler: { kFactor: 5.6, coverage: 120, spacing: 12, minPressure: 7 },
  branch: { nominal: 1.25, schedule: "40" },
  crossMain: { nominal: 4, schedule: "40" },
  material: "steel",
  system: "wet",
  design: { kind: "grid", lines: 14, lineLength: 120, feedLine: 1 },
  areaFittings: "T",
  velocityLimit: 20,
  insideHose: null,
  hydrantsDownstream: false,
  run: [
    { label: "Riser with its valves", nominal: 4, schedule: "40", material: "steel", fittings: "E GV CV", length: 30, rise: 26, fixedLoss: 0, insideHose: true },
    { label: "Backflow preventer", nominal: 4, schedule: "40", material: "steel", fittings: "2GV", length: 5, rise: 0, fixedLoss: 8, insideHose: true },
    { label: "Underground to the street main", nominal: 6, schedule: "DR14", material: "plastic", fittings: "E GV", length: 160, rise: 3, fixedLoss: 0, insideHose: true },
  ],
  requiredMargin: 10,
  pump: null,
  suctionMinimum: 20,
  duration: null,
  areaName: "Assembly hall, gridded",
};

/** In the order the preview offers them; the first opens by default. */
export const SAMPLES: SampleSpec[] = [
  {
    file: "tinker-row-manufacturing-pump-needed.xlsx",
    title: "Light manufacturing, ordinary hazard 2: pump needed (US)",
    story:
      "An ordinary hazard group 2 light-manufacturing unit at the end of a long dead-end main, its site 4 ft below the test hydrant's gauge; the supply falls short, PUMPSIZE suggests the pump for the flow through it and PUMPSUCTION shows the main can feed it.",
    scenario: manufacturing,
  },
  {
    file: "quill-street-office-supply-suffices.xlsx",
    title: "Office building, light hazard: no pump needed (US)",
    story:
      "A light-hazard office building on a strong street main with two flow tests, the weaker governing; the supply meets the demand with the required margin to spare.",
    scenario: office,
  },
  {
    file: "linden-yard-parking-dry-system.xlsx",
    title: "Parking deck, dry-pipe system, ordinary hazard 1 (US)",
    story:
      "An ordinary hazard group 1 parking deck on a dry-pipe system of galvanized pipe: C 100 and the design area flowed 30 % larger (ADJUSTAREA), at the density read at the unadjusted area.",
    scenario: parkingDry,
  },
  {
    file: "harrow-row-rack-storage-by-sprinklers.xlsx",
    title: "Rack storage, 12 early-suppression sprinklers (US)",
    story:
      "A distribution centre with rack storage, designed by number of sprinklers (HEADSDEMAND: 12 sprinklers, four on each of three lines) with the storage chapter's hose allowance and duration typed in; the office block and the dry dock canopy are compared beside it, and the rack storage controls.",
    scenario: storage,
  },
  {
    file: "fallow-road-assembly-hall-gridded.xlsx",
    title: "Assembly hall on a gridded system: marginal as a grid, a pump as a tree (US)",
    story:
      "A large single-storey ordinary hazard group 2 assembly hall whose branch lines are tied at both ends into cross mains; GRIDDEMAND solves the grid as a network and places the design area where it needs the most, and the sheet shows the same area as a tree beside it: the tree would need a pump, the grid is marginal (no pump, if the owner accepts the smaller margin or a pipe is upsized).",
    scenario: assemblyGrid,
  },
  {
    file: "kiln-lane-workshop-si-units.xlsx",
    title: "Workshop and store, ordinary hazard 1: marginal (SI)",
    story:
      "An ordinary hazard group 1 workshop worked in SI units (bar, L/min, mm, DN sizes); the supply covers the demand but with less than the required margin: the verdict reads Marginal.",
    scenario: workshopSI,
  },
];
