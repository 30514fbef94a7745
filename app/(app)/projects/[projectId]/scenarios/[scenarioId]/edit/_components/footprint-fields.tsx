"use client";

import { useWatch } from "react-hook-form";
import { useUnits } from "@/components/forms";
import { GWP_REPORTS, GWP_REPORT_LABELS, REFRIGERANTS, REFRIGERANT_LABELS } from "@/lib/engine/refrigerants";
import { DEFAULT_GRID_EMISSION_FACTOR } from "@/lib/engine/footprint";
import type { EditorValues } from "@/lib/scenarios/editor-values";
import { Check, Choice, Group, Pct, Plain, Text } from "./fields";

type V = EditorValues;

/** The plant's refrigerant: it sets condenser materials, the inventory's GWP and the process-safety cautions. */
export function RefrigerantField() {
  return (
    <Choice
      name="duty.refrigerant"
      label="Refrigerant"
      options={REFRIGERANTS.map((r) => ({ value: r, label: REFRIGERANT_LABELS[r] }))}
      description="Sets the condensers' default materials, the refrigerant inventory and its global warming potential."
    />
  );
}

/** Grid emission factor (with its year and source), GWP basis and leak rate. */
export function FootprintGroup() {
  return (
    <Group
      title="Footprint: emissions"
      note="Emissions per year = electricity × grid factor + leak rate × refrigerant inventory × GWP (ammonia's is 0). Enter the project's own grid or supplier factor and its year."
    >
      <Plain
        name="footprint.gridEmissionFactorKgCO2ePerKWh"
        label="Grid emission factor"
        unit="kg CO₂e/kWh"
      />
      <Plain
        name="footprint.gridEmissionFactorYear"
        label="Year of the grid factor"
        unit="year"
        noDefault
        description={`Default ${DEFAULT_GRID_EMISSION_FACTOR.value.dataYear} · the data year of the default factor; enter the year of the project's own factor.`}
      />
      <Text name="footprint.gridEmissionFactorSource" label="Source of the grid factor" maxLength={300} />
      <Choice
        name="footprint.gwpReport"
        label="IPCC assessment report for GWP"
        options={GWP_REPORTS.map((r) => ({ value: r, label: GWP_REPORT_LABELS[r] }))}
      />
      <Pct name="footprint.annualLeakFraction" label="Refrigerant leak rate" perYear />
    </Group>
  );
}

/** The optional carbon price, a cost stream of its own with its own escalation (off by default). */
export function CarbonPriceGroup() {
  const { currency } = useUnits();
  const enabled = useWatch<V, "tariffs.carbon.enabled">({ name: "tariffs.carbon.enabled" });
  return (
    <Group
      title="Carbon price"
      note="Off by default. When on, each option's emissions are priced per tonne of CO₂e in its life-cycle cost."
    >
      <Check name="tariffs.carbon.enabled" label="Price carbon emissions" />
      {enabled ? (
        <>
          <Plain name="tariffs.carbon.pricePerTonneCO2e" label="Carbon price" unit={`${currency}/t CO₂e`} />
          <Pct name="tariffs.escalation.carbon" label="Escalation of the carbon price" perYear />
        </>
      ) : null}
    </Group>
  );
}
