import type { Metadata } from "next";
import type { ReactNode } from "react";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireProjectAction } from "@/lib/auth/session";
import { getClimateDataset } from "@/lib/climate/data";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ClimateHistogram } from "@/components/charts/climate-histogram";
import { ClimateHeatmap } from "@/components/charts/climate-heatmap";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import { isoDate, SOURCE_LABELS } from "../labels";

export const metadata: Metadata = { title: "Climate summary" };

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const QUANTITY_NAMES: Record<string, string> = {
  dryBulbC: "dry-bulb",
  dewPointC: "dew point",
  relativeHumidity: "relative humidity",
  wetBulbC: "wet-bulb",
  pressurePa: "station pressure",
};

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-faint">{label}</dt>
      <dd>{children}</dd>
    </>
  );
}

const t = (c: number | null | undefined, u: UnitSystem) => formatQuantity("temperatureC", c, u, { decimals: 1 });

/** A climate dataset's summary: where it comes from, how complete it is, its design wet-bulbs and charts. */
export default async function ClimateSummaryPage({ params }: { params: Promise<{ projectId: string; datasetId: string }> }) {
  const { projectId, datasetId } = await params;
  const access = await requireProjectAction(projectId, "project.view");
  const ds = await getClimateDataset(access, datasetId);
  if (!ds) notFound();
  const { project } = access;
  const u = project.unitSystem;
  const s = ds.summary;
  const p = ds.provenance;
  const loc = p.location;
  const isHourly = s.kind === "hourly";
  const fullYear = s.hours === 8760 || s.hours === 8784;
  const design = s.designWetBulbC;
  const d04 = design.find((d) => d.exceedancePercent === 0.4)?.wetBulbC ?? null;
  const missingEntries = Object.entries(p.missingValues ?? {}).filter(([k, n]) => n > 0 && !(k === "pressurePa" && p.pressureSource === "site"));
  const interpolatedEntries = Object.entries(p.interpolatedHours ?? {}).filter(([, n]) => n > 0);
  const freezing = s.dryBulb.minC !== null && s.dryBulb.minC < 0;
  const fileDesign = p.fileDesignConditions;

  return (
    <>
      <PageHeader
        title={ds.name}
        subtitle={
          <>
            <Link href={`/projects/${project.id}`} className="text-basin-700 hover:underline">{project.name}</Link>
            {" · "}
            {SOURCE_LABELS[ds.sourceKind]}
          </>
        }
      />
      <div className="space-y-6">
        <Panel title="Site and source">
          <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr] lg:grid-cols-[max-content_1fr_max-content_1fr]" data-testid="climate-site">
            <Row label="Location">
              {loc ? [loc.name, loc.region, loc.country].filter(Boolean).join(", ") : "—"}
              {loc?.dataSource ? <span className="text-ink-faint"> · {loc.dataSource}</span> : null}
            </Row>
            <Row label="Coordinates">
              {loc?.latitudeDeg !== undefined && loc.longitudeDeg !== undefined ? (
                <span className="font-mono">
                  {formatNumber(loc.latitudeDeg, { decimals: 2 })}°, {formatNumber(loc.longitudeDeg, { decimals: 2 })}°
                  {loc.timeZoneH !== undefined ? ` · UTC${loc.timeZoneH >= 0 ? "+" : "−"}${Math.abs(loc.timeZoneH)} h` : ""}
                </span>
              ) : (
                "—"
              )}
            </Row>
            <Row label="Station elevation">
              <span className="font-mono">{formatQuantity("elevationM", p.stationElevationM, u, { decimals: 0 })}</span>
              <span className="text-ink-faint"> · site {formatQuantity("elevationM", p.siteElevationM, u, { decimals: 0 })} when imported</span>
            </Row>
            <Row label="Records">
              <span className="font-mono" data-testid="climate-records">{formatNumber(ds.recordCount, { decimals: 0 })}</span>
              {isHourly && p.recordsPerHour && p.recordsPerHour > 1 ? <span className="text-ink-faint"> · {p.recordsPerHour} per hour, averaged</span> : null}
              {!isHourly ? <span className="text-ink-faint"> bins</span> : null}
            </Row>
            <Row label="Missing values">
              {missingEntries.length === 0 ? (
                <span data-testid="climate-missing">none</span>
              ) : (
                <span data-testid="climate-missing">
                  {missingEntries.map(([k, n]) => `${formatNumber(n, { decimals: 0 })} ${QUANTITY_NAMES[k] ?? k}`).join(", ")}
                  {interpolatedEntries.length > 0 ? <span className="text-ink-faint"> — filled by linear interpolation over gaps of up to 6 h</span> : null}
                </span>
              )}
            </Row>
            {isHourly ? (
              <Row label="Wet-bulb pressure">
                {p.pressureSource === "station" ? "each hour's station pressure" : "site pressure from elevation (standard atmosphere)"}
                {p.sitePressurePa ? <span className="text-ink-faint"> · site {formatQuantity("pressureKPa", p.sitePressurePa / 1000, u, { decimals: 2 })}</span> : null}
              </Row>
            ) : null}
            <Row label="File">
              {p.fileName ?? "entered by hand"}
              {p.byteSize ? <span className="text-ink-faint"> · {formatNumber(p.byteSize / 1024, { decimals: 0 })} KiB</span> : null}
            </Row>
            <Row label="Added">
              {isoDate(ds.createdAt)}
              {ds.createdByName ? ` by ${ds.createdByName}` : ""}
            </Row>
          </dl>
          {p.warnings.length > 0 ? (
            <div className="mt-4 rounded-md border border-caution-200 bg-caution-50 px-3 py-2 text-sm text-caution-800" data-testid="climate-warnings">
              <p className="font-semibold">Read before using this climate</p>
              <ul className="mt-1 list-disc pl-5">
                {p.warnings.map((w, i) => (
                  <li key={i}>
                    {w.line > 0 ? <span className="font-mono">line {w.line}: </span> : null}
                    {w.message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </Panel>

        <div className="grid gap-6 lg:grid-cols-2">
          <Panel title="Hours and temperatures">
            <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2 text-sm">
              <Row label="Hours in the year">
                <span className="font-mono" data-testid="climate-hours">{formatNumber(s.hours, { decimals: s.hours % 1 === 0 ? 0 : 1 })} h</span>
                <span className={fullYear ? "text-ok-600" : "text-caution-800"}>
                  {" "}
                  {fullYear ? (s.hours === 8784 ? "· a full leap year" : "· a full year") : "· not a full year (8760 h): yearly totals cover only these hours"}
                </span>
              </Row>
              <Row label="Dry-bulb">
                <span className="font-mono">{t(s.dryBulb.minC, u)} … {t(s.dryBulb.maxC, u)}</span>
                <span className="text-ink-faint"> · mean {t(s.dryBulb.meanC, u)}</span>
              </Row>
              <Row label="Wet-bulb">
                <span className="font-mono">{t(s.wetBulb.minC, u)} … {t(s.wetBulb.maxC, u)}</span>
                <span className="text-ink-faint"> · mean {t(s.wetBulb.meanC, u)}</span>
              </Row>
            </dl>
          </Panel>
          <Panel title="Design wet-bulb">
            <table className="w-full text-sm" data-testid="climate-design">
              <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
                <tr>
                  <th className="py-1 pr-4 font-medium">Exceeded for</th>
                  <th className="py-1 pr-4 text-right font-medium">Hours a year</th>
                  <th className="py-1 text-right font-medium">Wet-bulb</th>
                  {fileDesign ? <th className="py-1 pl-4 text-right font-medium">Stated in the file</th> : null}
                </tr>
              </thead>
              <tbody>
                {design.map((d) => (
                  <tr key={d.exceedancePercent} className="border-t border-line">
                    <td className="py-1 pr-4">{d.exceedancePercent} % of the hours</td>
                    <td className="num py-1 pr-4">{formatNumber((d.exceedancePercent / 100) * s.hours, { decimals: 0 })} h</td>
                    <td className="num py-1 font-semibold">{t(d.wetBulbC, u)}</td>
                    {fileDesign ? (
                      <td className="num py-1 pl-4 text-ink-soft" data-testid={`file-design-${d.exceedancePercent}`}>
                        {(() => {
                          const f = fileDesign.coolingWetBulbC.find((x) => x.exceedancePercent === d.exceedancePercent);
                          return f ? `${t(f.wetBulbC, u)} (MCDB ${t(f.meanCoincidentDryBulbC, u)})` : "—";
                        })()}
                      </td>
                    ) : null}
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-3 text-xs text-ink-faint">
              Annual exceedance percentiles as in ASHRAE Handbook—Fundamentals (2017) ch.14{isHourly ? "" : "; from bins, the value of the bin in which the hours are reached"}.
              Select equipment at the design wet-bulb your client and the authority accept; this is the typical year, not an extreme.
            </p>
            {fileDesign ? (
              <p className="mt-2 text-xs text-ink-faint" data-testid="file-design-source">
                “Stated in the file”: the file&apos;s own DESIGN CONDITIONS line ({fileDesign.source || "source not named"}), evaporation wet-bulb with its mean coincident dry-bulb. It comes from the station&apos;s long-term record, so it may differ from the percentiles of this one typical year.
              </p>
            ) : null}
          </Panel>
        </div>

        <Panel title="Wet-bulb hours">
          <ClimateHistogram bars={s.wetBulbHistogram} unitSystem={u} designWetBulb04C={d04} />
        </Panel>

        {isHourly && s.monthHourMeanWetBulbC ? (
          <Panel title="Mean wet-bulb by month and hour">
            <ClimateHeatmap matrixC={s.monthHourMeanWetBulbC} unitSystem={u} />
            <details className="mt-3 text-sm">
              <summary className="cursor-pointer text-basin-700">Show the values as a table</summary>
              <div className="mt-2 overflow-x-auto">
                <table className="text-xs">
                  <caption className="sr-only">Mean wet-bulb by month (rows) and hour of day (columns), {u === "IP" ? "°F" : "°C"}</caption>
                  <thead>
                    <tr>
                      <th className="pr-2 text-left font-medium">Month</th>
                      {Array.from({ length: 24 }, (_, h) => (
                        <th key={h} className="px-1 text-right font-medium">{String(h).padStart(2, "0")}</th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {s.monthHourMeanWetBulbC.map((row, m) => (
                      <tr key={m} className="border-t border-line">
                        <th className="pr-2 text-left font-medium">{MONTHS[m]}</th>
                        {row.map((v, h) => (
                          <td key={h} className="num px-1">{formatQuantity("temperatureC", v, u, { decimals: 1, withUnit: false })}</td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </details>
          </Panel>
        ) : (
          <Panel title="Mean wet-bulb by month and hour">
            <p className="text-sm text-ink-soft">A bin table has no hours of the day, so there is no month × hour map. Import an hourly year to see one.</p>
          </Panel>
        )}

        {s.monthlyMeanDryBulbC && s.monthlyMeanWetBulbC ? (
          <Panel title="Monthly means">
            <div className="overflow-x-auto">
              <table className="w-full text-sm">
                <thead className="text-xs uppercase tracking-wide text-ink-faint">
                  <tr>
                    <th className="py-1 pr-3 text-left font-medium">{u === "IP" ? "°F" : "°C"}</th>
                    {MONTHS.map((m) => (
                      <th key={m} className="px-1 py-1 text-right font-medium">{m}</th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {([
                    ["Dry-bulb", s.monthlyMeanDryBulbC],
                    ["Wet-bulb", s.monthlyMeanWetBulbC],
                  ] as const).map(([label, values]) => (
                    <tr key={label} className="border-t border-line">
                      <th className="py-1 pr-3 text-left font-medium">{label}</th>
                      {values.map((v, i) => (
                        <td key={i} className="num px-1 py-1">{formatQuantity("temperatureC", v, u, { decimals: 1, withUnit: false })}</td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </Panel>
        ) : null}

        {freezing ? (
          <div className="rounded-panel border border-caution-200 bg-caution-50 px-panel py-3 text-sm text-caution-800" role="note" data-testid="climate-freeze-caution">
            <p className="font-semibold">Freezing weather at this site</p>
            <p className="mt-1">
              The dry-bulb falls to {t(s.dryBulb.minC, u)}. Wet towers and coolers need freeze protection in winter: basin heaters or
              an indoor sump, drain-down or glycol in closed coils, and fan control that avoids icing. Follow the manufacturer&apos;s
              winter-operation instructions; local codes and a licensed engineer govern.
            </p>
          </div>
        ) : null}
      </div>
    </>
  );
}
