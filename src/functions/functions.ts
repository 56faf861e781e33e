/**
 * Headroom's cell functions: the add-in's public interface (namespace HEADROOM, e.g. =HEADROOM.FRICTION(...)).
 *
 * This file is the one input of the metadata generator (custom-functions-metadata-plugin), which registers every
 * top-level function here under its upper-cased name. Each is a thin wrapper: it reads its arguments through
 * ./args (checks, defaults with ??, SI → US), calls the pure engine, converts the result back, and leaves every
 * failure as a CustomFunctions.Error with a one-line message (./bridge). Names and argument orders follow
 * the vocabulary; never rename one without keeping the old name working.
 */
import { cell } from "./bridge";

// ─── Water supply ────────────────────────────────────────────────────────────────────────────────────────────────

// ─── Demand ──────────────────────────────────────────────────────────────────────────────────────────────────────

// ─── Piping ──────────────────────────────────────────────────────────────────────────────────────────────────────

// ─── Trade tables: pipes, C factors, fittings, density/area, hose, duration ──────────────────────────────────────

// ─── Range functions and solvers: RUN, SUPPLYCURVE, AREADEMAND, SIZEFOR, PUMPSIZE, PUMPCURVE ─────────────────────

// ─── Decision ────────────────────────────────────────────────────────────────────────────────────────────────────

// ─── Units ───────────────────────────────────────────────────────────────────────────────────────────────────────
