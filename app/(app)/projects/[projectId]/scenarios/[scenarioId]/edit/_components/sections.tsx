"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { useUnits } from "@/components/forms";
import {
  COMPONENT_KEYS,
  FIRST_COST_ITEMS,
  MONTE_CARLO_INPUTS,
  PERIODIC_ITEM_KINDS,
  SENSITIVITY_INPUTS,
  SENSITIVITY_INPUT_MODES,
  BREAK_EVEN_INPUTS,
  type MonteCarloInputKey,
} from "@/lib/engine/economics/types";
import { OPTION_KIND_LABELS, OPTION_KINDS, type OptionKind } from "@/lib/engine/types";
import { componentLifeDefaultsYears } from "@/lib/scenarios/schema-economics";
import { newOptionOfKind } from "@/lib/scenarios/prefill";
import { CondenserConstructionGroup, EvaporativeCondenserGroups, SprayPumpFields } from "./condenser-fields";
import { CarbonPriceGroup, FootprintGroup, RefrigerantField } from "./footprint-fields";
import { unitLabel } from "@/lib/units";
import type {
  EconomicsPartId,
  EditorOption,
  EditorPath,
  EditorValues,
  OptionPartId,
} from "@/lib/scenarios/editor-values";
import { MC_LABELS } from "@/lib/scenarios/field-labels";
import { Check, Choice, FlowField, Group, Num, Pct, Plain, ScaledField, Text } from "./fields";
import { CoolerWetRatings, TowerRatingPoints } from "./rating-points";
import { OnDemand } from "./on-demand";

type V = EditorValues;

export const FIRST_COST_LABELS: Record<(typeof FIRST_COST_ITEMS)[number], string> = {
  equipment: "Equipment",
  installation: "Installation",
  structureAndCrane: "Structure and crane",
  electrical: "Electrical",
  controls: "Controls",
  plateExchanger: "Plate exchanger",
  waterTreatmentEquipment: "Water-treatment equipment",
  meters: "Meters",
  other: "Other",
};

const COMPONENT_LABELS: Record<(typeof COMPONENT_KEYS)[number], string> = {
  fill: "Fill",
  coil: "Coil",
  fanMotor: "Fan motor",
  gearbox: "Gearbox",
  exchangerPlates: "Exchanger plates",
  pumps: "Pumps",
  sprayPump: "Spray pump",
  variableSpeedDrive: "Variable-speed drive",
  driftEliminators: "Drift eliminators",
  condenserWearPart: "Condenser tube bundle or gasket set",
  other: "Other",
};

const PERIODIC_LABELS: Record<(typeof PERIODIC_ITEM_KINDS)[number], string> = {
  eddyCurrentTesting: "Eddy-current testing of condenser tubes",
  basinDisinfection: "Basin cleaning and disinfection",
  exchangerCleaning: "Plate-exchanger opening and cleaning",
  coilExteriorDescaling: "Coil exterior descaling",
  fillCleaning: "Fill cleaning",
  other: "Other",
};

