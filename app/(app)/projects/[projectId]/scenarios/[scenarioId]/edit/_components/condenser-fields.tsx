"use client";

import { useEffect, useRef } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { SelectField, useUnits } from "@/components/forms";
import {
  CLEANING_METHODS,
  CLEANING_METHOD_LABELS,
  CONDENSER_CONSTRUCTIONS,
  CONDENSER_CONSTRUCTION_DEFAULTS,
  CONDENSER_CONSTRUCTION_LABELS,
  CONDENSER_MATERIALS,
  CONDENSER_MATERIAL_LABELS,
  INSPECTION_METHOD_LABELS,
  constructionChargeKgPerKW,
  defaultCondenserMaterial,
  type CondenserConstruction,
} from "@/lib/engine/condenser-construction";
import { isAmmonia, type Refrigerant } from "@/lib/engine/refrigerants";
import type { OptionKind } from "@/lib/engine/types";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import type { EditorValues } from "@/lib/scenarios/editor-values";
import { Check, Choice, Group, Num, Pct, Plain, FlowField } from "./fields";

type V = EditorValues;

const CONSTRUCTION_OPTIONS = CONDENSER_CONSTRUCTIONS.map((c) => ({
  value: c,
  label: CONDENSER_CONSTRUCTION_LABELS[c],
}));
const MATERIAL_OPTIONS = CONDENSER_MATERIALS.map((m) => ({ value: m, label: CONDENSER_MATERIAL_LABELS[m] }));
const CLEANING_OPTIONS = CLEANING_METHODS.map((m) => ({ value: m, label: CLEANING_METHOD_LABELS[m] }));

/** A clean U (stored in W/(m²·K)) in the project's units, to 3 figures. */
function uText(wPerM2K: number, system: UnitSystem): string {
  return formatQuantity("heatTransferCoefficientWPerM2K", wPerM2K, system, { sig: 3 });
}

/** A range of clean U ("800–1,400 W/(m²·K)", "141–247 Btu/(h·ft²·°F)"). */
function uRangeText([lo, hi]: readonly [number, number], system: UnitSystem): string {
  const kind = "heatTransferCoefficientWPerM2K";
  return `${formatQuantity(kind, lo, system, { sig: 3, withUnit: false })}–${formatQuantity(kind, hi, system, { sig: 3 })}`;
}

