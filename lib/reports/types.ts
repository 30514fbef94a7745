/**
 * What a report is built from: the same stored input + result the comparison page shows, plus who it
 * is for. Client-safe (no server imports) so the PDF, workbook and CSV builders and their tests share it.
 */
import type { UnitSystem } from "@/lib/auth/roles";
import type { ClimateSummary } from "@/lib/engine/climate/summary";
import type { EconomicsResult } from "@/lib/engine/economics/types";
import type { EngineWarning, OptionAnnualPhysics } from "@/lib/engine/types";
import type { CondenserPlan } from "@/lib/engine/condenser-plan";
import type { ScenarioFootprint } from "@/lib/engine/footprint";

/** The parts of the engine's stored result a report reads (a subset of lib/engine's ScenarioResult). */
export interface ReportEngineResult {
  engineVersion?: string;
  physics: OptionAnnualPhysics[];
  economics: EconomicsResult;
  climate?: ClimateSummary;
  warnings: EngineWarning[];
  /** Each option's condenser plan (absent from results stored before engine 2.1). */
  condensers?: CondenserPlan[];
  /** Each option's water and carbon footprint (absent from results stored before engine 2.1). */
  footprint?: ScenarioFootprint;
}

export interface ReportProject {
  id: string;
  name: string;
  clientName: string;
  siteName: string;
  locationLabel: string;
  elevationM: number;
  currency: string;
  firmName: string;
}

export interface ReportSource {
  project: ReportProject;
  scenarioId: string;
  scenarioName: string;
  /** Issued version number, or null for the firm's working draft. */
  versionNumber: number | null;
  /** "Version 2" or "Working draft (not issued)". */
  versionLabel: string;
  /** The scenario input document as stored (frozen for an issued version). */
  input: unknown;
  result: ReportEngineResult;
  unitSystem: UnitSystem;
  preparedBy: { firmName: string; consultantName: string | null };
  /** When the version was issued (null for a draft). */
  issuedAt: Date | null;
  /** When the underlying analysis finished (draft) or the version was issued. */
  resultAt: Date | null;
  engineVersion: string;
  /** The viewer may not see yearly cash flows (the owner): the result carries none, the report leaves them out. */
  cashFlowsWithheld?: boolean;
}

export class ReportDataError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ReportDataError";
  }
}