export function Section({
  id,
  title,
  children,
  intro,
  action,
  nav,
}: {
  id: string;
  title: string;
  children: React.ReactNode;
  intro?: React.ReactNode;
  action?: React.ReactNode;
  /** The step's parts, when it is shown a part at a time. */
  nav?: React.ReactNode;
}) {
  return (
    <section
      id={id}
      aria-labelledby={`${id}-title`}
      className="scroll-mt-24 rounded-panel border border-line bg-paper-raised p-panel shadow-panel"
      data-testid={`section-${id}`}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${id}-title`} className="text-lg font-semibold" tabIndex={-1}>
          {title}
        </h2>
        {action}
      </div>
      {intro ? <p className="mt-1 text-sm text-ink-soft">{intro}</p> : null}
      {nav}
      <div className="mt-4 space-y-4">{children}</div>
    </section>
  );
}

// --- duty -----------------------------------------------------------------------------------------

export function DutySection() {
  const { setValue } = useFormContext<V>();
  const basis = useWatch<V, "duty.designBasis">({ name: "duty.designBasis" });
  const profile = useWatch<V, "duty.loadProfile">({ name: "duty.loadProfile" });
  const compressor = useWatch<V, "duty.compressorModel">({ name: "duty.compressorModel" });
  const evaporatingC = useWatch<V, "duty.evaporatingC">({ name: "duty.evaporatingC" });
  return (
    <Section id="duty" title="Duty" intro="The heat the loop rejects and the refrigeration cycle it serves.">
      <Group title="Design duty">
        <Choice
          name="duty.designBasis"
          label="Enter the duty as"
          options={[
            { value: "heatRejection", label: "Heat rejection" },
            { value: "refrigeration", label: "Refrigeration load + COP" },
          ]}
        />
        {basis === "refrigeration" ? (
          <Num
            name="duty.designRefrigerationLoadKW"
            label="Design refrigeration load"
            kind="refrigerationTonsKW"
            description="Heat rejected = load × (1 + 1/COP)."
          />
        ) : (
          <Num name="duty.designHeatRejectionKW" label="Design heat rejection" kind="heatDutyMbhKW" />
        )}
        <Plain name="duty.designCop" label="Compressor COP at design" unit="kW/kW" />
        <Num name="duty.evaporatingC" label="Evaporating temperature" kind="temperatureC" />
        <Num name="duty.condensingSetPointC" label="Condensing set-point" kind="temperatureC" />
        <Num
          name="duty.minimumCondensingC"
          label="Minimum condensing temperature"
          kind="temperatureC"
          description="Expansion devices, oil return and defrost set this floor."
        />
        <Choice
          name="duty.headPressureControl"
          label="Head-pressure control"
          options={[
            { value: "fixedSetPoint", label: "Fans hold the set-point" },
            { value: "floating", label: "Floating head pressure (down to the minimum)" },
          ]}
        />
        <RefrigerantField />
      </Group>
      <Group title="Load profile" note="Fraction of the design heat rejection in each hour.">
        <div>
          <label htmlFor="f-duty-loadProfile-kind" className="block text-sm font-medium">
            Profile
          </label>
          <select
            id="f-duty-loadProfile-kind"
            className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
            value={profile?.kind ?? "constant"}
            onChange={(e) => {
              const k = e.target.value;
              if (k === "constant")
                setValue(
                  "duty.loadProfile",
                  { kind: "constant", fraction: 1 },
                  { shouldDirty: true, shouldValidate: true },
                );
              if (k === "linearInDryBulb")
                setValue(
                  "duty.loadProfile",
                  {
                    kind: "linearInDryBulb",
                    lowDryBulbC: 0,
                    fractionAtLowDryBulb: 0.6,
                    highDryBulbC: 32,
                    fractionAtHighDryBulb: 1,
                  },
                  { shouldDirty: true, shouldValidate: true },
                );
            }}
          >
            <option value="constant">Constant fraction</option>
            <option value="linearInDryBulb">Linear in dry-bulb</option>
            {profile?.kind === "monthHour" ? (
              <option value="monthHour">Month × hour table (edit in the JSON document)</option>
            ) : null}
            {profile?.kind === "perBin" ? (
              <option value="perBin">Per climate bin (edit in the JSON document)</option>
            ) : null}
          </select>
          <p className="mt-1 text-xs text-ink-faint">
            Default · constant 100 % · [practice] conservative: the design load in every hour
          </p>
        </div>
        {profile?.kind === "constant" ? (
          <Pct name="duty.loadProfile.fraction" label="Fraction of design" />
        ) : null}
        {profile?.kind === "linearInDryBulb" ? (
          <>
            <Num name="duty.loadProfile.lowDryBulbC" label="Low dry-bulb point" kind="temperatureC" />
            <Pct name="duty.loadProfile.fractionAtLowDryBulb" label="Fraction at the low point" />
            <Num name="duty.loadProfile.highDryBulbC" label="High dry-bulb point" kind="temperatureC" />
            <Pct name="duty.loadProfile.fractionAtHighDryBulb" label="Fraction at the high point" />
          </>
        ) : null}
      </Group>
      <Group
        title="Compressor power"
        note="Every option pays its own compressor energy at the condensing temperature it reaches in each hour."
      >
        <div>
          <label htmlFor="f-duty-compressorModel-kind" className="block text-sm font-medium">
            Model of compressor power vs condensing temperature
          </label>
          <select
            id="f-duty-compressorModel-kind"
            className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
            value={compressor?.kind ?? "refrigerantCycle"}
            onChange={(e) => {
              const k = e.target.value;
              setValue(
                "duty.compressorModel",
                k === "percentPerK"
                  ? { kind: "percentPerK", percentPerK: 3, floorFraction: 0.4 }
                  : k === "manufacturer"
                    ? {
                        kind: "manufacturer",
                        curves: [
                          {
                            evaporatingC: evaporatingC ?? -10,
                            points: [25, 35, 45].map((t) => ({ condensingC: t, cop: undefined })),
                          },
                        ],
                      }
                    : k === "carnotFraction"
                      ? { kind: "carnotFraction" }
                      : { kind: "refrigerantCycle" },
                { shouldDirty: true, shouldValidate: true },
              );
            }}
          >
            <option value="refrigerantCycle">Refrigerant cycle of the plant, scaled to the design COP</option>
            <option value="manufacturer">
              The manufacturer&apos;s data (COP at three or more condensing temperatures)
            </option>
            <option value="percentPerK">Entered percent per degree (compounding, with a floor)</option>
            <option value="carnotFraction">Carnot fraction (the simplest model)</option>
          </select>
          <p className="mt-1 text-xs text-ink-faint">
            Default · refrigerant cycle · single-stage saturated R-717 or R-134a cycle fitted to CoolProp
            reference-library values (Methods §5)
          </p>
        </div>
        {compressor?.kind === "refrigerantCycle" ? (
          <Choice
            name="duty.compressorModel.refrigerant"
            label="Cycle"
            options={[
              { value: "", label: "The plant's refrigerant" },
              { value: "R717", label: "Ammonia (R-717)" },
              { value: "R134a", label: "R-134a" },
            ]}
          />
        ) : null}
        {compressor?.kind === "percentPerK" ? (
          <>
            <Num
              name="duty.compressorModel.percentPerK"
              label="Compressor power rise"
              kind="percentPerK"
              description="2–4 %/K in industrial refrigeration [practice]."
            />
            <Pct name="duty.compressorModel.floorFraction" label="Never below (of design power)" />
          </>
        ) : null}
        {compressor?.kind === "manufacturer" ? <CompressorDataTable /> : null}
      </Group>
    </Section>
  );
}

/** The manufacturer's compressor points at the first suction temperature (a second one: JSON document). */
function CompressorDataTable() {
  const { fields, append, remove } = useFieldArray<V, "duty.compressorModel.curves.0.points">({
    name: "duty.compressorModel.curves.0.points",
  });
  return (
    <div className="space-y-2 sm:col-span-2 xl:col-span-3" data-testid="compressor-data">
      <Num
        name="duty.compressorModel.curves.0.evaporatingC"
        label="Suction (evaporating) temperature"
        kind="temperatureC"
      />
      {fields.map((f, j) => (
        <div key={f.id} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2">
          <Num
            name={`duty.compressorModel.curves.0.points.${j}.condensingC`}
            label={`Point ${j + 1}: condensing`}
            kind="temperatureC"
          />
          <Plain name={`duty.compressorModel.curves.0.points.${j}.cop`} label="COP" unit="kW/kW" />
          <button
            type="button"
            className="mb-1 rounded border border-line px-2 py-1 text-xs"
            onClick={() => remove(j)}
            disabled={fields.length <= 3}
          >
            Remove
          </button>
        </div>
      ))}
      <button
        type="button"
        className="rounded border border-line px-2 py-1 text-xs"
        onClick={() => append({ condensingC: 50 })}
        disabled={fields.length >= 12}
      >
        Add a point
      </button>
      <p className="text-xs text-ink-faint">
        Rising condensing temperatures, falling COP; interpolated monotonically, warned outside the points.
      </p>
    </div>
  );
}

// --- options --------------------------------------------------------------------------------------

function FirstCostGroup({ i, kind }: { i: number; kind: OptionKind }) {
  const { currency } = useUnits();
  return (
    <Group
      title="First cost"
      note={`No defaults: enter the quoted amounts from the selection (${currency}). Until one is entered the scenario still analyses and its life-cycle cost says “first costs missing”; once one item is entered, the items left empty count as 0.`}
    >
      {FIRST_COST_ITEMS.filter((k) => k !== "plateExchanger" || kind === "openTowerPlateHx").map((k) => (
        <Num key={k} name={`options.${i}.costs.firstCost.${k}`} label={FIRST_COST_LABELS[k]} kind="money" />
      ))}
    </Group>
  );
}

function ComponentsList({ i }: { i: number }) {
  const { control } = useFormContext<V>();
  const { fields, append, remove } = useFieldArray<V, `options.${number}.costs.components`>({
    control,
    name: `options.${i}.costs.components`,
  });
  return (
    <fieldset className="rounded-md border border-line p-4">
      <legend className="px-1 text-sm font-semibold">Component replacements</legend>
      {fields.length === 0 ? (
        <p className="text-xs text-ink-soft">None entered: components are replaced with the whole unit.</p>
      ) : null}
      <div className="space-y-3">
        {fields.map((f, j) => (
          <div key={f.id} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_1fr_auto]">
            <Choice
              name={`options.${i}.costs.components.${j}.component`}
              label="Component"
              options={COMPONENT_KEYS.map((k) => ({ value: k, label: COMPONENT_LABELS[k] }))}
            />
            <Num name={`options.${i}.costs.components.${j}.lifeYears`} label="Life" kind="years" />
            <Num
              name={`options.${i}.costs.components.${j}.replacementCost`}
              label="Cost per replacement"
              kind="money"
            />
            <button
              type="button"
              onClick={() => remove(j)}
              className="mb-5 rounded-md border border-line-strong px-2 py-2 text-xs hover:bg-paper-sunk"
            >
              Remove
            </button>
          </div>
        ))}
      </div>
      <button
        type="button"
        className="mt-3 rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk"
        onClick={() =>
          append({
            component: "fill",
            lifeYears: Number(componentLifeDefaultsYears.fill.default),
            replacementCost: 0,
          })
        }
      >
        Add a component
      </button>
      <p className="mt-1 text-xs text-ink-faint">
        Suggested lives:{" "}
        {COMPONENT_KEYS.slice(0, 7)
          .map(
            (k) => `${COMPONENT_LABELS[k].toLowerCase()} ${String(componentLifeDefaultsYears[k].default)} y`,
          )
          .join(", ")}{" "}
        ([practice]/[memory], see sources in the schema).
      </p>
    </fieldset>
  );
}

function PeriodicList({ i }: { i: number }) {
  const { control } = useFormContext<V>();
  const { fields, append, remove } = useFieldArray<V, `options.${number}.costs.upkeep.periodicItems`>({
    control,
    name: `options.${i}.costs.upkeep.periodicItems`,
  });
  return (
    <fieldset className="rounded-md border border-line p-4">
      <legend className="px-1 text-sm font-semibold">Periodic upkeep</legend>
      {fields.length === 0 ? (
        <p className="text-xs text-ink-soft">
          None entered (eddy-current testing, disinfection, exchanger or coil cleaning…).
        </p>
      ) : null}
      <div className="space-y-3">
        {fields.map((f, j) => (
          <div key={f.id} className="grid items-end gap-3 sm:grid-cols-[1.4fr_1fr_1fr_1fr_auto]">
            <Choice
              name={`options.${i}.costs.upkeep.periodicItems.${j}.kind`}
              label="Item"
              options={PERIODIC_ITEM_KINDS.map((k) => ({ value: k, label: PERIODIC_LABELS[k] }))}
            />
            <Num
              name={`options.${i}.costs.upkeep.periodicItems.${j}.everyYears`}
              label="Every"
              kind="years"
            />
            <Num
              name={`options.${i}.costs.upkeep.periodicItems.${j}.costPerEvent`}
              label="Cost per event"
              kind="money"
            />
            <Num
              name={`options.${i}.costs.upkeep.periodicItems.${j}.labourHoursPerEvent`}
              label="Own labour per event"
              kind="hours"
            />
            <button
              type="button"
              onClick={() => remove(j)}
              className="mb-5 rounded-md border border-line-strong px-2 py-2 text-xs hover:bg-paper-sunk"
            >
              Remove
            </button>
          </div>
        ))}
      </div>
      <button
        type="button"
        className="mt-3 rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk"
        onClick={() =>
          append({ kind: "eddyCurrentTesting", everyYears: 3, costPerEvent: 0, labourHoursPerEvent: 0 })
        }
      >
        Add a periodic item
      </button>
    </fieldset>
  );
}

/** An option's fans (its "selection" part). */
function FanGroup({ i }: { i: number }) {
  const p = `options.${i}` as const;
  const fanControl = useWatch<V, `options.${number}.fan.control`>({ name: `options.${i}.fan.control` });
  return (
    <Group title="Fans">
      <Num name={`${p}.fan.designPowerKW`} label="Fan motor input at full speed (all cells)" kind="powerKW" />
      <Choice
        name={`${p}.fan.control`}
        label="Fan control"
        options={[
          { value: "variableSpeed", label: "Variable speed" },
          { value: "twoSpeed", label: "Two-speed" },
          { value: "cycling", label: "On/off cycling" },
        ]}
      />
      <Pct name={`${p}.fan.minSpeedFraction`} label="Minimum speed" />
      <Pct name={`${p}.fan.powerFloorFraction`} label="Power floor at low speed" />
      {fanControl === "twoSpeed" ? <Pct name={`${p}.fan.lowSpeedFraction`} label="Low speed" /> : null}
      <Pct name={`${p}.fan.naturalDraftAirflowFraction`} label="Airflow with the fan off" />
    </Group>
  );
}

/** One option's inputs: its own section of the editor, a part at a time. */
export function OptionSection({
  i,
  part,
  partNav,
  onRemove,
  canRemove,
}: {
  i: number;
  /** The part shown; the others stay in the form's values. */
  part: OptionPartId;
  partNav: React.ReactNode;
  onRemove: () => void;
  canRemove: boolean;
}) {
  const { setValue } = useFormContext<V>();
  const kind = useWatch<V, `options.${number}.kind`>({ name: `options.${i}.kind` });
  const label = useWatch<V, `options.${number}.label`>({ name: `options.${i}.label` });
  const dryRating = useWatch<V, `options.${number}.cooler.dryRating`>({
    name: `options.${i}.cooler.dryRating`,
  });
  const modeSelection = useWatch<V, `options.${number}.cooler.modeSelection`>({
    name: `options.${i}.cooler.modeSelection`,
  });
  const glycolKind = useWatch<V, `options.${number}.cooler.glycol.kind`>({
    name: `options.${i}.cooler.glycol.kind`,
  });
  const p = `options.${i}` as const;
  const isTower = kind === "openTowerDirect" || kind === "openTowerPlateHx";
  return (
    <Section
      id={`option-${i + 1}`}
      title={`Option ${i + 1}: ${label || OPTION_KIND_LABELS[kind]}`}
      intro={`${OPTION_KIND_LABELS[kind]}. Enter the manufacturer's certified selection; every wet option needs water treatment and a water-management programme.`}
      nav={partNav}
      action={
        canRemove ? (
          <button
            type="button"
            onClick={onRemove}
            className="rounded-md border border-line-strong px-2 py-1 text-xs hover:bg-danger-50"
            aria-label={`Remove option ${i + 1}`}
          >
            Remove this option
          </button>
        ) : null
      }
    >
      {part === "selection" ? (
        <>
          <Group title="Identification">
            <Text name={`${p}.label`} label="Label" maxLength={120} />
            <Text
              name={`${p}.id`}
              label="Option id"
              description="Used in exports and as the base-option reference."
              maxLength={64}
            />
          </Group>
          {kind === "evaporativeCondenser" ? (
            <EvaporativeCondenserGroups i={i} part="selection" />
          ) : isTower ? (
            <Group title="Tower selection at design" note="From the manufacturer's certified selection.">
              <FlowField name={`${p}.tower.waterFlowKgPerS`} label="Tower water flow" />
              <Num name={`${p}.tower.enteringWaterC`} label="Entering (hot) water" kind="temperatureC" />
              <Num name={`${p}.tower.leavingWaterC`} label="Leaving (cold) water" kind="temperatureC" />
              <Num name={`${p}.tower.designWetBulbC`} label="Design entering wet-bulb" kind="temperatureC" />
              <Plain name={`${p}.tower.designLiquidToGasRatio`} label="Design L/G" unit="kg/kg" />
              <Plain
                name={`${p}.tower.characteristicExponent`}
                label="Characteristic exponent n"
                unit="—"
                description="KaV/L = C·(L/G)^−n; used where the rating points below cannot fit n"
              />
            </Group>
          ) : (
            <Group title="Cooler selection at design" note="From the manufacturer's certified selection.">
              <FlowField name={`${p}.cooler.fluidFlowKgPerS`} label="Process fluid flow" />
              <Num name={`${p}.cooler.enteringFluidC`} label="Entering fluid" kind="temperatureC" />
              <Num name={`${p}.cooler.leavingFluidC`} label="Leaving fluid" kind="temperatureC" />
              <Num name={`${p}.cooler.designWetBulbC`} label="Design entering wet-bulb" kind="temperatureC" />
              <Plain
                name={`${p}.cooler.designFluidToAirRatio`}
                label="Design fluid-to-air mass ratio"
                unit="kg/kg"
              />
              <Pct
                name={`${p}.cooler.internalResistanceFraction`}
                label="Tube-side share of the wet resistance"
                description="Fitted instead when extra wet ratings (below) can tell it."
              />
              <Plain
                name={`${p}.cooler.dryExternalConductanceFactor`}
                label="Dry external conductance factor"
                unit="—"
              />
              <Check name={`${p}.cooler.allowDryMode`} label="May run dry (spray pump off)" />
              <Choice
                name={`${p}.cooler.modeSelection`}
                label="Wet or dry in each hour"
                options={[
                  { value: "lowestTotalPower", label: "Whichever needs less fan + spray + compressor power" },
                  { value: "switchOverDryBulb", label: "Dry at or below a switch-over dry-bulb" },
                ]}
              />
              {modeSelection === "switchOverDryBulb" ? (
                <Num
                  name={`${p}.cooler.switchOverDryBulbC`}
                  label="Switch-over dry-bulb"
                  kind="temperatureC"
                />
              ) : null}
              <Num
                name={`${p}.cooler.sprayLockoutDryBulbC`}
                label="Spray locked out below dry-bulb"
                kind="temperatureC"
                description="Freeze protection: always dry below it."
              />
              <Num
                name={`${p}.cooler.dryModeMaxDryBulbC`}
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
                        `options.${i}.cooler.dryRating`,
                        e.target.checked
                          ? { enteringFluidC: 35, leavingFluidC: 30, dryBulbC: 10 }
                          : undefined,
                        { shouldDirty: true, shouldValidate: true },
                      )
                    }
                  />
                  I have a dry rating from the manufacturer (calibrates dry operation)
                </label>
              </div>
              {dryRating ? (
                <>
                  <Num
                    name={`${p}.cooler.dryRating.enteringFluidC`}
                    label="Dry rating: entering fluid"
                    kind="temperatureC"
                  />
                  <Num
                    name={`${p}.cooler.dryRating.leavingFluidC`}
                    label="Dry rating: leaving fluid"
                    kind="temperatureC"
                  />
                  <Num
                    name={`${p}.cooler.dryRating.dryBulbC`}
                    label="Dry rating: dry-bulb"
                    kind="temperatureC"
                  />
                </>
              ) : null}
              <Choice
                name={`${p}.cooler.glycol.kind`}
                label="Process fluid"
                options={[
                  { value: "none", label: "Water" },
                  { value: "ethyleneGlycol", label: "Ethylene glycol solution" },
                  { value: "propyleneGlycol", label: "Propylene glycol solution" },
                ]}
              />
              {glycolKind !== "none" ? (
                <Pct name={`${p}.cooler.glycol.massFraction`} label="Glycol mass fraction" />
              ) : null}
              <Choice
                name={`${p}.cooler.ratingFluid`}
                label="The rating is given on"
                options={[
                  { value: "water", label: "Water (derate for glycol)" },
                  { value: "loopFluid", label: "The loop fluid itself" },
                ]}
              />
            </Group>
          )}
          {isTower ? <TowerRatingPoints i={i} /> : null}
          {kind === "closedCircuitCooler" ? <CoolerWetRatings i={i} /> : null}
          <FanGroup i={i} />
        </>
      ) : null}
      {part === "condenser" && kind === "evaporativeCondenser" ? (
        <EvaporativeCondenserGroups i={i} part="condenser" />
      ) : null}
      {part === "condenser" && kind === "openTowerPlateHx" ? (
        <Group title="Plate exchanger">
          <Num
            name={`${p}.plateExchanger.designApproachK`}
            label="Design approach"
            kind="temperatureDifferenceK"
          />
          <Num name={`${p}.plateExchanger.cleanUWPerM2K`} label="Clean U" kind="heatTransferCoefficientWPerM2K" />
          <FlowField
            name={`${p}.plateExchanger.cleanSideFlowKgPerS`}
            label="Clean (condenser) side flow"
            description="Leave empty for the tower's water flow."
          />
          <Num
            name={`${p}.plateExchanger.towerSidePressureDropKPa`}
            label="Tower-side pressure drop"
            kind="pressureDropKPa"
          />
          <Num
            name={`${p}.plateExchanger.cleanSidePressureDropKPa`}
            label="Clean-side pressure drop"
            kind="pressureDropKPa"
          />
          <Plain
            name={`${p}.plateExchanger.foulingGrowthFactor`}
            label="Plate fouling growth vs tubes"
            unit="×"
          />
        </Group>
      ) : null}
      {part === "condenser" && kind !== "evaporativeCondenser" ? (
        <>
          <Group title="Condenser">
            <Num
              name={`${p}.condenser.designCondensingC`}
              label="Design condensing temperature"
              kind="temperatureC"
            />
            <Num
              name={`${p}.condenser.designEnteringWaterC`}
              label="Design entering water"
              kind="temperatureC"
              optional
            />
            <Num
              name={`${p}.condenser.designFoulingM2KPerW`}
              label="Fouling allowance in the design point"
              kind="foulingM2KPerW"
            />
            {kind === "closedCircuitCooler" ? (
              <Pct
                name={`${p}.condenser.waterSideResistanceFraction`}
                label="Water-side share of the clean condenser's resistance"
                description="With glycol in the loop and ratings on water, glycol derates this share."
              />
            ) : null}
          </Group>
          <CondenserConstructionGroup i={i} kind={kind} />
        </>
      ) : null}
      {part === "pumps" ? (
        <Group title="Pumps, basin and drift">
          {kind !== "evaporativeCondenser" ? (
            <>
              <Num
                name={`${p}.condenserPump.headM`}
                label={
                  kind === "closedCircuitCooler"
                    ? "Process-loop pump head"
                    : kind === "openTowerPlateHx"
                      ? "Clean-loop pump head"
                      : "Condenser-water pump head"
                }
                kind="headM"
              />
              <Pct name={`${p}.condenserPump.efficiency`} label="Pump wire-to-water efficiency" />
            </>
          ) : null}
          {kind === "openTowerPlateHx" ? (
            <>
              <Num name={`${p}.towerPump.headM`} label="Tower-side pump head" kind="headM" />
              <Pct name={`${p}.towerPump.efficiency`} label="Tower-side pump efficiency" />
            </>
          ) : null}
          {kind === "closedCircuitCooler" || kind === "evaporativeCondenser" ? (
            <SprayPumpFields i={i} />
          ) : null}
          <Num name={`${p}.basinHeater.powerKW`} label="Basin heater rating" kind="powerKW" />
          <Num
            name={`${p}.basinHeater.setPointC`}
            label="Basin heater thermostat set-point"
            kind="temperatureC"
          />
          <Num
            name={`${p}.basinHeater.heatLossKWPerK`}
            label="Basin heat loss per degree below the set-point"
            kind="uaKWPerK"
            description="The heater supplies this loss, up to its rating, while the basin holds still water."
            optional
          />
          <Check
            name={`${p}.basinHeater.drainedWhenIdle`}
            label="Basin drained whenever no water circulates"
            description="Idle tower, or cooler running dry: no basin heat then."
          />
          <Plain
            name={`${p}.cyclesOfConcentration`}
            label="This loop's own cycles of concentration"
            unit="—"
            description="Leave empty to run at the scenario's cycles (Water); e.g. a cooler's spray loop held lower."
          />
          <ScaledField
            name={`${p}.driftFractionOfFlow`}
            label="Drift"
            unit="% of flow"
            show={(v) => v * 100}
            store={(v) => v / 100}
          />
          <Num name={`${p}.wetLoopVolumeM3`} label="Wet-loop water volume" kind="volumeM3" optional />
        </Group>
      ) : null}
      {part === "costs" ? (
        <>
          <FirstCostGroup i={i} kind={kind} />
          <Group title="Life and upkeep">
            <Num name={`${p}.costs.serviceLifeYears`} label="Service life" kind="years" />
            <Check
              name={`${p}.costs.replaceAtEndOfLife`}
              label="Replace at the end of its life within the study"
            />
            <Num
              name={`${p}.costs.upkeep.annualLabourHours`}
              label="Own staff routine upkeep"
              kind="hours"
              description="Hours per year."
            />
            <Num
              name={`${p}.costs.upkeep.annualServiceCost`}
              label="Service contract, parts, consumables"
              kind="money"
              description="Per year."
            />
            <Num
              name={`${p}.costs.upkeep.cleaningCostPerEvent`}
              label={
                kind === "openTowerDirect"
                  ? "Condenser tube cleaning, per cleaning"
                  : kind === "openTowerPlateHx"
                    ? "Plate-exchanger cleaning, per cleaning"
                    : kind === "evaporativeCondenser"
                      ? "Coil cleaning, per cleaning"
                      : "Cleaning cost per event"
              }
              kind="money"
            />
          </Group>
          <ComponentsList i={i} />
          <PeriodicList i={i} />
        </>
      ) : null}
    </Section>
  );
}

