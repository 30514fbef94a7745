/**
 * Pipeline step 6 — warnings and the option's result: water-side checks (cycles against the chemistry
 * limit, drift beyond the blowdown), hours that could not hold the set-point, winter cautions, the
 * scaling indices at the hottest wetted surface and the chemical quantities; assembles
 * `OptionAnnualPhysics`.
 */
import { freezingPointC } from "../glycol";
import type { WaterInput } from "../input";
import type { EngineWarning, OptionAnnualPhysics } from "../types";
import { achievedCycles, chemicalQuantitiesKg, loopChemistryAtCycles, type maximumCyclesFromChemistry } from "../water";
import type { OptionYearTotals } from "./accumulate";
import type { PreparedOption } from "./options";
import { numericWarning, wv } from "../warnings";
import { round1 } from "./shared";

export function finishOption(
  po: PreparedOption,
  t: OptionYearTotals,
  scenarioCyclesValue: number,
  cycles: number,
  limit: ReturnType<typeof maximumCyclesFromChemistry>,
  water: WaterInput,
  intervalMonths: number,
  optimal: number | null,
  warnings: EngineWarning[],
  cyclesOverridden: boolean,
): OptionAnnualPhysics {
  const o = po.input;
  const w = t.waterM3;
  const achieved = achievedCycles(w.evaporation, w.blowdown, w.drift);
  const reportedCycles = Number.isFinite(achieved) && w.makeup > 0 ? achieved : cycles;
  const ownCycles = o.cyclesOfConcentration !== undefined;
  if (!cyclesOverridden && (ownCycles || water.cyclesMode === "entered") && cycles > limit.cycles + 1e-9) {
    warnings.push({
      code: "water.cyclesBeyondChemistryLimit",
      severity: "warning",
      message: `${round1(cycles)} cycles exceed the ${round1(limit.cycles)} the makeup chemistry allows (${limit.limitingSpecies ?? "—"} limit): scale or corrosion risk unless the treatment programme supports it.`,
      path: ownCycles ? `${po.path}.cyclesOfConcentration` : "water.cyclesOfConcentration",
      optionId: o.id,
    });
  }
  if (w.makeup > 0 && achieved < cycles - 0.05) {
    warnings.push({
      code: "water.driftExceedsBlowdown",
      severity: "info",
      message: `Drift alone removes more water than the blowdown the cycles need in some hours: the loop achieves ${round1(achieved)} cycles instead of ${round1(cycles)}.`,
      path: `${po.path}.driftFractionOfFlow`,
      optionId: o.id,
    });
  }
  if (t.unmetHours > 0) {
    warnings.push(
      numericWarning({
        code: "loop.unmetHours",
        severity: "warning",
        template: "{hours} in which the loop could not hold the condensing set-point at full fan speed: the plant condensed hotter then and its compressors paid for it (included in the compressor energy).",
        values: { hours: wv.hours(t.unmetHours) },
        path: `${po.path}`,
        optionId: o.id,
      }),
    );
  }
  if (t.wetHoursBelowFreezing > 0) {
    warnings.push(
      numericWarning({
        code: "caution.winterOperation",
        severity: "warning",
        template:
          "{hours} of wet operation below {zero}: icing of fill, louvres and basin, and freezing of exposed piping must be designed out (basin heat, bypass to the basin, fan de-icing, heat tracing) — follow the manufacturer and local codes.",
        values: { hours: wv.hours(t.wetHoursBelowFreezing), zero: wv.tempC(0) },
        path: `${po.path}.basinHeater`,
        optionId: o.id,
      }),
    );
  }
  if (o.kind === "closedCircuitCooler" && Number.isFinite(t.minDryBulbC)) {
    const fp = freezingPointC(o.cooler.glycol.kind, o.cooler.glycol.massFraction);
    if (t.minDryBulbC < fp + 2) {
      warnings.push(
        numericWarning({
          code: "caution.coilFreeze",
          severity: "warning",
          template:
            "The outdoor air reaches {air} and the coil fluid freezes near {fp}: a coil that stands idle or loses flow can burst — use enough glycol, or keep flow and a minimum heat load, or drain the coil; follow the manufacturer.",
          values: { air: wv.tempC(t.minDryBulbC), fp: wv.tempC(fp) },
          path: `${po.path}.cooler.glycol`,
          optionId: o.id,
        }),
      );
    }
  }
  // Scaling indices at the hottest wetted surface (tower fill inlet / wetted coil), at the cycles the
  // loop achieves over the year (drift can hold them below the target), after acid feed where needed.
  const hottest = Number.isFinite(t.hottestSurfaceC) ? t.hottestSurfaceC : po.designHottestSurfaceC;
  const atCycles = Number.isFinite(achieved) && w.makeup > 0 ? achieved : cycles;
  const sc = water.scaleControl;
  const loopChem = loopChemistryAtCycles(water.makeup, water.recirculatingPh, hottest, atCycles, sc);
  const outflow = w.blowdown + w.drift;
  const acidKg = w.makeup > 0 ? loopChem.acidProductKgPerM3Outflow * outflow : 0;
  // [practice] treated towers commonly run up to the entered LSI limit with a scale inhibitor; beyond it,
  // or at a Ryznar index below 4, scale control needs more than an inhibitor (acid feed, softening, fewer cycles).
  if (w.makeup > 0 && (loopChem.langelierIndex > sc.maximumLangelierIndex + 1e-9 || loopChem.ryznarIndex < 4)) {
    warnings.push(
      numericWarning({
        code: "water.scaleForming",
        severity: "info",
        template:
          "At {surface} and {cycles} cycles the recirculating water is strongly scale-forming (LSI {lsi}, RSI {rsi}; limit LSI {limit}): the treatment programme must control it.",
        values: {
          surface: wv.tempC(hottest),
          cycles: wv.ratio(atCycles),
          lsi: wv.ratio(loopChem.langelierIndex),
          rsi: wv.ratio(loopChem.ryznarIndex),
          limit: wv.ratio(sc.maximumLangelierIndex),
        },
        path: sc.acidFeed ? "water" : "water.scaleControl.acidFeed",
        optionId: o.id,
      }),
    );
  }
  if (acidKg > 0) {
    warnings.push(
      numericWarning({
        code: "caution.acidFeed",
        severity: "info",
        template:
          "At {cycles} cycles the Langelier index would reach {untreated} at {surface}: acid feed of about {acid} a year of {strength} sulfuric acid holds it at {limit} (pH {ph0} → {ph1}). Concentrated acid burns: bunded storage, a pH-interlocked feed, eye-wash and protective equipment per the supplier's safety data sheet and local rules; an acid overfeed corrodes the system.",
        values: {
          cycles: wv.ratio(atCycles),
          untreated: wv.ratio(loopChem.untreatedLangelierIndex),
          surface: wv.tempC(hottest),
          acid: wv.kg(acidKg),
          strength: wv.percent(sc.acidStrengthFraction * 100),
          limit: wv.ratio(sc.maximumLangelierIndex),
          ph0: wv.ratio(water.recirculatingPh),
          ph1: wv.ratio(loopChem.ph),
        },
        path: "water.scaleControl",
        optionId: o.id,
      }),
    );
  }
  const yearFraction = t.hoursTotal / 8760;
  const wetVolume = w.makeup > 0 ? po.wetLoopVolumeM3 : 0;
  const chem = chemicalQuantitiesKg(outflow, wetVolume, water.dosing.inhibitorMgPerLOutflow, water.dosing.biocideMgPerLSystemVolume, water.dosing.biocideSlugsPerYear, yearFraction);
  return {
    optionId: o.id,
    kind: o.kind,
    label: o.label,
    hoursTotal: t.hoursTotal,
    heatRejectedKWh: t.heatRejectedKWh,
    energyKWh: t.energyKWh,
    energyKWhByMonthHour: t.byMonthHour,
    waterM3: w,
    monthly: t.monthly,
    cyclesOfConcentration: reportedCycles,
    scenarioCyclesOfConcentration: scenarioCyclesValue,
    targetCyclesOfConcentration: cycles,
    sewerBasis: water.sewerBasis,
    dryModeHours: t.dryModeHours,
    unmetHours: t.unmetHours,
    meanCondensingC: t.meanCondensingC,
    meanReferenceCondensingC: t.meanReferenceCondensingC,
    cleaningsPerYear: intervalMonths > 0 ? 12 / intervalMonths : 0,
    optimalCleaningIntervalMonths: optimal,
    chemicals: { treatedOutflowM3: outflow, systemVolumeM3: wetVolume, inhibitorKg: chem.inhibitorKg, biocideKg: chem.biocideKg, acidKg },
    compressorAboveCleanReferenceKWh: t.aboveCleanKWh,
    compressorExtrapolatedHours: t.extrapolatedHours,
    waterChemistry: {
      hottestWettedSurfaceC: hottest,
      saturationPh: loopChem.saturationPh,
      langelierIndex: loopChem.langelierIndex,
      ryznarIndex: loopChem.ryznarIndex,
      cyclesLimitFromChemistry: limit.cycles,
      limitingSpecies: limit.limitingSpecies,
      atCycles,
      targetCycles: cycles,
      ph: loopChem.ph,
      untreatedLangelierIndex: loopChem.untreatedLangelierIndex,
      maximumLangelierIndex: sc.maximumLangelierIndex,
      acidFeed: sc.acidFeed,
      acidBasis: {
        makeup: {
          calciumHardnessMgPerLAsCaCO3: water.makeup.calciumHardnessMgPerLAsCaCO3,
          mAlkalinityMgPerLAsCaCO3: water.makeup.mAlkalinityMgPerLAsCaCO3,
          silicaMgPerL: water.makeup.silicaMgPerL,
          chlorideMgPerL: water.makeup.chlorideMgPerL,
          tdsMgPerL: water.makeup.tdsMgPerL,
          ph: water.makeup.ph,
        },
        recirculatingPh: water.recirculatingPh,
        hottestSurfaceC: hottest,
        maximumLangelierIndex: sc.maximumLangelierIndex,
        acidFeed: sc.acidFeed,
        acidStrengthFraction: sc.acidStrengthFraction,
      },
    },
    warnings,
  };
}
