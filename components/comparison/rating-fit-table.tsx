/**
 * How an option's tower or cooler was calibrated on its rating points: the fitted C and n (tower) or the
 * tube-side share and dry factor (cooler), the note saying what was fitted and what is a default, and each
 * point's rated vs predicted leaving temperature with the residual, in the viewer's units. Shared by the
 * editor (after an analysis) and the comparison.
 */
import type { RatingFitSummary } from "@/lib/engine/types";
import { formatNumber, fromSI, unitLabel, type UnitSystem } from "@/lib/units";

const r3 = (v: number | undefined) => formatNumber(v, { decimals: 3 });

export function pointLabel(label: string): string {
  if (label === "design") return "Design point";
  if (label === "dry") return "Dry rating";
  return label.charAt(0).toUpperCase() + label.slice(1);
}

export function RatingFitTable({
  fit,
  system,
  title,
}: {
  fit: RatingFitSummary;
  system: UnitSystem;
  title?: string;
}) {
  const t = (c: number | undefined) =>
    c === undefined ? "—" : formatNumber(fromSI("temperatureC", c, system), { decimals: 2 });
  const dT = (k: number | undefined) =>
    k === undefined
      ? "—"
      : `${k >= 0 ? "+" : "−"}${formatNumber(Math.abs(fromSI("temperatureDifferenceK", k, system)), { decimals: 2 })}`;
  const tu = unitLabel("temperatureC", system);
  const du = unitLabel("temperatureDifferenceK", system);
  const tower = fit.device === "tower";
  return (
    <div className="space-y-2 text-sm" data-testid={`rating-fit-${fit.device}`}>
      {title ? <h3 className="font-semibold">{title}</h3> : null}
      <p data-testid="rating-fit-note">{fit.note}</p>
      <p className="text-xs text-ink-soft">
        {tower ? (
          <>
            C = <span data-testid="fit-c">{r3(fit.coefficientC)}</span>, n ={" "}
            <span data-testid="fit-n">{r3(fit.exponentN)}</span> (KaV/L = C·(L/G)
            <sup>−n</sup>)
          </>
        ) : (
          <>
            Tube-side share of the wet resistance{" "}
            {formatNumber((fit.internalResistanceFraction ?? Number.NaN) * 100, { decimals: 1 })} %
            {fit.dryExternalConductanceFactor !== undefined
              ? `, dry external conductance factor ${r3(fit.dryExternalConductanceFactor)}`
              : ""}
          </>
        )}
      </p>
      {fit.points.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="min-w-full text-xs tabular-nums">
            <thead>
              <tr className="border-b border-line text-left text-ink-soft">
                <th className="py-1 pr-3 font-medium">Point</th>
                <th className="py-1 pr-3 font-medium">{tower ? "L/G" : "Fluid/air"}</th>
                {tower ? <th className="py-1 pr-3 font-medium">KaV/L needed · fitted</th> : null}
                <th className="py-1 pr-3 font-medium">Leaving, rated ({tu})</th>
                <th className="py-1 pr-3 font-medium">Leaving, predicted ({tu})</th>
                <th className="py-1 pr-3 font-medium">Residual ({du})</th>
              </tr>
            </thead>
            <tbody>
              {fit.points.map((p) => (
                <tr key={p.label} className="border-b border-line/60" data-testid="rating-fit-row">
                  <td className="py-1 pr-3">
                    {pointLabel(p.label)}
                    {p.usedInFit ? "" : p.rejected ? " (left out)" : " (check only)"}
                  </td>
                  <td className="py-1 pr-3">{r3(p.liquidToGasRatio)}</td>
                  {tower ? (
                    <td className="py-1 pr-3">
                      {r3(p.demandKaVL)} · {r3(p.fittedKaVL)}
                    </td>
                  ) : null}
                  <td className="py-1 pr-3">{t(p.ratedLeavingC)}</td>
                  <td className="py-1 pr-3">{p.rejected ? p.rejected : t(p.predictedLeavingC)}</td>
                  <td className="py-1 pr-3" data-testid="rating-fit-residual">
                    {dT(p.residualK)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