/** The options compared, with buttons to add one of each kind (up to four). */
export function OptionsList({
  options,
  onAdd,
  onOpen,
}: {
  options: { key: string; label: string; kind: OptionKind }[];
  onAdd: (option: EditorOption) => void;
  onOpen: (index: number) => void;
}) {
  const { getValues } = useFormContext<V>();
  const count = options.length;
  return (
    <fieldset className="rounded-md border border-line p-4">
      <legend className="px-1 text-sm font-semibold">Options compared</legend>
      <p className="mb-3 text-xs text-ink-soft">
        Two to four ways of rejecting the heat. Each option is a step of its own in the list of sections.
      </p>
      <ol className="space-y-1 text-sm">
        {options.map((o, i) => (
          <li key={o.key}>
            <button
              type="button"
              className="text-basin-700 underline-offset-2 hover:underline"
              onClick={() => onOpen(i)}
            >
              Option {i + 1}: {o.label || OPTION_KIND_LABELS[o.kind]}
            </button>{" "}
            <span className="text-xs text-ink-faint">({OPTION_KIND_LABELS[o.kind]})</span>
          </li>
        ))}
      </ol>
      <div className="mt-3 flex flex-wrap items-center gap-2" role="group" aria-label="Add an option">
        {count < 4 ? (
          OPTION_KINDS.map((k) => (
            <button
              key={k}
              type="button"
              className="rounded-md border border-line-strong bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk"
              onClick={() =>
                onAdd(
                  newOptionOfKind(
                    k,
                    (getValues("options") ?? []).map((o) => o.id),
                  ),
                )
              }
            >
              Add {OPTION_KIND_LABELS[k].toLowerCase()}
            </button>
          ))
        ) : (
          <p className="text-sm text-ink-soft">
            Four options is the most one scenario compares; clone the scenario for more.
          </p>
        )}
      </div>
    </fieldset>
  );
}

