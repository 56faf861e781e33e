/**
 * What an estimate sheet is filled with: the scenario (site, flow test, hazard, sprinklers, the pipe run, the margin
 * and an optional pump) and the demo scenarios every new estimate sheet starts from. The template (./template.ts)
 * lays a scenario out as cells; the samples (samples/scenarios.ts) are scenarios too.
 */
import { MIN_SUCTION_PRESSURE_PSI } from "../engine/pump";
import { DEFAULT_VELOCITY_LIMIT } from "../engine/run";
import type { UnitSystem } from "../engine/units";

/** One segment of the run from the design area back to the supply, in the scenario's units. */
export interface RunSegmentInput {
  label: string;
  /** nominal size: inches (2, "2-1/2") in US work, DN in SI work */
  nominal: number | string;
  /** "40", "10", "CPVC", "K", "L", "M", "DR14", "DR18" */
  schedule: string;
  /** CFACTOR material code, e.g. "steel", "plastic" */
  material: string;
  /** fittings and valves, e.g. "2E T GV"; "" for none */
  fittings: string;
  /** ft or m */
  length: number;
  /** height the water climbs through the segment on its way to the sprinklers, ft or m (negative for a drop) */
  rise: number;
  /** a fixed loss in the segment (backflow preventer, meter), psi or bar */
  fixedLoss: number;
  /** true where the segment carries the inside hose too (from where the hose stations connect: the riser and upstream) */
  insideHose: boolean;
}

/**
 * How the design area's demand is found: by the density/area method over a tree of branch lines (AREADEMAND, the
 * hazard's curve) or over a grid (GRIDDEMAND: the area placed where it demands most), or by a number of sprinklers at a minimum pressure (HEADSDEMAND: storage, high-K and
 * early-suppression sprinklers), whose hose allowance and duration are inputs of their own.
 */
export type DemandDesign =
  | { kind: "area" }
  | {
      /** the density/area method over a gridded system: both ends of every branch line tied into a cross main (GRIDDEMAND) */
      kind: "grid";
      /** branch lines in the grid */
      lines: number;
      /** length of each branch line between the two cross mains, ft or m */
      lineLength: number;
      /** the line (1 … lines) where the riser feeds the near cross main */
      feedLine: number;
    }
  | {
      kind: "heads";
      /** what is stored and how, in words, e.g. "rack storage of cartoned goods to 20 ft" (text) */
      storage: string;
      /** sprinklers flowing */
      heads: number;
      /** sprinklers on each full branch line */
      headsPerLine: number;
      /** between branch lines, ft or m */
      lineSpacing: number;
      /** hose stream allowance, inside + outside, gpm or L/min */
      hose: number;
      /** minutes */
      duration: number;
    };

/**
 * Another candidate design area of the building (an office floor beside a warehouse, a dry loading dock), typed in
 * the sheet's table of candidates from its own estimate: its demand at the supply, in the scenario's units.
 */
export interface CandidateInput {
  name: string;
  /** demand flow at the supply, sprinklers + hose, gpm or L/min */
  flow: number;
  /** pressure it needs at the supply, psi or bar */
  pressure: number;
  /** flow that passes through a pump, gpm or L/min; null for its demand flow */
  pumpFlow: number | null;
}

/** One hydrant flow test, in the scenario's units. */
export interface FlowTestInput {
  /** when and where the test was made (text) */
  when: string;
  /** psi or bar */
  static: number;
  /** psi or bar */
  residual: number;
  /** flow measured directly, gpm or L/min; null to use the pitot reading */
  flow: number | null;
  /** pitot pressure, psi or bar; null when the flow was measured directly */
  pitot: number | null;
  /** hydrant outlet internal diameter, in or mm */
  outletDiameter: number;
  /** outlet coefficient: 0.90 smooth rounded, 0.80 square and sharp, 0.70 projecting [NFPA 291] */
  outletCoefficient: number;
  /**
   * height of the point where the run meets the main (where the demand is computed) above the test gauge, ft or m;
   * negative when it lies lower
   */
  rise: number;
}

/** Everything an estimate sheet is filled with. All numbers are in `units`. */
export interface Scenario {
  units: UnitSystem;
  /**
   * whose values the inputs hold: a new estimate sheet's demo values, for the user to overwrite (the default), or a
   * sample's own; the note under the caution says which
   */
  values?: "demo" | "sample";
  site: string;
  address: string;
  preparedBy: string;
  /**
   * One to three hydrant flow tests; the sheet uses the one that gives the lowest supply pressure at the demand flow,
   * each carried to the site first (SITETEST).
   */
  flowTests: FlowTestInput[];
  /**
   * Fraction by which every gauge reading is reduced for seasonal and future loss, 0 ≤ derate < 1 (common practice:
   * 0.1 is typical; 0 takes the tests as read)
   */
  derate: number;
  /** LH, OH1, OH2, EH1, EH2 */
  hazard: string;
  /** a chosen design area (ft² or m²), or null for the smallest on the hazard's curve */
  designArea: number | null;
  sprinkler: {
    /** gpm/psi^0.5 or L/min/bar^0.5 */
    kFactor: number;
    /** ft² or m² per sprinkler */
    coverage: number;
    /** along a branch line, ft or m */
    spacing: number;
    /** psi or bar */
    minPressure: number;
  };
  branch: { nominal: number | string; schedule: string };
  crossMain: { nominal: number | string; schedule: string };
  /** CFACTOR material of the design area's pipes */
  material: string;
  /** "wet", "dry", "preaction" (single interlock) or "double interlock": the C factor and the design area both read it */
  system: string;
  /** the density/area method (the default), or a number of sprinklers */
  design: DemandDesign;
  /** fittings inside the design area not in the branch-line walk, at the branch-line size, e.g. "T" (FITTINGS list) */
  areaFittings: string;
  /** ft/s or m/s: a run segment faster than this is flagged (common practice: 20 ft/s) */
  velocityLimit: number;
  /** inside hose allowance, gpm or L/min; null for HOSEALLOWANCE(hazard, "inside") */
  insideHose: number | null;
  /** true where hydrants are fed downstream of the pump, so that the outside hose flows through it */
  hydrantsDownstream: boolean;
  run: RunSegmentInput[];
  /** psi or bar: a visible input, common practice about 10 psi */
  requiredMargin: number;
  /** a pump the user has chosen (rated flow and pressure), checked against the demand; null for PUMPSIZE's suggestion */
  pump: { ratedFlow: number; ratedPressure: number } | null;
  /**
   * psi or bar: the least pressure the water purveyor lets a pump leave in the public main (common practice: often
   * 20 psi)
   */
  suctionMinimum: number;
  /** minutes the supply must last, for a suction tank's volume; null for DURATION(hazard, "max") */
  duration: number | null;
  /** the name of this sheet's own design area, the first row of the table of candidates; "" for a plain one */
  areaName?: string;
  /** the building's other candidate design areas, typed below this sheet's own in the table of candidates */
  candidates?: CandidateInput[];
}

