/**
 * Sprinkler discharge and the design-area counts of the density/area method. US units: gpm, psi, ft, ft².
 */
import { fail, n as plain, q } from "./errors";

/**
 * Minimum operating pressure of a sprinkler, psi.
 * @see [NFPA 13] minimum operating pressure
 */
export const MIN_SPRINKLER_PRESSURE_PSI = 7;
/**
 * Factor for the branch-line length of a rectangular design area, 1.2 √A, dimensionless.
 * @see [NFPA 13] density/area method
 */
export const DESIGN_AREA_LENGTH_FACTOR = 1.2;

/**
 * The most sprinklers one design area, or one branch line of it, may hold.
 *
 * A real design area holds tens to a few hundred sprinklers; more than 5000 is a typing error (a coverage in the
 * wrong unit, an area typed with extra zeros), and the bound keeps the sprinkler-by-sprinkler solve of AREADEMAND
 * small.
 * @see (common practice)
 */
export const MAX_DESIGN_AREA_SPRINKLERS = 5000;

/**
 * The closest spacing of sprinklers along a branch line, ft.
 *
 * Half the 6 ft that standard spray sprinklers keep apart: closer is a typing error, not a layout, and the floor
 * leaves room for metric-rounded and specially listed spacings.
 * @see (common practice)
 */
export const MIN_HEAD_SPACING_FT = 3;

/**
 * Round up, forgiving floating-point noise just above a whole number (1500 / 150 stays 10).
 *
 * Never −0: a value within the allowance of 0 would round to ceil(−1e-9…0) = −0, and a count or a number of steps
 * reads 0.
 *
 *   n = ceil(x − 1e-9)
 *
 * @param x the count as a fraction, dimensionless
 * @returns the whole count
 * @example
 * ceilCount(10.0000000001) // → 10
 * ceilCount(10.01) // → 11
 */
export function ceilCount(x: number): number {
  const n = Math.ceil(x - 1e-9);
  return n === 0 ? 0 : n; // −0 === 0: replaces −0 by +0
}

/**
 * Sprinkler discharge.
 *
 *   Q = K √P
 *
 * K 5.6 at 7 psi: 5.6 × 2.6458 = 14.8 gpm.
 *
 * @param k K, the K-factor, gpm/psi^0.5
 * @param pressure P, the pressure at the sprinkler, psi
 * @returns Q, the discharge, gpm
 * @see [NFPA 13] sprinkler discharge
 * @example
 * headDischarge(5.6, 7) // ≈ 14.8 gpm
 */
export function headDischarge(k: number, pressure: number): number {
  return k * Math.sqrt(pressure);
}

/**
 * Design flow of the most remote sprinkler by the density/area method.
 *
 *   q = max(density × coverage, K √Pmin)
 *
 * 0.15 gpm/ft² × 130 ft², K 5.6, 7 psi: max(19.5, 14.8) = 19.5 gpm.
 *
 * @param density the design density, gpm/ft²
 * @param coverage the floor area per sprinkler, ft²
 * @param k K, the K-factor, gpm/psi^0.5
 * @param minPressure Pmin, the minimum operating pressure, psi
 * @returns q, the flow, gpm
 * @see [NFPA 13] density/area method
 * @example
 * headFlow(0.15, 130, 5.6, 7) // ≈ 19.5 gpm
 */
export function headFlow(density: number, coverage: number, k: number, minPressure: number): number {
  return Math.max(density * coverage, headDischarge(k, minPressure));
}

/**
 * Pressure a sprinkler needs to discharge a flow, not below the minimum operating pressure.
 *
 *   p = max((q / K)², Pmin)
 *
 * K 8.0 flowing 24 gpm: (24 / 8)² = 9 psi, above 7 psi (common practice check).
 *
 * @param flow q, the flow, gpm
 * @param k K, the K-factor, gpm/psi^0.5
 * @param minPressure Pmin, the minimum operating pressure, psi
 * @returns p, the pressure, psi
 * @see [NFPA 13] sprinkler discharge and minimum operating pressure
 * @example
 * headPressure(24, 8, 7) // → 9 psi
 * headPressure(14, 8, 7) // → 7 psi
 */