// --- water ----------------------------------------------------------------------------------------

export function WaterSection() {
  const { system, currency } = useUnits();
  const cyclesMode = useWatch<V, "water.cyclesMode">({ name: "water.cyclesMode" });
  return (
    <Section
      id="water"
      title="Water"
      intro="Makeup chemistry and limits give the cycles of concentration; prices turn evaporation, blowdown and drift into cost."
    >
      <Group
        title="Makeup-water analysis"
        note="From the utility's or a laboratory's analysis of the makeup water."
      >
        <Num
          name="water.makeup.calciumHardnessMgPerLAsCaCO3"
          label="Calcium hardness (as CaCO₃)"
          kind="concentrationMgPerL"
        />
        <Num
          name="water.makeup.mAlkalinityMgPerLAsCaCO3"
          label="M-alkalinity (as CaCO₃)"
          kind="concentrationMgPerL"
        />
        <Num name="water.makeup.silicaMgPerL" label="Silica (SiO₂)" kind="concentrationMgPerL" />
        <Num name="water.makeup.chlorideMgPerL" label="Chloride" kind="concentrationMgPerL" />
        <Num name="water.makeup.tdsMgPerL" label="Total dissolved solids" kind="concentrationMgPerL" />
        <Plain name="water.makeup.ph" label="pH" unit="pH" />
        <Num
          name="water.makeup.conductivityUSPerCm"
          label="Conductivity"
          kind="conductivityUSPerCm"
          optional
        />
      </Group>
      <Group title="Cycles of concentration">
        <Choice
          name="water.cyclesMode"
          label="Cycles"
          options={[
            { value: "fromChemistry", label: "From the makeup analysis and the limits" },
            { value: "entered", label: "Entered" },
          ]}
        />
        {cyclesMode === "entered" ? (
          <Plain name="water.cyclesOfConcentration" label="Cycles of concentration" unit="—" />
        ) : null}
        <Num name="water.limits.silicaMgPerL" label="Silica limit" kind="concentrationMgPerL" />
        <Num name="water.limits.chlorideMgPerL" label="Chloride limit" kind="concentrationMgPerL" />
        <Num name="water.limits.tdsMgPerL" label="TDS limit" kind="concentrationMgPerL" />
        <Num
          name="water.limits.calciumHardnessMgPerLAsCaCO3"
          label="Calcium hardness limit"
          kind="concentrationMgPerL"
        />
        <Plain name="water.recirculatingPh" label="Recirculating-water pH" unit="pH" />
      </Group>
      <Group
        title="Scale control"
        note="Langelier index at the hottest wetted surface and the cycles each loop achieves."
      >
        <Plain
          name="water.scaleControl.maximumLangelierIndex"
          label="Highest Langelier index accepted"
          unit="LSI"
        />
        <Check
          name="water.scaleControl.acidFeed"
          label="Feed sulfuric acid to hold it"
          description="Concentrated acid is hazardous: bunded storage, pH-interlocked feed, protective equipment."
        />
        <Pct name="water.scaleControl.acidStrengthFraction" label="Acid product strength (H₂SO₄)" />
      </Group>
      <Group title="Water and sewer prices">
        <Num name="tariffs.water.pricePerM3" label="Water price" kind="pricePerM3" />
        <Num
          name="tariffs.water.fixedChargePerMonth"
          label="Water fixed charge"
          kind="money"
          description="Per month."
        />
        <Num name="tariffs.sewer.pricePerM3" label="Sewer price" kind="pricePerM3" />
        <Num
          name="tariffs.sewer.fixedChargePerMonth"
          label="Sewer fixed charge"
          kind="money"
          description="Per month."
        />
        <Choice
          name="water.sewerBasis"
          label="Sewer billed on"
          options={[
            { value: "makeup", label: "All makeup (no credit)" },
            { value: "makeupMinusEvaporation", label: "Makeup less evaporation (blowdown + drift)" },
            { value: "blowdown", label: "Metered blowdown only" },
          ]}
          description="A credit needs meters and the utility's consent."
        />
        <Num
          name="tariffs.sewer.evaporationCreditMeterChargePerMonth"
          label="Credit-meter charge"
          kind="money"
          description="Per month, where the credit applies."
        />
      </Group>
      <Group
        title="Treatment chemicals and the water-management programme"
        note="Every wet loop (tower basins and the cooler's spray loop) needs both."
      >
        <Num
          name="tariffs.chemicals.costPerM3Outflow"
          label="Treatment programme per volume of blowdown + drift"
          kind="pricePerM3"
        />
        <Num name="tariffs.chemicals.inhibitorPricePerKg" label="Inhibitor product price" kind="pricePerKg" />
        <Num name="tariffs.chemicals.biocidePricePerKg" label="Biocide product price" kind="pricePerKg" />
        <Num name="tariffs.chemicals.acidPricePerKg" label="Acid product price" kind="pricePerKg" />
        <Num
          name="tariffs.chemicals.fixedCostPerYear"
          label="Vendor service and testing, per wet loop"
          kind="money"
          description="Per year."
        />
        <Num
          name="tariffs.waterManagementProgrammeCostPerYear"
          label="Water-management programme (Legionella), per wet loop"
          kind="money"
          description="Per year: plan, monitoring, sampling, validation."
        />
        <Num
          name="water.dosing.inhibitorMgPerLOutflow"
          label="Inhibitor dose in the blowdown"
          kind="concentrationMgPerL"
        />
        <Num
          name="water.dosing.biocideMgPerLSystemVolume"
          label="Biocide slug dose"
          kind="concentrationMgPerL"
        />
        <Plain name="water.dosing.biocideSlugsPerYear" label="Biocide slugs" unit="per year" />
      </Group>
      <p className="text-xs text-ink-faint">
        Prices in {currency} per {unitLabel("pricePerM3", system, currency).split("/")[1]}; the engine stores{" "}
        {currency}/m³.
      </p>
    </Section>
  );
}

