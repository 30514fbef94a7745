/**
 * The LoopLedger cost report: cover, summary in plain words, charts, assumptions with their sources,
 * water and energy by component, yearly cash flows, methods and references, cautions. Built from the
 * same stored input + result the comparison page shows, in the viewer's unit system.
 */
import { Document, Page, Path, Rect, Svg, Text, View } from "@react-pdf/renderer";
import {
  COST_CATEGORIES,
  COST_CATEGORY_LABELS,
  type CostCategory,
  type OptionEconomics,
  type YearCashFlow,
} from "@/lib/engine/economics/types";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { warningText } from "@/lib/units/warnings";
import { designDaySentence } from "../design-day";
import { buildAssumptions } from "../assumptions";
import { calendarYearLabel, fmtDate, fmtMoney, fmtNumber, fmtPercent, fmtRatio, fmtYears } from "../format";
import {
  buildSummary,
  labelOf,
  tornadoValueText,
  type OptionSummaryRow,
  type ReportSummary,
} from "../summary";
import type { ReportSource } from "../types";
import { convert, unitOf } from "../units";
import {
  CostStackChart,
  ChartFrame,
  HistogramChart,
  Legend,
  LineChart,
  MonthlyBarsChart,
  TornadoChart,
} from "./charts";
import { cautionsFor, SCREENING_NOTE } from "./text";
import { methodsDocument, type Inline } from "@/lib/methods";
import { Facts, H1, H2, H3, Note, P, T, Table, type Column } from "./primitives";
import { CondenserFootprintSection } from "./condenser-footprint";
import { COLORS, OPTION_COLORS, S } from "./theme";

const SUMMARY_FLIPS_SHOWN = 6;

export const CATEGORY_COLORS: Record<CostCategory, string> = {
  investment: COLORS.basin900,
  energy: COLORS.basin600,
  demand: COLORS.basin300,
  water: "#3f8fc4",
  sewer: "#9cc3de",
  chemicals: COLORS.copper500,
  upkeep: COLORS.copper400,
  carbon: "#5b6b3a",
  replacements: "#7d8b96",
  residual: "#b9c4cc",
};

/** Longest scenario name the running header prints whole; a longer one is cut at a word with "…". */
export const HEADER_NAME_MAX_CHARS = 64;

/** The running header's right-hand text: a long scenario name shortened so it never runs into the firm's name. */
export function headerScenarioText(scenarioName: string, versionLabel: string): string {
  let name = scenarioName;
  if (name.length > HEADER_NAME_MAX_CHARS) {
    // One character more than is kept, so a space just after the last whole word counts as its end.
    const cut = name.slice(0, HEADER_NAME_MAX_CHARS);
    const space = cut.lastIndexOf(" ");
    name = `${(space > HEADER_NAME_MAX_CHARS / 2 ? cut.slice(0, space) : cut).replace(/[\s,;:·—-]+$/, "")}…`;
  }
  return `${name}  ·  ${versionLabel}`;
}