/** The construction's defaults, each with its source or tag, as the engine will use them where a field is left empty. */
function ConstructionDefaultsTable({
  construction,
  refrigerant,
  kind,
}: {
  construction: CondenserConstruction;
  refrigerant: Refrigerant;
  kind: OptionKind;
}) {
  const { system, currency } = useUnits();
  const d = CONDENSER_CONSTRUCTION_DEFAULTS[construction];
  const money = (v: number) => formatQuantity("money", v, system, { currency, sig: 3 });
  const years = (v: number | undefined) => (v === undefined ? "—" : `${formatNumber(v, { sig: 3 })} yr`);
  const openTower = kind === "openTowerDirect";
  const material = defaultCondenserMaterial(construction, refrigerant);
  const rows: [string, string, string][] = [
    ["Clean U range", uRangeText(d.cleanURangeWPerM2K.value, system), d.cleanURangeWPerM2K.source],
    ["Clean U", uText(d.cleanUWPerM2K.value, system), d.cleanUWPerM2K.source],
    [
      "Fouling growth on open-tower water",
      `× ${d.foulingGrowthMultiplierOpenTower.value}`,
      d.foulingGrowthMultiplierOpenTower.source,
    ],
    [
      "Open-tower water",
      d.openTowerWater.value === "suitable"
        ? "suitable"
        : d.openTowerWater.value === "particulateSensitive"
          ? "sensitive to particulate"
          : "cannot be opened",
      d.openTowerWater.source,
    ],
    ["Cleaning", CLEANING_METHOD_LABELS[d.cleaningMethod.value], d.cleaningMethod.source],
    ["Cleaning cost per event", money(d.cleaningCostPerEvent.value), d.cleaningCostPerEvent.source],
    ["Inspection", INSPECTION_METHOD_LABELS[d.inspectionMethod.value], d.inspectionMethod.source],
    [
      "Inspection interval",
      `${years(d.inspectionIntervalYears.value[openTower ? "openTower" : "closedLoop"])} here (${openTower ? "open-tower water" : "closed loop"}); ${years(d.inspectionIntervalYears.value.openTower)} on open-tower water, ${years(d.inspectionIntervalYears.value.closedLoop)} on a closed loop (0 = none)`,
      d.inspectionIntervalYears.source,
    ],
    ["Inspection cost per event", money(d.inspectionCostPerEvent.value), d.inspectionCostPerEvent.source],
    ["Gasket life", years(d.gasketLifeYears.value), d.gasketLifeYears.source],
    ["Tube bundle life", years(d.tubeBundleLifeYears.value), d.tubeBundleLifeYears.source],
    [
      "Wear part cost",
      `${formatNumber(d.wearPartCostFractionOfCondenser.value * 100, { sig: 2 })} % of the condenser`,
      d.wearPartCostFractionOfCondenser.source,
    ],
    [
      "Material",
      CONDENSER_MATERIAL_LABELS[material],
      (isAmmonia(refrigerant) ? d.material.ammonia : d.material.halocarbon).source,
    ],
    [
      "Refrigerant charge",
      `${formatNumber(constructionChargeKgPerKW(construction, refrigerant), { sig: 2 })} kg/kW (ammonia ${d.ammoniaChargeKgPerKW.value} kg/kW)`,
      d.ammoniaChargeKgPerKW.source,
    ],
    ["First-cost items to price", d.firstCostItems.value.join("; "), d.firstCostItems.source],
    [
      "Usual largest duty",
      d.typicalMaxDutyKW.value === undefined
        ? "no practical limit"
        : formatQuantity("heatDutyMbhKW", d.typicalMaxDutyKW.value, system, { sig: 2 }),
      d.typicalMaxDutyKW.source,
    ],
  ];
  return (
    <details
      className="sm:col-span-2 xl:col-span-3 rounded-md border border-line bg-paper-sunk/40 p-3 text-xs"
      data-testid="construction-defaults"
    >
      <summary className="cursor-pointer font-medium">
        Defaults of a {d.label.toLowerCase()} condenser, with their sources
      </summary>
      <p className="mt-2 text-ink-soft">{d.description}</p>
      <table className="mt-2 w-full border-collapse">
        <tbody>
          {rows.map(([label, value, source]) => (
            <tr key={label} className="border-t border-line align-top">
              <th scope="row" className="py-1 pr-3 text-left font-medium">
                {label}
              </th>
              <td className="py-1 pr-3">{value}</td>
              <td className="py-1 text-ink-soft">{source}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-ink-soft">
        Costs are orders of magnitude for a condenser of about 1 MW: replace them with quotes. Empty fields
        take these defaults.
      </p>
    </details>
  );
}

/** "Empty: <value> · <source>": the construction's default for a field left empty, with its source or tag. */
function tagged(value: string, source: string, lead = "Empty"): string {
  return `${lead}: ${value} · ${source}`;
}

/** A water-cooled option's condenser: construction, material, charge and upkeep plan (defaults by construction). */
export function CondenserConstructionGroup({ i, kind }: { i: number; kind: OptionKind }) {
  const { getValues, setValue } = useFormContext<V>();
  const p = `options.${i}.condenser` as const;
  const construction =
    useWatch<V, `options.${number}.condenser.construction`>({ name: `${p}.construction` }) ?? "shellAndTube";
  const refrigerant = useWatch<V, "duty.refrigerant">({ name: "duty.refrigerant" }) ?? "R717";
  const d = CONDENSER_CONSTRUCTION_DEFAULTS[construction];
  // A new construction brings its own clean coefficient, unless the user entered one of their own.
  const shown = useRef(construction);
  useEffect(() => {
    const old = shown.current;
    if (old === construction) return;
    shown.current = construction;
    const u = getValues(`${p}.cleanUWPerM2K`);
    if (u === undefined || u === CONDENSER_CONSTRUCTION_DEFAULTS[old].cleanUWPerM2K.value)
      setValue(`${p}.cleanUWPerM2K`, CONDENSER_CONSTRUCTION_DEFAULTS[construction].cleanUWPerM2K.value, {
        shouldDirty: true,
        shouldValidate: true,
      });
  }, [construction, getValues, setValue, p]);
  const { currency, system } = useUnits();
  const materialDefault = CONDENSER_MATERIAL_LABELS[defaultCondenserMaterial(construction, refrigerant)];
  const wearLife = d.tubeBundleLifeYears.value !== undefined ? d.tubeBundleLifeYears : d.gasketLifeYears;
  const wearLabel =
    d.tubeBundleLifeYears.value !== undefined
      ? "Tube bundle life"
      : d.gasketLifeYears.value !== undefined
        ? "Gasket set life"
        : "Wear-part life";
  return (
    <Group
      title="Condenser construction and upkeep plan"
      note="The construction sets the defaults of the fields left empty: cleaning, inspection (eddy-current testing applies to tubes only), wear parts, refrigerant charge and fouling growth."
    >
      <SelectField<V>
        name={`${p}.construction`}
        label="Condenser construction"
        options={CONSTRUCTION_OPTIONS}
        defaultSource="Shell-and-tube · [practice] the usual condenser on tower water"
      />
      <SelectField<V>
        name={`${p}.material`}
        label="Tube or plate material"
        options={MATERIAL_OPTIONS}
        placeholder={`Default: ${materialDefault}`}
        description="Carbon or stainless steel with ammonia; copper alloys only with halocarbons."
      />
      <Num
        name={`${p}.cleanUWPerM2K`}
        label="Clean U"
        kind="heatTransferCoefficientWPerM2K"
        noDefault
        description={tagged(
          `${uText(d.cleanUWPerM2K.value, system)}; ${uRangeText(d.cleanURangeWPerM2K.value, system)} is usual`,
          d.cleanUWPerM2K.source,
          "Default",
        )}
      />
      <Plain
        name={`${p}.foulingGrowthMultiplier`}
        label="Fouling growth vs shell-and-tube"
        unit="×"
        noDefault
        description={tagged(
          `× ${d.foulingGrowthMultiplierOpenTower.value} on open-tower water`,
          d.foulingGrowthMultiplierOpenTower.source,
        )}
      />
      <Plain
        name={`${p}.specificChargeKgPerKW`}
        label="Refrigerant charge per kW"
        unit="kg/kW"
        noDefault
        description={tagged(
          `${formatNumber(constructionChargeKgPerKW(construction, refrigerant), { sig: 2 })} kg/kW for this construction and refrigerant`,
          d.ammoniaChargeKgPerKW.source,
        )}
      />
      <SelectField<V>
        name={`${p}.upkeep.cleaningMethod`}
        label="Condenser cleaning method"
        options={CLEANING_OPTIONS}
        placeholder={`Default: ${CLEANING_METHOD_LABELS[d.cleaningMethod.value]}`}
        description={d.cleaningMethod.source}
      />
      <Num
        name={`${p}.upkeep.cleaningCostPerEvent`}
        label="Condenser cleaning, per cleaning"
        kind="money"
        noDefault
        description={
          kind === "openTowerDirect"
            ? tagged(
                `${formatNumber(d.cleaningCostPerEvent.value)} ${currency}`,
                d.cleaningCostPerEvent.source,
              )
            : "On a closed loop the condenser is not cleaned on a schedule; the option's own cleaning cost (Life and upkeep) is what its scheduled cleanings cost."
        }
      />
      <Num
        name={`${p}.upkeep.inspectionIntervalYears`}
        label="Condenser inspection every"
        kind="years"
        noDefault
        description={tagged(
          `${INSPECTION_METHOD_LABELS[d.inspectionMethod.value]}, every ${d.inspectionIntervalYears.value[kind === "openTowerDirect" ? "openTower" : "closedLoop"]} yr here (0 = none)`,
          d.inspectionIntervalYears.source,
        )}
      />
      <Num
        name={`${p}.upkeep.inspectionCostPerEvent`}
        label="Condenser inspection, per inspection"
        kind="money"
        noDefault
        description={tagged(
          `${formatNumber(d.inspectionCostPerEvent.value)} ${currency}`,
          d.inspectionCostPerEvent.source,
        )}
      />
      <Num
        name={`${p}.upkeep.wearPartLifeYears`}
        label={wearLabel}
        kind="years"
        noDefault
        description={
          wearLife.value !== undefined
            ? tagged(`${wearLife.value} yr`, wearLife.source)
            : "This construction has no wear part."
        }
      />
      <Num
        name={`${p}.upkeep.wearPartReplacementCost`}
        label="Wear-part replacement cost"
        kind="money"
        noDefault
        description={`Not counted until entered; about ${formatNumber(d.wearPartCostFractionOfCondenser.value * 100, { sig: 2 })} % of the condenser's price · ${d.wearPartCostFractionOfCondenser.source}`}
      />
      <ConstructionDefaultsTable construction={construction} refrigerant={refrigerant} kind={kind} />
    </Group>
  );
}

/**
 * The evaporative condenser's rating and wet/dry operation (the option's "selection" part), or its coil (the
 * "condenser" part).
 */
export function EvaporativeCondenserGroups({ i, part }: { i: number; part: "selection" | "condenser" }) {
  const { setValue } = useFormContext<V>();
  const p = `options.${i}.evaporativeCondenser` as const;
  const modeSelection = useWatch<V, `options.${number}.evaporativeCondenser.modeSelection`>({
    name: `${p}.modeSelection`,
  });
  const dryRating = useWatch<V, `options.${number}.evaporativeCondenser.dryRating`>({
    name: `${p}.dryRating`,
  });
  if (part === "condenser") return <EvaporativeCondenserCoil i={i} />;
  return (
    <>
      <Group
        title="Evaporative condenser at its rating"
        note="From the manufacturer's selection: the refrigerant condenses in the coil, spray water recirculates over it; no condenser water loop or condenser pump."
      >
        <Num name={`${p}.ratedHeatRejectionKW`} label="Rated heat rejection" kind="heatDutyMbhKW" />
        <Num name={`${p}.ratedCondensingC`} label="Rated condensing temperature" kind="temperatureC" />
        <Num name={`${p}.ratedWetBulbC`} label="Rated entering wet-bulb" kind="temperatureC" />
        <Num name={`${p}.airFlowKgPerS`} label="Rated airflow" kind="massFlowKgPerS" optional />
        <Pct name={`${p}.internalResistanceFraction`} label="Condensing-side share of the wet resistance" />
      </Group>
      <Group title="Wet and dry operation">
        <Check name={`${p}.allowDryMode`} label="May run dry (spray pump off)" />
        <Plain name={`${p}.dryExternalConductanceFactor`} label="Dry external conductance factor" unit="—" />
        <Choice
          name={`${p}.modeSelection`}
          label="Wet or dry in each hour"
          options={[
            { value: "lowestTotalPower", label: "Whichever needs less fan + spray + compressor power" },
            { value: "switchOverDryBulb", label: "Dry at or below a switch-over dry-bulb" },
          ]}
        />
        {modeSelection === "switchOverDryBulb" ? (
          <Num name={`${p}.switchOverDryBulbC`} label="Switch-over dry-bulb" kind="temperatureC" />
        ) : null}
        <Num
          name={`${p}.sprayLockoutDryBulbC`}
          label="Spray locked out below dry-bulb"
          kind="temperatureC"
          description="Freeze protection: always dry below it."
        />
        <Num
          name={`${p}.dryModeMaxDryBulbC`}
          label="Dry operation only below dry-bulb"
          kind="temperatureC"
          optional
        />
        <div className="sm:col-span-2 xl:col-span-3">
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              className="h-4 w-4 accent-basin-600"
              checked={Boolean(dryRating)}
              onChange={(e) =>
                setValue(
                  `${p}.dryRating`,
                  e.target.checked ? { heatRejectionKW: 300, condensingC: 35, dryBulbC: 10 } : undefined,
                  {
                    shouldDirty: true,
                    shouldValidate: true,
                  },
                )
              }
            />
            I have a dry rating from the manufacturer (calibrates dry operation)
          </label>
        </div>
        {dryRating ? (
          <>
            <Num
              name={`${p}.dryRating.heatRejectionKW`}
              label="Dry rating: heat rejection"
              kind="heatDutyMbhKW"
            />
            <Num
              name={`${p}.dryRating.condensingC`}
              label="Dry rating: condensing temperature"
              kind="temperatureC"
            />
            <Num name={`${p}.dryRating.dryBulbC`} label="Dry rating: dry-bulb" kind="temperatureC" />
          </>
        ) : null}
      </Group>
    </>
  );
}

function EvaporativeCondenserCoil({ i }: { i: number }) {
  const p = `options.${i}.evaporativeCondenser` as const;
  return (
    <>
      <Group
        title="Coil"
        note="Scale on the coil derates its capacity until the coil is cleaned; the cleaning restores it. The coil's refrigerant counts in the inventory."
      >
        <SelectField<V>
          name={`${p}.coilMaterial`}
          label="Coil material"
          options={MATERIAL_OPTIONS}
          placeholder="Default: hot-dip galvanized steel"
          description="Never copper with ammonia."
        />
        <Plain name={`${p}.specificChargeKgPerKW`} label="Refrigerant in the coil per kW" unit="kg/kW" />
        <Pct
          name={`${p}.coilScaling.derateBeforeCleaning`}
          label="Capacity lost to scale before a cleaning"
        />
        <Num name={`${p}.coilScaling.cleaningIntervalMonths`} label="Coil cleaned every" kind="months" />
        <Num name={`${p}.coilLifeYears`} label="Coil life" kind="years" optional />
        <Num name={`${p}.coilReplacementCost`} label="Coil replacement" kind="money" optional />
      </Group>
    </>
  );
}

/** The spray pump of a closed-circuit cooler or an evaporative condenser. */
export function SprayPumpFields({ i }: { i: number }) {
  const p = `options.${i}.sprayPump` as const;
  return (
    <>
      <FlowField name={`${p}.flowKgPerS`} label="Spray-water flow" />
      <Num name={`${p}.headM`} label="Spray pump head" kind="headM" />
      <Pct name={`${p}.efficiency`} label="Spray pump efficiency" />
      <Num name={`${p}.powerKW`} label="Spray pump motor input" kind="powerKW" optional />
    </>
  );
}