// --- upkeep and fouling ------------------------------------------------------------------------------

export function UpkeepSection() {
  const model = useWatch<V, "fouling.model">({ name: "fouling.model" });
  const { currency } = useUnits();
  return (
    <Section
      id="upkeep"
      title="Upkeep and fouling"
      intro="Condenser fouling grows between cleanings and raises the condensing temperature; each cleaning resets it."
    >
      <Group title="Fouling of the open-tower condenser">
        <Choice
          name="fouling.model"
          label="Growth"
          options={[
            { value: "asymptotic", label: "Asymptotic (Kern & Seaton)" },
            { value: "linear", label: "Linear" },
          ]}
        />
        {model === "linear" ? (
          <Num
            name="fouling.linearRateM2KPerWPerMonth"
            label="Growth per month"
            kind="foulingM2KPerW"
            description="Resistance added each month."
          />
        ) : (
          <>
            <Num
              name="fouling.asymptoticM2KPerW"
              label="Asymptotic fouling resistance"
              kind="foulingM2KPerW"
            />
            <Num name="fouling.timeConstantMonths" label="Time constant" kind="months" />
          </>
        )}
        <Num name="fouling.limitM2KPerW" label="Fouling limit before cleaning" kind="foulingM2KPerW" />
        <Num
          name="fouling.condenserCleaningIntervalMonths"
          label="Condenser tube cleaning every"
          kind="months"
        />
        <Num
          name="fouling.plateExchangerCleaningIntervalMonths"
          label="Plate-exchanger cleaning every"
          kind="months"
        />
        <Num
          name="fouling.closedLoopFoulingM2KPerW"
          label="Fouling of condensers on a closed loop"
          kind="foulingM2KPerW"
        />
      </Group>
      <Group title="Labour">
        <Plain name="upkeep.labourRatePerHour" label="Loaded labour rate" unit={`${currency}/h`} />
      </Group>
      <p className="text-xs text-ink-faint">
        Each option&apos;s own upkeep (routine hours, service contract, cleaning cost, periodic items,
        component lives) is in its card under Options.
      </p>
    </Section>
  );
}