/**
 * The demo scenario every new estimate sheet starts from: an invented ordinary hazard group 2 building (a print
 * works; a joinery workshop in SI work, not storage, which the storage chapters design), an invented firm and an
 * invented flow test, for the user to overwrite. The SI demo is its own metric scenario, not a conversion.
 */
export function demoScenario(units: UnitSystem): Scenario {
  if (units === "SI") {
    return {
      units: "SI",
      site: "Demo joinery workshop, Bay 3",
      address: "3 Example Quay, Sampleport",
      preparedBy: "Sample Fire Design Studio (demo)",
      flowTests: [
        {
          when: "2026-03-14 10:30, hydrant at the Example Quay gate (demo)",
          static: 5.0,
          residual: 3.9,
          flow: null,
          pitot: 1.0,
          outletDiameter: 63.5,
          outletCoefficient: 0.9,
          rise: 0,
        },
      ],
      derate: 0,
      hazard: "OH2",
      designArea: null,
      sprinkler: { kFactor: 115, coverage: 11, spacing: 3.3, minPressure: 0.5 },
      branch: { nominal: 40, schedule: "40" },
      crossMain: { nominal: 80, schedule: "40" },
      material: "steel",
      system: "wet",
      design: { kind: "area" },
      areaFittings: "T",
      velocityLimit: DEFAULT_VELOCITY_LIMIT.SI,
      insideHose: null,
      hydrantsDownstream: false,
      run: [
        { label: "Cross main to the riser", nominal: 80, schedule: "40", material: "steel", fittings: "2E T", length: 20, rise: 0, fixedLoss: 0, insideHose: false },
        { label: "Riser with its valves", nominal: 100, schedule: "40", material: "steel", fittings: "E GV CV", length: 6, rise: 5, fixedLoss: 0, insideHose: true },
        { label: "Backflow preventer", nominal: 100, schedule: "40", material: "steel", fittings: "2GV", length: 1.5, rise: 0, fixedLoss: 0.55, insideHose: true },
        { label: "Underground to the street main", nominal: 150, schedule: "DR14", material: "plastic", fittings: "E GV", length: 55, rise: 1.2, fixedLoss: 0, insideHose: true },
      ],
      requiredMargin: 0.7,
      pump: null,
      suctionMinimum: 1.4,
      duration: null,
    };
  }
  return {
    units: "US",
    site: "Demo print works, Unit 7",
    address: "7 Example Lane, Sampletown",
    preparedBy: "Sample Engineering Co. (demo)",
    flowTests: [
      {
        when: "2026-03-14 10:30, hydrant at Example Lane and Second Street (demo)",
        static: 72,
        residual: 56,
        flow: null,
        pitot: 14,
        outletDiameter: 2.5,
        outletCoefficient: 0.9,
        rise: 0,
      },
    ],
    derate: 0,
    hazard: "OH2",
    designArea: null,
    sprinkler: { kFactor: 8, coverage: 120, spacing: 11, minPressure: 7 },
    branch: { nominal: 1.5, schedule: "40" },
    crossMain: { nominal: 3, schedule: "40" },
    material: "steel",
    system: "wet",
    design: { kind: "area" },
    areaFittings: "T",
    velocityLimit: DEFAULT_VELOCITY_LIMIT.US,
    insideHose: null,
    hydrantsDownstream: false,
    run: [
      { label: "Cross main to the riser", nominal: 3, schedule: "40", material: "steel", fittings: "2E T", length: 65, rise: 0, fixedLoss: 0, insideHose: false },
      { label: "Riser with its valves", nominal: 4, schedule: "40", material: "steel", fittings: "E GV CV", length: 20, rise: 16, fixedLoss: 0, insideHose: true },
      { label: "Backflow preventer", nominal: 4, schedule: "40", material: "steel", fittings: "2GV", length: 5, rise: 0, fixedLoss: 8, insideHose: true },
      { label: "Underground to the street main", nominal: 6, schedule: "DR14", material: "plastic", fittings: "E GV", length: 180, rise: 4, fixedLoss: 0, insideHose: true },
    ],
    requiredMargin: 10,
    pump: null,
    suctionMinimum: MIN_SUCTION_PRESSURE_PSI,
    duration: null,
  };
}