export function headPressure(flow: number, k: number, minPressure: number): number {
  return Math.max((flow / k) ** 2, minPressure);
}

/** Throw unless `value` is a positive finite number. */
function checkPositive(value: number, name: string): void {
  if (!(value > 0 && value < Infinity)) fail(name, plain(value), "must be greater than 0");
}

/**
 * Sprinklers in the design area.
 *
 * At least 1 (a positive area holds a sprinkler) and at most MAX_DESIGN_AREA_SPRINKLERS: a coverage below
 * area ÷ 5000 is an input error naming coverage.
 *
 *   n = ceil(A / coverage)
 *
 * 1500 ft² at 130 ft²: ceil(11.54) = 12.
 *
 * @param area A, the design area, ft² (or m²)
 * @param coverage the floor area per sprinkler, in the unit of area (the ratio has no unit)
 * @returns n, the number of sprinklers
 * @see [NFPA 13] density/area method (fractions round up)
 * @example
 * headCount(1500, 130) // → 12
 */
export function headCount(area: number, coverage: number): number {
  checkPositive(area, "area");
  checkPositive(coverage, "coverage");
  const n = Math.max(1, ceilCount(area / coverage));
  if (!(n <= MAX_DESIGN_AREA_SPRINKLERS)) {
    fail(
      "coverage",
      plain(coverage),
      `must be at least area ÷ ${MAX_DESIGN_AREA_SPRINKLERS} = {0} (in the unit of area): a design area of more than ` +
        `${MAX_DESIGN_AREA_SPRINKLERS} sprinklers is an input error`,
      plain(area / MAX_DESIGN_AREA_SPRINKLERS),
    );
  }
  return n;
}

/**
 * Sprinklers along one branch line of a rectangular design area whose long side, factor × √A, runs along the lines.
 *
 * At least 1:
 *
 *   n_line = max(1, ceil(factor √A / S))
 *
 * A spacing below MIN_HEAD_SPACING_FT, or a line of more than MAX_DESIGN_AREA_SPRINKLERS, is an input error.
 * 1500 ft², S 12 ft: ceil(1.2 × 38.73 / 12) = ceil(3.87) = 4.
 *
 * @param area A, the design area, ft² (or m²)
 * @param spacing S, between sprinklers on the line, ft
 * @param factor the long side over √A, dimensionless (1.2: DESIGN_AREA_LENGTH_FACTOR)
 * @returns n_line, the number of sprinklers on a line
 * @see [NFPA 13] density/area method, 1.2 √A
 * @example
 * headsPerLine(1500, 12, 1.2) // → 4
 */
export function headsPerLine(area: number, spacing: number, factor: number): number {
  checkPositive(area, "area");
  checkPositive(spacing, "head_spacing");
  checkPositive(factor, "factor");
  if (spacing < MIN_HEAD_SPACING_FT) {
    fail("head_spacing", q("length", spacing), "must be at least {0}: sprinklers closer than that on a line are an input error", q("length", MIN_HEAD_SPACING_FT));
  }
  const n = Math.max(1, ceilCount((factor * Math.sqrt(area)) / spacing));
  if (!(n <= MAX_DESIGN_AREA_SPRINKLERS)) {
    const largest = ((MAX_DESIGN_AREA_SPRINKLERS * spacing) / factor) ** 2;
    fail(
      "area",
      q("area", area),
      `must be at most {0} with head_spacing {1} and factor {2}: a line of more than ${MAX_DESIGN_AREA_SPRINKLERS} ` +
        "sprinklers is an input error",
      q("area", largest),
      q("length", spacing),
      plain(factor),
    );
  }
  return n;
}

/**
 * Minimum operating pressure of a sprinkler in SI work, bar (the vocabulary's SI default).
 * @see [NFPA 13] minimum operating pressure in SI work
 */
export const MIN_SPRINKLER_PRESSURE_BAR = 0.5;