// --- tariffs -----------------------------------------------------------------------------------------

export function TariffsSection() {
  const { currency } = useUnits();
  const pricing = useWatch<V, "tariffs.electricity.pricing">({ name: "tariffs.electricity.pricing" });
  return (
    <Section
      id="tariffs"
      title="Tariffs"
      intro="Electricity, and the real escalation of every cost stream (above general inflation)."
    >
      <Group title="Electricity">
        {pricing === "monthHour" ? (
          <p className="text-sm text-ink-soft sm:col-span-2">
            Month × hour prices (288 values) are kept from the JSON document; the flat price below is not
            used.
          </p>
        ) : null}
        <Num name="tariffs.electricity.energyPricePerKWh" label="Energy price" kind="pricePerKWh" />
        <Plain
          name="tariffs.electricity.demandChargePerKWMonth"
          label="Demand charge"
          unit={`${currency}/(kW·month)`}
        />
        <Pct
          name="tariffs.electricity.demandCoincidenceFactor"
          label="Share of the option's peak in the billed peak"
        />
      </Group>
      <Group
        title="Real escalation"
        note="Fraction per year above general inflation; 0 keeps a price constant in real terms."
      >
        <Pct name="tariffs.escalation.energy" label="Electric energy" perYear />
        <Pct name="tariffs.escalation.demand" label="Electric demand" perYear />
        <Pct name="tariffs.escalation.water" label="Water" perYear />
        <Pct name="tariffs.escalation.sewer" label="Sewer" perYear />
        <Pct name="tariffs.escalation.chemicals" label="Chemicals" perYear />
        <Pct name="tariffs.escalation.labour" label="Labour" perYear />
        <Pct name="tariffs.escalation.replacements" label="Replacements" perYear />
      </Group>
      <CarbonPriceGroup />
    </Section>
  );
}

