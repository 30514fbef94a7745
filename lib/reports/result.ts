import { upgradeOptionPhysics } from "@/lib/engine/legacy";
import { ReportDataError, type ReportEngineResult } from "./types";

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/**
 * The parts of a stored result (scenario_results.result or scenario_versions.result) a report needs.
 * The jsonb comes back as plain JSON; a result without physics or economics cannot make a report.
 */
export function readEngineResult(raw: unknown): ReportEngineResult {
  if (!isObject(raw)) throw new ReportDataError("The stored result is empty.");
  const physics = raw.physics;
  const economics = raw.economics;
  if (!Array.isArray(physics) || !isObject(economics) || !Array.isArray(economics.options)) {
    throw new ReportDataError("The stored result has no physics or economics to report.");
  }
  const climate = isObject(raw.climate)
    ? raw.climate
    : isObject(raw.climateSummary)
      ? raw.climateSummary
      : undefined;
  const out: ReportEngineResult = {
    physics: (physics as ReportEngineResult["physics"]).map(upgradeOptionPhysics),
    economics: economics as unknown as ReportEngineResult["economics"],
    warnings: Array.isArray(raw.warnings) ? (raw.warnings as ReportEngineResult["warnings"]) : [],
  };
  if (climate) out.climate = climate as unknown as NonNullable<ReportEngineResult["climate"]>;
  if (typeof raw.engineVersion === "string") out.engineVersion = raw.engineVersion;
  if (Array.isArray(raw.condensers)) out.condensers = raw.condensers as NonNullable<ReportEngineResult["condensers"]>;
  if (isObject(raw.footprint) && Array.isArray(raw.footprint.options)) out.footprint = raw.footprint as unknown as NonNullable<ReportEngineResult["footprint"]>;
  return out;
}
