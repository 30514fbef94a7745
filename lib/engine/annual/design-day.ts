/**
 * Pipeline step 5b — design-day checks of each option's selection in the site's 0.4 % design hour
 * (annual 0.4 % wet-bulb with its mean coincident dry-bulb, climate.ts): the selection's design
 * wet-bulb against the site's, the condenser's design condensing temperature against the set-point, and
 * the heat the option can reject at the set-point at full fan speed (tower; cooler wet) against the
 * design duty (× the what-if load factor). The condenser carries its stated design fouling (direct
 * option) or the closed-loop fouling (plate and cooler options); the plate exchanger is clean.
 * Capacity at the set-point: the heat Q where Tc(Q) at full speed equals the set-point (bisection;
 * Tc rises monotonically with Q).
 */
import { enteringAir } from "../air-side";
import { fouledUaKWPerK } from "../condenser";
import { condensingTemperatureAtAirflowC } from "../evaporative-condenser";
import { coolerLeavingFluidAtAirflowC } from "../fluid-cooler";
import { isothermalStreamEffectiveness } from "../heat-exchanger";
import { plateExchangerApproachK } from "../plate-exchanger";
import { towerColdWaterAtAirflowC } from "../tower";
import type { EngineWarning, OptionDesignDay } from "../types";
import { numericWarning, wv } from "../warnings";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { SET_POINT_TOLERANCE_K } from "./record-types";

/** Tolerance below the site's 0.4 % wet-bulb within which a selection counts as selected for it, K. */
const WET_BULB_TOLERANCE_K = 0.3;

export function designDayCheck(po: PreparedOption, ctx: YearContext): { check: OptionDesignDay; warnings: EngineWarning[] } | null {
  const d = ctx.climate.design;
  if (!Number.isFinite(d.wetBulbC)) return null;
  const o = po.input;
  const warnings: EngineWarning[] = [];
  const air = enteringAir(d.dryBulbC, d.wetBulbC, ctx.pPa);
  const setC = ctx.duty.condensingSetPointC;
  const duty = ctx.designHeatKW * ctx.loadFactor;
  const rf = o.kind === "openTowerDirect" ? o.condenser.designFoulingM2KPerW : po.condenserFixedFoulingM2KPerW;
  const ua = fouledUaKWPerK(po.condenserCleanUaKWPerK, po.condenserCleanUWPerM2K, rf);
  const cw = po.condenserCapacityKWPerK;
  const eps = isothermalStreamEffectiveness(ua, cw);
  const dev = po.device;
  const condensingAtFullSpeed = (q: number): number => {
    // The evaporative condenser (clean coil, wet) condenses in the unit itself: no lift.
    if (dev.kind === "evaporativeCondenser") return condensingTemperatureAtAirflowC(dev.model, air, q, 1, true, ctx.pPa);
    const lift = q / (eps * cw);
    if (dev.kind === "tower") {
      const approach = po.plate ? plateExchangerApproachK(q, po.plate.cleanUaKWPerK, po.plate.hotCapacityKWPerK, po.plate.coldCapacityKWPerK) : 0;
      return towerColdWaterAtAirflowC(dev.model, air, q, 1, ctx.pPa, setC - lift - approach) + lift + approach;
    }
    return coolerLeavingFluidAtAirflowC(dev.model, air, q, 1, true, ctx.pPa) + lift;
  };
  const tcAtDuty = condensingAtFullSpeed(duty);
  const holds = tcAtDuty <= setC + SET_POINT_TOLERANCE_K;
  let lo = 0;
  let hi = Math.max(duty, 1);
  while (condensingAtFullSpeed(hi) < setC && hi < 1e7) {
    lo = hi;
    hi *= 2;
  }
  for (let i = 0; i < 40 && hi - lo > 1e-4 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (condensingAtFullSpeed(mid) < setC) lo = mid;
    else hi = mid;
  }
  const capacity = 0.5 * (lo + hi);
  const selectionWetBulbC =
    o.kind === "evaporativeCondenser" ? o.evaporativeCondenser.ratedWetBulbC : o.kind === "closedCircuitCooler" ? o.cooler.designWetBulbC : o.tower.designWetBulbC;
  const what = dev.kind === "tower" ? "tower" : dev.kind === "cooler" ? "cooler" : "evaporative condenser";
  const selectionPath = o.kind === "evaporativeCondenser" ? "evaporativeCondenser.ratedWetBulbC" : `${what}.designWetBulbC`;
  const designCondensingC = o.kind === "evaporativeCondenser" ? o.evaporativeCondenser.ratedCondensingC : o.condenser.designCondensingC;
  const designCondensingPath = o.kind === "evaporativeCondenser" ? "evaporativeCondenser.ratedCondensingC" : "condenser.designCondensingC";
  const check: OptionDesignDay = {
    siteWetBulbC: d.wetBulbC,
    siteDryBulbC: d.dryBulbC,
    selectionWetBulbC,
    condenserDesignCondensingC: designCondensingC,
    setPointC: setC,
    dutyKW: duty,
    capacityAtSetPointKW: capacity,
    condensingC: holds ? setC : tcAtDuty,
    holdsSetPoint: holds,
  };
  if (selectionWetBulbC < d.wetBulbC - WET_BULB_TOLERANCE_K) {
    warnings.push(
      numericWarning({
        code: "designDay.selectionBelowSiteWetBulb",
        severity: "warning",
        template: `The ${what} was selected for a {sel} wet-bulb, below the site's 0.4 % design wet-bulb of {site}: its capacity in the design hour is checked below; ask the manufacturer for a selection at the site's wet-bulb.`,
        values: { sel: wv.tempC(selectionWetBulbC), site: wv.tempC(d.wetBulbC) },
        path: `${po.path}.${selectionPath}`,
        optionId: o.id,
      }),
    );
  }
  if (designCondensingC > setC + 0.05) {
    warnings.push(
      numericWarning({
        code: "designDay.condenserAboveSetPoint",
        severity: "warning",
        template:
          o.kind === "evaporativeCondenser"
            ? "The evaporative condenser's rated condensing temperature {tc} is above the set-point {set}: at its rating it cannot hold the set-point."
            : "The condenser's design condensing temperature {tc} is above the set-point {set}: at the design duty and design water it cannot hold the set-point.",
        values: { tc: wv.tempC(designCondensingC), set: wv.tempC(setC) },
        path: `${po.path}.${designCondensingPath}`,
        optionId: o.id,
      }),
    );
  }
  if (!holds) {
    warnings.push(
      numericWarning({
        code: "designDay.cannotHoldSetPoint",
        severity: "warning",
        template:
          "In the site's 0.4 % design hour ({wb} wet-bulb, {db} dry-bulb) this option rejects {cap} at the set-point {set} at full fan speed, less than the duty of {duty}: at the duty it condenses at {tc}.",
        values: { wb: wv.tempC(d.wetBulbC), db: wv.tempC(d.dryBulbC), cap: wv.dutyKW(capacity), set: wv.tempC(setC), duty: wv.dutyKW(duty), tc: wv.tempC(tcAtDuty) },
        path: po.path,
        optionId: o.id,
      }),
    );
  }
  return { check, warnings };
}