// --- economics ---------------------------------------------------------------------------------------

const TORNADO_LABELS: Record<(typeof SENSITIVITY_INPUTS)[number], string> = {
  waterPrice: "Water price",
  sewerPrice: "Sewer price",
  electricityPrice: "Electricity price",
  electricityEscalation: "Electricity escalation",
  cyclesOfConcentration: "Cycles of concentration",
  discountRate: "Discount rate",
  firstCostPremium: "Extra first cost",
  foulingRate: "Fouling rate",
  load: "Heat-rejection load",
  waterAndSewerEscalation: "Water and sewer escalation",
};

const BREAK_EVEN_LABELS: Record<(typeof BREAK_EVEN_INPUTS)[number], string> = {
  waterAndSewerPrice: "Water + sewer price (factor)",
  electricityPrice: "Electricity price (factor)",
  cyclesOfConcentration: "Cycles of concentration",
  firstCostPremium: "Extra first cost (factor)",
};

function DistField({
  pct,
  unit,
  name,
  label,
  kind,
}: {
  pct: boolean;
  unit: string;
  name: EditorPath;
  label: string;
  kind?: "temperatureDifferenceK";
}) {
  if (kind) return <Num name={name} label={label} kind={kind} />;
  return pct ? <Pct name={name} label={label} perYear /> : <Plain name={name} label={label} unit={unit} />;
}

function DistributionRow({ k }: { k: MonteCarloInputKey }) {
  const { setValue } = useFormContext<V>();
  const name = `monteCarlo.distributions.${k}` as const;
  const d = useWatch<V, `monteCarlo.distributions.${MonteCarloInputKey}`>({ name });
  const m = MC_LABELS[k];
  const unit = k === "cyclesOfConcentration" ? "cycles" : "×";
  return (
    <div className="grid items-end gap-3 rounded-md border border-line px-3 py-2 sm:grid-cols-4">
      <div>
        <label htmlFor={`f-${name.replace(/\./g, "-")}-type`} className="block text-sm font-medium">
          {m.label}
        </label>
        <select
          id={`f-${name.replace(/\./g, "-")}-type`}
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
          value={d?.type ?? "none"}
          onChange={(e) => {
            const t = e.target.value;
            const shift = k === "climateShiftK";
            const centre = m.pct || shift ? 0 : k === "cyclesOfConcentration" ? 4 : 1;
            const lo = m.pct ? -0.01 : shift ? -0.5 : centre * 0.8;
            const hi = m.pct ? 0.01 : shift ? 2 : centre * 1.25;
            setValue(
              name,
              t === "none"
                ? undefined
                : t === "uniform"
                  ? { type: "uniform", min: lo, max: hi }
                  : { type: "triangular", min: lo, mode: centre, max: hi },
              {
                shouldDirty: true,
                shouldValidate: true,
              },
            );
          }}
        >
          <option value="none">Not varied</option>
          <option value="triangular">Triangular</option>
          <option value="uniform">Uniform</option>
        </select>
      </div>
      {d?.type ? (
        <DistField
          pct={m.pct}
          unit={unit}
          name={`${name}.min`}
          label="Min"
          {...(m.kind ? { kind: m.kind } : {})}
        />
      ) : null}
      {d?.type === "triangular" ? (
        <DistField
          pct={m.pct}
          unit={unit}
          name={`${name}.mode`}
          label="Most likely"
          {...(m.kind ? { kind: m.kind } : {})}
        />
      ) : null}
      {d?.type ? (
        <DistField
          pct={m.pct}
          unit={unit}
          name={`${name}.max`}
          label="Max"
          {...(m.kind ? { kind: m.kind } : {})}
        />
      ) : null}
    </div>
  );
}

