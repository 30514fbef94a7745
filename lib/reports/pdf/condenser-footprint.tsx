import { View } from "@react-pdf/renderer";
import {
  condenserPlanTable,
  footprintTable,
  inventoryCautionTexts,
  type OptionRowsTable,
  type PlanRow,
} from "../condenser-footprint";
import type { ReportSource } from "../types";
import { H1, H3, Note, P, T, Table, type Column } from "./primitives";
import { S } from "./theme";

function columnsOf(table: OptionRowsTable): Column<PlanRow>[] {
  return [
    { title: "", width: 2.2, cell: (r) => r.label },
    ...table.columns.map((c, i) => ({
      title: c.label,
      width: 1.6,
      cell: (r: PlanRow) => r.cells[i]?.text ?? "—",
    })),
  ];
}

/**
 * Each option's condenser construction and upkeep plan, its refrigerant inventory in kg and lb with the
 * process-safety cautions, and its water and carbon footprint. No cash flows: present values only.
 */
export function CondenserFootprintSection({ source }: { source: ReportSource }) {
  const r = source.result;
  const plans = condenserPlanTable(r, source.unitSystem, source.project.currency);
  const footprint = footprintTable(r, source.unitSystem, source.project.currency);
  const cautions = inventoryCautionTexts(r);
  return (
    <View>
      <T style={S.kicker}>Condensers and footprint</T>
      <H1>Each option&apos;s condenser, refrigerant and footprint</H1>
      {plans ? (
        <View>
          <P>
            The construction of each option&apos;s condenser sets how it is cleaned and inspected, which parts
            wear out and how much refrigerant it holds; values left empty in the scenario take the
            construction&apos;s defaults, each with its source.
          </P>
          <H3>Condenser construction and upkeep plan</H3>
          <Table columns={columnsOf(plans)} rows={plans.rows} fontSize={7.5} />
          {plans.notes.map((n) => (
            <T key={n} style={S.small}>
              {n}
            </T>
          ))}
          {cautions.map((c) => (
            <Note key={c} tone="caution">
              <T>{c}</T>
            </Note>
          ))}
        </View>
      ) : (
        <P>
          This result was computed before condenser plans were part of the analysis; recompute the scenario to
          include them.
        </P>
      )}
      {footprint ? (
        <View>
          <H3>Water and carbon footprint</H3>
          <Table columns={columnsOf(footprint)} rows={footprint.rows} fontSize={7.5} />
          {footprint.notes.map((n) => (
            <T key={n} style={S.small}>
              {n}
            </T>
          ))}
        </View>
      ) : null}
    </View>
  );
}