function Chrome({ source }: { source: ReportSource }) {
  return (
    <>
      <View style={S.header} fixed>
        <T
          style={{ fontWeight: 600, color: COLORS.basin700, flexShrink: 0, marginRight: 16 }}
        >{`LoopLedger  ·  ${source.preparedBy.firmName}`}</T>
        <T style={{ flexShrink: 1, textAlign: "right" }}>{headerScenarioText(source.scenarioName, source.versionLabel)}</T>
      </View>
      <View style={S.footerRule} fixed />
      <T style={S.footerLeft} fixed>{`${source.project.name}  ·  screening estimate, see cautions`}</T>
      <Text
        style={S.footerRight}
        fixed
        render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`}
      />
    </>
  );
}

/** One wrapped page run with the running header and footer. Sections get their own run: react-pdf lays out
 * the remaining content of a run again for every page it breaks, so short runs render much faster. */
function Sheet({
  source,
  size,
  children,
  landscape,
}: {
  source: ReportSource;
  size: "A4" | "LETTER";
  children: React.ReactNode;
  landscape?: boolean;
}) {
  return (
    <Page
      size={size}
      orientation={landscape ? "landscape" : "portrait"}
      style={landscape ? [S.page, { paddingHorizontal: 36 }] : S.page}
      wrap
    >
      <Chrome source={source} />
      {children}
    </Page>
  );
}

function Mark({ size = 30 }: { size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24">
      <Rect x={2.5} y={5} width={19} height={14} rx={7} fill="none" stroke="#ffffff" strokeWidth={2.2} />
      <Path
        d="M12 8.2c1.9 2.4 2.8 3.9 2.8 5a2.8 2.8 0 0 1-5.6 0c0-1.1.9-2.6 2.8-5z"
        fill={COLORS.copper400}
      />
    </Svg>
  );
}

function Cover({
  source,
  summary,
  size,
}: {
  source: ReportSource;
  summary: ReportSummary;
  size: "A4" | "LETTER";
}) {
  const dateLine = source.issuedAt
    ? `Issued ${fmtDate(source.issuedAt)}`
    : `Draft generated ${fmtDate(new Date())}`;
  const p = source.project;
  return (
    <Page
      size={size}
      wrap={false}
      style={{ fontFamily: "Plex Sans", fontSize: 9, color: COLORS.ink, flexDirection: "column" }}
    >
      <View
        style={{ backgroundColor: COLORS.basin700, paddingHorizontal: 48, paddingTop: 40, paddingBottom: 30 }}
      >
        <View style={{ flexDirection: "row", alignItems: "center", marginBottom: 36 }}>
          <Mark />
          <T style={{ color: "#ffffff", fontSize: 14, fontWeight: 600, marginLeft: 8 }}>LoopLedger</T>
          <T style={{ color: COLORS.basin100, fontSize: 8, marginLeft: 12 }}>{source.preparedBy.firmName}</T>
        </View>
        <T
          style={{
            color: COLORS.copper100,
            fontSize: 8.5,
            fontWeight: 600,
            letterSpacing: 1.5,
            textTransform: "uppercase",
          }}
        >
          Life-cycle cost report
        </T>
        <T style={{ color: "#ffffff", fontSize: 24, fontWeight: 600, marginTop: 6, lineHeight: 1.2 }}>
          {p.name}
        </T>
        <T style={{ color: COLORS.basin100, fontSize: 11, marginTop: 8 }}>
          Condenser heat rejection: open cooling tower and closed-circuit cooler options compared over their
          life
        </T>
      </View>
      <View style={{ height: 4, backgroundColor: COLORS.copper500 }} />
      <View style={{ paddingHorizontal: 48, paddingTop: 24, flexGrow: 1 }}>
        <Facts
          labelWidth={120}
          items={[
            ["Client", p.clientName],
            ["Site", p.siteName],
            [
              "Location",
              `${p.locationLabel}${p.locationLabel ? ", " : ""}elevation ${fmtNumber(convert("elevationM", p.elevationM, source.unitSystem), 0)} ${unitOf("elevationM", source.unitSystem)}`,
            ],
            ["Scenario", source.scenarioName],
            ["Version", source.versionLabel],
            ["Date", dateLine],
            [
              "Prepared by",
              `${source.preparedBy.firmName}${source.preparedBy.consultantName ? `, ${source.preparedBy.consultantName}` : ""}`,
            ],
            ["Prepared for", p.clientName],
            [
              "Units",
              source.unitSystem === "IP"
                ? "US customary (IP); money in " + p.currency
                : "SI; money in " + p.currency,
            ],
          ]}
        />
        <View
          style={{
            marginTop: 22,
            padding: 12,
            borderWidth: 0.75,
            borderColor: COLORS.basin300,
            backgroundColor: COLORS.basin50,
          }}
        >
          <T
            style={{
              fontSize: 7.5,
              fontWeight: 600,
              color: COLORS.basin700,
              letterSpacing: 1,
              textTransform: "uppercase",
              marginBottom: 3,
            }}
          >
            In one line
          </T>
          <T style={{ fontSize: 12, fontWeight: 600, color: COLORS.basin900 }}>{summary.headline}</T>
          {summary.paragraphs[0] ? (
            <T style={{ marginTop: 4, fontSize: 9 }}>{summary.paragraphs[0]}</T>
          ) : null}
        </View>
      </View>
      <View style={{ paddingHorizontal: 48, paddingBottom: 34 }}>
        <Note tone="caution">{SCREENING_NOTE}</Note>
        <T style={{ fontSize: 6.5, color: COLORS.inkFaint, marginTop: 4 }}>
          {`Reference ${source.scenarioId.slice(0, 8)}${source.versionNumber !== null ? `-v${source.versionNumber}` : "-draft"} · engine ${source.engineVersion} · generated ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC`}
        </T>
      </View>
    </Page>
  );
}

const MISSING = "first costs missing";

function summaryColumns(currency: string, anyMissing: boolean): Column<OptionSummaryRow>[] {
  // An option without its first cost has no life-cycle figures; no pair has measures while any is missing.
  const own = (r: OptionSummaryRow, text: string) => (r.firstCostMissing ? MISSING : text);
  const pair = (r: OptionSummaryRow, text: string) => (anyMissing && r.comparison ? MISSING : text);
  return [
    {
      title: "Option",
      width: 2.3,
      cell: (r) => `${r.label}${r.isBase ? " (base)" : ""}`,
      emphasis: (r) => r.isLowest,
    },
    {
      title: "First cost",
      unit: currency,
      width: 1.2,
      align: "right",
      cell: (r) => own(r, fmtMoney(r.firstCost, currency)),
    },
    {
      title: "Life-cycle cost",
      unit: `${currency}, present value`,
      width: 1.4,
      align: "right",
      cell: (r) => own(r, fmtMoney(r.lcc, currency)),
      emphasis: (r) => r.isLowest,
    },
    {
      title: "Annualised",
      unit: `${currency}/yr`,
      width: 1.1,
      align: "right",
      cell: (r) => own(r, fmtMoney(r.annualisedCost, currency)),
    },
    {
      title: "Net savings",
      unit: `${currency} vs base`,
      width: 1.2,
      align: "right",
      cell: (r) => pair(r, r.comparison ? fmtMoney(r.comparison.netSavings, currency) : "base"),
    },
    {
      title: "SIR",
      width: 0.6,
      align: "right",
      cell: (r) => pair(r, r.comparison ? fmtRatio(r.comparison.sir) : ""),
    },
    {
      title: "AIRR",
      unit: "%/yr",
      width: 0.7,
      align: "right",
      cell: (r) => pair(r, r.comparison ? fmtPercent(r.comparison.airr) : ""),
    },
    {
      title: "Payback",
      unit: "simple / disc.",
      width: 1.2,
      align: "right",
      cell: (r) =>
        pair(
          r,
          r.comparison
            ? `${fmtYears(r.comparison.simplePaybackYears)} / ${fmtYears(r.comparison.discountedPaybackYears)}`
            : "",
        ),
    },
  ];
}

function SummaryPage({ source, summary }: { source: ReportSource; summary: ReportSummary }) {
  const cur = source.project.currency;
  const sys = source.unitSystem;
  const eco = source.result.economics;
  const phys = source.result.physics;
  const k = summary.keyComparison;
  const designNote = designDaySentence(phys, sys);
  return (
    <View>
      <T style={S.kicker}>Summary</T>
      <H1>{summary.headline}</H1>
      {summary.paragraphs.map((p, i) => (
        <P key={i}>{p}</P>
      ))}
      {designNote ? <P style={{ color: COLORS.copper500 }}>{designNote}</P> : null}
      <H2>Life-cycle cost per option</H2>
      <Table columns={summaryColumns(cur, summary.firstCostsMissing.length > 0)} rows={summary.rows} />
      <T style={[S.small, { marginTop: -4, marginBottom: 6 }]}>
        {`Present values at 1 January ${eco.baseYear}, ${eco.analysis === "real" ? "constant" : "then-current"} ${cur}, ${fmtPercent(eco.discountRate)} discount rate, ${eco.studyPeriodYears}-year study period. Net savings = LCC of the base minus LCC of the option; SIR and AIRR after ASTM E964 and E1057; payback of the option with the higher first cost.`}
      </T>
      <H2>Yearly quantities</H2>
      <Table
        columns={[
          { title: "Option", width: 2.3, cell: (p: OptionAnnualPhysics) => p.label },
          {
            title: "Makeup water",
            unit: `${unitOf("waterVolumeM3", sys)}/yr`,
            width: 1.1,
            align: "right",
            cell: (p) => fmtNumber(convert("waterVolumeM3", p.waterM3.makeup, sys), 0),
          },
          {
            title: "Electric energy",
            unit: "kWh/yr",
            width: 1.1,
            align: "right",
            cell: (p) => fmtNumber(p.energyKWh.total, 0),
          },
          {
            title: "of which compressors",
            unit: "kWh/yr",
            width: 1.1,
            align: "right",
            cell: (p) => (Number.isFinite(p.energyKWh.compressor) ? fmtNumber(p.energyKWh.compressor, 0) : "—"),
          },
          {
            title: "Holds set-point, 0.4 % hour",
            width: 1,
            align: "right",
            cell: (p) => (p.designDay ? (p.designDay.holdsSetPoint ? "yes" : `no, ${fmtNumber(convert("temperatureC", p.designDay.condensingC, sys), 1)} ${unitOf("temperatureC", sys)}`) : "—"),
          },
          {
            title: "Dry-mode hours",
            unit: "h/yr",
            width: 0.9,
            align: "right",
            cell: (p) => fmtNumber(p.dryModeHours, 0),
          },
          {
            title: "Mean condensing",
            unit: unitOf("temperatureC", sys),
            width: 1,
            align: "right",
            cell: (p) => fmtNumber(convert("temperatureC", p.meanCondensingC, sys), 1),
          },
          {
            title: "Hours set-point not held",
            unit: "h/yr",
            width: 1.1,
            align: "right",
            cell: (p) => fmtNumber(p.unmetHours, 0),
          },
          {
            title: "First-year operating",
            unit: `${cur}/yr`,
            width: 1.2,
            align: "right",
            cell: (p) =>
              fmtMoney(
                eco.options.find((o) => o.optionId === p.optionId)?.firstYearOperatingCost ?? NaN,
                cur,
              ),
          },
        ]}
        rows={phys}
      />
      <H2>What would change the answer</H2>
      {summary.flips.length === 0 ? (
        <P>
          {k
            ? "Within the ranges tested, no single input moved on its own makes the other option cheaper over its life."
            : "Only one option is costed, so there is no ranking to change."}
        </P>
      ) : (
        <>
          {/* The summary must stay on one page: the strongest few here, every one in the sensitivity section. */}
          {summary.flips.slice(0, SUMMARY_FLIPS_SHOWN).map((f, i) => (
            <View key={i} style={{ flexDirection: "row", marginBottom: 3 }} wrap={false}>
              <T style={{ width: 10, color: COLORS.copper500 }}>•</T>
              <T style={{ flex: 1 }}>{f}</T>
            </View>
          ))}
          {summary.flips.length > SUMMARY_FLIPS_SHOWN ? (
            <P style={{ color: COLORS.inkSoft }}>
              {`${summary.flips.length - SUMMARY_FLIPS_SHOWN} more inputs would also change the answer: see the sensitivity pages.`}
            </P>
          ) : null}
        </>
      )}
      {summary.noTies.length > 0 ? (
        <P
          style={{ marginTop: 3, color: COLORS.inkSoft }}
        >{`No tie within the searched range for: ${summary.noTies.join(", ")}.`}</P>
      ) : null}
      {k ? (
        <T
          style={S.small}
        >{`Break-even values and tornado ends compare ${labelOf(source.result, k.alternativeOptionId)} with ${labelOf(source.result, k.baseOptionId)}; each input is moved on its own with all others at their entered values.`}</T>
      ) : null}
    </View>
  );
}

function ChartsSection({ source, summary }: { source: ReportSource; summary: ReportSummary }) {
  const cur = source.project.currency;
  const sys = source.unitSystem;
  const eco = source.result.economics;
  const width = 500;
  const optionColor = (i: number) => OPTION_COLORS[i % OPTION_COLORS.length] ?? COLORS.basin600;
  const k = summary.keyComparison;
  const pair = k
    ? eco.sensitivity?.tornado.find(
        (t) => t.baseOptionId === k.baseOptionId && t.alternativeOptionId === k.alternativeOptionId,
      )
    : undefined;
  const dist = k
    ? eco.monteCarlo?.netSavings.find(
        (d) => d.baseOptionId === k.baseOptionId && d.alternativeOptionId === k.alternativeOptionId,
      )
    : undefined;
  const usedCategories = COST_CATEGORIES.filter((c) =>
    eco.options.some((o) => Math.abs(o.pvByCategory[c]) > 0.5),
  );
  return (
    <View>
      <T style={S.kicker}>Charts</T>
      <H1>Where the money goes</H1>
      {summary.firstCostsMissing.length > 0 ? (
        <P>{`First costs missing for ${summary.firstCostsMissing.join(", ")}: the life-cycle cost by category and the cumulative discounted cost are left out until they are entered.`}</P>
      ) : (
        <>
      <ChartFrame
        title="Life-cycle cost by category"
        subtitle={`Present value, ${cur}; residual value is a credit, drawn left of zero`}
      >
        <CostStackChart
          width={width}
          currency={cur}
          colors={CATEGORY_COLORS}
          bars={eco.options.map((o) => ({
            label: o.label,
            total: o.lcc,
            segments: usedCategories.map((c) => ({ key: c, value: o.pvByCategory[c] })),
          }))}
        />
        <Legend
          items={usedCategories.map((c) => ({ label: COST_CATEGORY_LABELS[c], color: CATEGORY_COLORS[c] }))}
        />
      </ChartFrame>
      {source.cashFlowsWithheld ? null : (
      <ChartFrame
        title="Cumulative discounted cost"
        subtitle={`Present value of all costs to the end of each study year, ${cur}`}
      >
        <LineChart
          width={width}
          currency={cur}
          series={eco.options.map((o, i) => ({
            label: o.label,
            color: optionColor(i),
            points: o.cashFlows.map((c) => [c.yearIndex, c.cumulativePresentValue] as [number, number]),
          }))}
        />
        <Legend items={eco.options.map((o, i) => ({ label: o.label, color: optionColor(i) }))} />
      </ChartFrame>
      )}
        </>
      )}
      <ChartFrame
        title="Monthly makeup water"
        subtitle={`Evaporation + blowdown + drift, ${unitOf("waterVolumeM3", sys)} per month of the typical year`}
      >
        <MonthlyBarsChart
          width={width}
          unit={unitOf("waterVolumeM3", sys)}
          series={source.result.physics.map((p, i) => ({
            label: p.label,
            color: optionColor(i),
            values: Array.from({ length: 12 }, (_, m) =>
              convert("waterVolumeM3", p.monthly.find((x) => x.month === m + 1)?.waterM3.makeup ?? 0, sys),
            ),
          }))}
        />
        <Legend items={source.result.physics.map((p, i) => ({ label: p.label, color: optionColor(i) }))} />
      </ChartFrame>
      {pair && k ? (
        <ChartFrame
          title="Sensitivity (tornado)"
          subtitle={`Net savings of ${labelOf(source.result, k.alternativeOptionId)} over ${labelOf(source.result, k.baseOptionId)}, ${cur}, with one input at its low (teal) or high (copper) value; dashed line: as entered (${fmtMoney(pair.baseNetSavings, cur)})`}
        >
          <TornadoChart
            width={width}
            currency={cur}
            base={pair.baseNetSavings}
            bars={pair.bars
              .filter((b) => !b.skippedReason)
              .slice(0, 9)
              .map((b) => ({
                label: b.label,
                atLow: b.netSavingsAtLow,
                atHigh: b.netSavingsAtHigh,
                lowText: tornadoValueText(b, b.low),
                highText: tornadoValueText(b, b.high),
              }))}
          />
        </ChartFrame>
      ) : null}
      {dist && k && eco.monteCarlo ? (
        <ChartFrame
          title="Uncertainty (Monte Carlo)"
          subtitle={`${fmtNumber(eco.monteCarlo.draws)} draws, seed ${eco.monteCarlo.seed}: net savings of ${labelOf(source.result, k.alternativeOptionId)} over ${labelOf(source.result, k.baseOptionId)} are positive in ${fmtPercent(dist.probabilityPositive, 0)} of draws`}
        >
          <HistogramChart
            width={width}
            currency={cur}
            bins={dist.histogram}
            markers={[
              { label: "P10", value: dist.p10 },
              { label: "P50", value: dist.p50 },
              { label: "P90", value: dist.p90 },
            ]}
          />
          <T
            style={S.small}
          >{`P10 ${fmtMoney(dist.p10, cur)} · P50 ${fmtMoney(dist.p50, cur)} · P90 ${fmtMoney(dist.p90, cur)} · mean ${fmtMoney(dist.mean, cur)}`}</T>
        </ChartFrame>
      ) : null}
    </View>
  );
}

function AssumptionsSection({ source }: { source: ReportSource }) {
  const groups = buildAssumptions(source.input, source.result, source.unitSystem, source.project.currency);
  return (
    <View>
      <T style={S.kicker}>Assumptions</T>
      <H1>What the result rests on</H1>
      <P>
        {"Every value below is an input of this version of the scenario, in the report's units. Where a value is the documented default, its " +
          "source is given; tariff defaults are placeholders that the local utility's tariff should replace. Tags: [practice] common practice, no " +
          "published source; [memory] a recalled value to verify."}
      </P>
      {groups.map((g, i) => (
        <View key={i}>
          <H3>{g.note && g.note !== g.title ? `${g.title} (${g.note})` : g.title}</H3>
          <Table
            zebra={false}
            columns={[
              { title: "Input", width: 2.4, cell: (r) => r.label },
              { title: "Value", width: 1.2, align: "right", cell: (r) => r.value },
              { title: "Unit", width: 0.9, cell: (r) => r.unit },
              { title: "Source", width: 3.6, cell: (r) => r.source },
            ]}
            rows={g.rows}
            fontSize={7.4}
          />
        </View>
      ))}
    </View>
  );
}

interface ComponentRow {
  label: string;
  values: number[];
}

function WaterEnergySection({ source }: { source: ReportSource }) {
  const sys = source.unitSystem;
  const phys = source.result.physics;
  const volUnit = unitOf("waterVolumeM3", sys);
  const water: ComponentRow[] = [
    { label: "Evaporation", values: phys.map((p) => p.waterM3.evaporation) },
    { label: "Drift", values: phys.map((p) => p.waterM3.drift) },
    { label: "Blowdown", values: phys.map((p) => p.waterM3.blowdown) },
    { label: "Makeup (= evaporation + drift + blowdown)", values: phys.map((p) => p.waterM3.makeup) },
    { label: "Billed to sewer", values: phys.map((p) => p.waterM3.sewerBilled) },
  ];
  const energy: ComponentRow[] = [
    { label: "Fans", values: phys.map((p) => p.energyKWh.fan) },
    { label: "Condenser pump", values: phys.map((p) => p.energyKWh.condenserPump) },
    { label: "Tower-side pump", values: phys.map((p) => p.energyKWh.secondaryPump) },
    { label: "Spray pump", values: phys.map((p) => p.energyKWh.sprayPump) },
    { label: "Basin heater", values: phys.map((p) => p.energyKWh.basinHeater) },
    { label: "Refrigeration compressors (own condensing temperature)", values: phys.map((p) => p.energyKWh.compressor) },
    { label: "Total (priced)", values: phys.map((p) => p.energyKWh.total) },
    {
      label: "Of the compressors: above a clean condenser on the same water (explanation, not priced)",
      values: phys.map((p) => p.compressorAboveCleanReferenceKWh),
    },
  ];
  const optionCols = (fmt: (v: number) => string, unit: string): Column<ComponentRow>[] => [
    {
      title: "Component",
      width: 2.6,
      cell: (r) => r.label,
      emphasis: (r) => r.label.startsWith("Makeup") || r.label === "Total",
    },
    ...phys.map((p, i) => ({
      title: p.label,
      unit,
      width: 1.3,
      align: "right" as const,
      cell: (r: ComponentRow) => fmt(r.values[i] ?? 0),
    })),
  ];
  return (
    <View>
      <T style={S.kicker}>Water and energy</T>
      <H1>Yearly water balance and energy by component</H1>
      <P>
        Quantities of the typical year from the climate dataset, per option. Makeup equals evaporation plus
        drift plus blowdown exactly; blowdown follows from the cycles of concentration, B = E/(C - 1) - D.
      </P>
      <H3>Water</H3>
      <Table
        columns={optionCols((v) => fmtNumber(convert("waterVolumeM3", v, sys), 1), `${volUnit}/yr`)}
        rows={water}
      />
      <H3>Electric energy</H3>
      <Table columns={optionCols((v) => fmtNumber(v, 0), "kWh/yr")} rows={energy} />
      <H3>Operation</H3>
      <Table
        columns={optionCols((v) => fmtNumber(v, 1), "")}
        rows={[
          { label: "Cycles of concentration", values: phys.map((p) => p.cyclesOfConcentration) },
          {
            label: `Treated outflow (blowdown + drift), ${volUnit}/yr`,
            values: phys.map((p) => convert("waterVolumeM3", p.chemicals.treatedOutflowM3, sys)),
          },
          { label: "Hours in dry mode, h/yr", values: phys.map((p) => p.dryModeHours) },
          { label: "Hours the set-point was not held, h/yr", values: phys.map((p) => p.unmetHours) },
          {
            label: `Mean condensing temperature, ${unitOf("temperatureC", sys)}`,
            values: phys.map((p) => convert("temperatureC", p.meanCondensingC, sys)),
          },
          { label: "Tube or plate cleanings per year", values: phys.map((p) => p.cleaningsPerYear) },
          {
            label: "Cost-minimising cleaning interval, months",
            values: phys.map((p) => p.optimalCleaningIntervalMonths ?? NaN),
          },
        ]}
      />
      {source.result.warnings.length > 0 ? (
        <View>
          <H3>Notes from the analysis</H3>
          <T style={[S.small, { marginBottom: 3 }]}>
            In this report&apos;s units; warnings in copper.
          </T>
          {source.result.warnings.slice(0, 14).map((w, i) => {
            const option = w.optionId
              ? source.result.physics.find((p) => p.optionId === w.optionId)?.label
              : undefined;
            return (
              <View key={i} style={{ flexDirection: "row", marginBottom: 2 }} wrap={false}>
                <T
                  style={{ width: 10, color: w.severity === "warning" ? COLORS.copper500 : COLORS.inkFaint }}
                >
                  •
                </T>
                <T style={{ flex: 1, fontSize: 8 }}>{option ? `${option}: ${warningText(w, sys)}` : warningText(w, sys)}</T>
              </View>
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

interface CashRow {
  label: string;
  calendar: string;
  amounts: Record<CostCategory, number>;
  total: number;
  pv: number;
  cumulative: number;
}

function cashRows(flows: YearCashFlow[], deflate: ((t: number) => number) | null): CashRow[] {
  return flows.map((c) => {
    const f = deflate ? deflate(c.yearIndex) : 1;
    const amounts = { ...c.byCategory };
    for (const k of COST_CATEGORIES) amounts[k] = c.byCategory[k] * f;
    return {
      label: c.yearIndex === 0 ? "0 (base)" : String(c.yearIndex),
      calendar: calendarYearLabel(c.yearIndex, c.calendarYear),
      amounts,
      total: c.total * f,
      pv: c.presentValue,
      cumulative: c.cumulativePresentValue,
    };
  });
}

function CashFlowTable({
  option,
  currency,
  deflate,
  basisText,
}: {
  option: OptionEconomics;
  currency: string;
  deflate: ((t: number) => number) | null;
  basisText: string;
}) {
  const rows = cashRows(option.cashFlows, deflate);
  const used = COST_CATEGORIES.filter((c) => option.cashFlows.some((r) => Math.abs(r.byCategory[c]) > 0.5));
  const m = (v: number) => fmtMoney(v, currency);
  const total: CashRow = {
    label: "Total",
    calendar: "",
    amounts: Object.fromEntries(
      COST_CATEGORIES.map((c) => [c, rows.reduce((a, r) => a + r.amounts[c], 0)]),
    ) as Record<CostCategory, number>,
    total: rows.reduce((a, r) => a + r.total, 0),
    pv: option.lcc,
    cumulative: option.lcc,
  };
  const cols: Column<CashRow>[] = [
    { title: "Year", width: 0.6, cell: (r) => r.label },
    // Years 0 and 1 share a calendar year: their cells say which is which ("2026 (year 0, first cost)").
    { title: "Calendar", width: 1.05, cell: (r) => r.calendar },
    ...used.map((c) => ({
      title: COST_CATEGORY_LABELS[c].replace(" (labour, cleaning, testing)", ""),
      unit: currency,
      width: 1,
      align: "right" as const,
      cell: (r: CashRow) => m(r.amounts[c]),
    })),
    { title: "Total", unit: currency, width: 1.05, align: "right", cell: (r) => m(r.total) },
    { title: "Present value", unit: currency, width: 1.05, align: "right", cell: (r) => m(r.pv) },
    { title: "Cumulative PV", unit: currency, width: 1.25, align: "right", cell: (r) => m(r.cumulative) },
  ];
  return (
    <View>
      <H3>{`${option.label}: ${basisText}`}</H3>
      <Table columns={cols} rows={rows} totals={[total]} fontSize={6.8} />
    </View>
  );
}

function CashFlowPages({ source, size }: { source: ReportSource; size: "A4" | "LETTER" }) {
  const eco = source.result.economics;
  const cur = source.project.currency;
  const nominal = eco.analysis === "nominal";
  const midShift = eco.discounting === "midYear" ? 0.5 : 0;
  // A nominal analysis is also shown in constant dollars: amounts deflated by general inflation (1 + I)^t.
  const deflate = (t: number) => (t === 0 ? 1 : Math.pow(1 + eco.inflationRate, -(t - midShift)));
  const intro = `Costs by year in ${nominal ? "then-current (nominal)" : `constant ${eco.baseYear} (real)`} ${cur}; year 0 is 1 January ${eco.baseYear} (first costs), study year t ends on 31 December of its calendar year. Present values at ${fmtPercent(eco.discountRate)} (${eco.discounting === "midYear" ? "recurring costs mid-year, events at year end" : "end of year"}). The residual value is a credit in the last year. The same tables, with live discounting formulas, are in the cash-flow workbook.`;
  return (
    <>
      {eco.options.map((o, i) => (
        <Sheet key={o.optionId} source={source} size={size} landscape>
          {i === 0 ? (
            <View>
              <T style={S.kicker}>Cash flows</T>
              <H1>Yearly cash flows per option</H1>
              <P>{intro}</P>
            </View>
          ) : null}
          <CashFlowTable
            option={o}
            currency={cur}
            deflate={null}
            basisText={nominal ? "nominal" : "constant dollars (real)"}
          />
          {nominal ? (
            <CashFlowTable
              option={o}
              currency={cur}
              deflate={deflate}
              basisText="the same costs in constant dollars (real), deflated by general inflation"
            />
          ) : null}
        </Sheet>
      ))}
    </>
  );
}

/** The methods document (lib/methods/methods.md), the same text as the app's Methods page. */
function MethodsSection() {
  const doc = methodsDocument();
  const line = (inlines: Inline[]) => inlines.map((i) => i.text).join("");
  return (
    <View>
      <T style={S.kicker}>Appendix</T>
      <H1>{doc.title}</H1>
      {doc.blocks.map((b, n) => {
        if (b.kind === "heading") return b.level <= 2 ? <H2 key={n}>{b.text}</H2> : <H3 key={n}>{b.text}</H3>;
        if (b.kind === "paragraph") return <P key={n}>{line(b.inlines)}</P>;
        if (b.kind === "list") {
          return (
            <View key={n} style={{ marginBottom: 4 }}>
              {b.items.map((item, k) => (
                <View key={k} style={{ flexDirection: "row", marginBottom: 2 }}>
                  <T style={{ width: 10, color: COLORS.inkFaint }}>{"•"}</T>
                  <T style={{ flex: 1, fontSize: 8 }}>{line(item)}</T>
                </View>
              ))}
            </View>
          );
        }
        return (
          <Table
            key={n}
            zebra={false}
            columns={b.header.map((h, k) => ({ title: h, width: k === 2 ? 3.6 : k === 0 ? 2.4 : 1.4, cell: (r: string[]) => r[k] ?? "" }))}
            rows={b.rows}
            fontSize={6.8}
          />
        );
      })}
    </View>
  );
}

function CautionsSection({ source }: { source: ReportSource }) {
  const kinds = source.result.physics.map((p) => p.kind);
  return (
    <View>
      <T style={S.kicker}>Cautions</T>
      <H1>Before anyone acts on this report</H1>
      {cautionsFor(
        kinds,
        source.result.physics.some((p) => p.energyKWh.basinHeater > 0),
      ).map((c, i) => (
        <Note key={i} tone="caution">
          <T style={{ fontWeight: 600, marginBottom: 2 }}>{c.title}</T>
          <T>{c.text}</T>
        </Note>
      ))}
      <Note>{SCREENING_NOTE}</Note>
    </View>
  );
}

/** The whole report as a react-pdf document. */
/** The report's parts in order; "cash" (the yearly cash-flow pages) only for viewers who may see cash flows. */
export const REPORT_PARTS = ["cover", "summary", "charts", "assumptions", "water", "condensers", "cash", "methods", "cautions"] as const;

/** The parts a report for this source has: the viewer's access decides (no yearly cash flows for the owner). */
export function reportPartsFor(source: Pick<ReportSource, "cashFlowsWithheld">): string[] {
  return REPORT_PARTS.filter((p) => p !== "cash" || !source.cashFlowsWithheld);
}

export function ReportDocument({ source, parts }: { source: ReportSource; parts?: string[] }) {
  const allowed = reportPartsFor(source);
  const on = (k: string) => allowed.includes(k) && (!parts || parts.includes(k));
  const size = source.unitSystem === "IP" ? "LETTER" : "A4";
  const summary = buildSummary(source.result, source.project.currency, source.unitSystem);
  return (
    <Document
      title={`${source.project.name}: ${source.scenarioName} (${source.versionLabel})`}
      author={source.preparedBy.firmName}
      subject="Condenser heat rejection life-cycle cost report"
      creator="LoopLedger"
      producer="LoopLedger"
      language="en"
    >
      {on("cover") ? <Cover source={source} summary={summary} size={size} /> : null}
      {on("summary") ? (
        <Sheet source={source} size={size}>
          <SummaryPage source={source} summary={summary} />
        </Sheet>
      ) : null}
      {on("charts") ? (
        <Sheet source={source} size={size}>
          <ChartsSection source={source} summary={summary} />
        </Sheet>
      ) : null}
      {on("assumptions") ? (
        <Sheet source={source} size={size}>
          <AssumptionsSection source={source} />
        </Sheet>
      ) : null}
      {on("water") ? (
        <Sheet source={source} size={size}>
          <WaterEnergySection source={source} />
        </Sheet>
      ) : null}
      {on("condensers") && (source.result.condensers || source.result.footprint) ? (
        <Sheet source={source} size={size}>
          <CondenserFootprintSection source={source} />
        </Sheet>
      ) : null}
      {on("cash") ? <CashFlowPages source={source} size={size} /> : null}
      {on("methods") ? (
        <Sheet source={source} size={size}>
          <MethodsSection />
        </Sheet>
      ) : null}
      {on("cautions") ? (
        <Sheet source={source} size={size}>
          <CautionsSection source={source} />
        </Sheet>
      ) : null}
    </Document>
  );
}