/** Its own component: it watches every option's id and label, and only it re-renders when they change. */
function BaseOptionChoice() {
  const options = useWatch<V, "options">({ name: "options" }) ?? [];
  return (
    <Choice
      name="economics.baseOptionId"
      label="Base option (measures are against it)"
      options={[
        { value: "", label: "The first option" },
        ...options.map((o) => ({ value: o.id, label: o.label || o.id })),
      ]}
    />
  );
}

/** The study, the sensitivity, the Monte Carlo and the footprint: a part at a time. */
export function EconomicsSection({ part, partNav }: { part: EconomicsPartId; partNav: React.ReactNode }) {
  const sensitivityOn = useWatch<V, "sensitivity.enabled">({ name: "sensitivity.enabled" });
  const mcOn = useWatch<V, "monteCarlo.enabled">({ name: "monteCarlo.enabled" });
  return (
    <Section
      id="economics"
      title="Economics"
      intro="NIST Handbook 135 life-cycle cost: present values at one base date, constant dollars unless a nominal analysis is chosen."
      nav={partNav}
    >
      {part === "study" ? (
        <Group title="Study">
          <Plain name="economics.baseYear" label="Base year" unit="year" />
          <Num name="economics.studyPeriodYears" label="Study period" kind="years" />
          <Choice
            name="economics.analysis"
            label="Dollars"
            options={[
              { value: "real", label: "Constant (real)" },
              { value: "nominal", label: "Then-current (nominal)" },
            ]}
          />
          <Pct name="economics.realDiscountRate" label="Real discount rate" perYear />
          <Pct name="economics.inflationRate" label="General inflation" perYear />
          <Choice
            name="economics.discounting"
            label="Discounting of yearly costs"
            options={[
              { value: "endOfYear", label: "End of year" },
              { value: "midYear", label: "Mid-year" },
            ]}
          />
          <Choice
            name="economics.residualValueMethod"
            label="Residual value"
            options={[
              { value: "linear", label: "Linear by remaining life" },
              { value: "none", label: "None" },
            ]}
          />
          <BaseOptionChoice />
        </Group>
      ) : null}
      {part === "sensitivity" ? (
        <fieldset className="rounded-md border border-line p-4">
          <legend className="px-1 text-sm font-semibold">Sensitivity: tornado and break-even ranges</legend>
          <Check name="sensitivity.enabled" label="Run the tornado and break-evens" />
          {sensitivityOn ? (
            <div className="mt-3 space-y-3">
              <OnDemand
                prefixes={["sensitivity.tornado", "sensitivity.breakEven"]}
                summary={`the ${SENSITIVITY_INPUTS.length} tornado ranges and ${BREAK_EVEN_INPUTS.length} break-even searches`}
                testId="sensitivity-ranges"
              >
                {() => (
                  <>
                    {SENSITIVITY_INPUTS.map((k) => {
                      const mode = SENSITIVITY_INPUT_MODES[k];
                      const base = `sensitivity.tornado.${k}` as const;
                      return (
                        <div key={k} className="grid items-end gap-3 sm:grid-cols-[1.3fr_1fr_1fr]">
                          <Check
                            name={`${base}.enabled`}
                            label={`${TORNADO_LABELS[k]} (${mode === "factor" ? "× the entered value" : mode === "delta" ? "added to the entered rate" : "absolute value"})`}
                          />
                          {mode === "delta" ? (
                            <>
                              <Pct name={`${base}.low`} label="Low" perYear />
                              <Pct name={`${base}.high`} label="High" perYear />
                            </>
                          ) : (
                            <>
                              <Plain
                                name={`${base}.low`}
                                label="Low"
                                unit={mode === "factor" ? "×" : "cycles"}
                              />
                              <Plain
                                name={`${base}.high`}
                                label="High"
                                unit={mode === "factor" ? "×" : "cycles"}
                              />
                            </>
                          )}
                        </div>
                      );
                    })}
                    <h3 className="pt-2 text-sm font-semibold">Break-even search ranges</h3>
                    {BREAK_EVEN_INPUTS.map((k) => (
                      <div key={k} className="grid items-end gap-3 sm:grid-cols-[1.3fr_1fr_1fr]">
                        <Check name={`sensitivity.breakEven.${k}.enabled`} label={BREAK_EVEN_LABELS[k]} />
                        <Plain
                          name={`sensitivity.breakEven.${k}.min`}
                          label="From"
                          unit={k === "cyclesOfConcentration" ? "cycles" : "×"}
                        />
                        <Plain
                          name={`sensitivity.breakEven.${k}.max`}
                          label="To"
                          unit={k === "cyclesOfConcentration" ? "cycles" : "×"}
                        />
                      </div>
                    ))}
                  </>
                )}
              </OnDemand>
            </div>
          ) : null}
        </fieldset>
      ) : null}
      {part === "monte-carlo" ? (
        <fieldset className="rounded-md border border-line p-4" id="uncertainty">
          <legend className="px-1 text-sm font-semibold">Uncertainty: Monte Carlo</legend>
          <Check name="monteCarlo.enabled" label="Run the Monte Carlo after each save (in the background)" />
          {mcOn ? (
            <div className="mt-3 space-y-3">
              <div className="grid gap-4 sm:grid-cols-3">
                <Num name="monteCarlo.draws" label="Draws" kind="count" />
                <Num name="monteCarlo.seed" label="Seed" kind="count" />
                <Num name="monteCarlo.histogramBins" label="Histogram bins" kind="count" />
              </div>
              <OnDemand
                prefixes={["monteCarlo.distributions"]}
                summary={`the ${MONTE_CARLO_INPUTS.length} input distributions`}
                testId="monte-carlo-distributions"
              >
                {() => MONTE_CARLO_INPUTS.map((k) => <DistributionRow key={k} k={k} />)}
              </OnDemand>
            </div>
          ) : null}
        </fieldset>
      ) : null}
      {part === "footprint" ? <FootprintGroup /> : null}
    </Section>
  );
}
