import type { UnitSystem } from "@/lib/units";
import {
  condenserPlanTable,
  footprintTable,
  inventoryCautionTexts,
  type CondenserFootprintResult,
  type OptionRowsTable,
} from "@/lib/reports/condenser-footprint";

function RowsTable({ table, caption, testId }: { table: OptionRowsTable; caption: string; testId: string }) {
  return (
    <div className="overflow-x-auto" data-testid={testId}>
      <table className="w-full min-w-[44rem] table-fixed border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <colgroup>
          <col className="w-[24%]" />
          {table.columns.map((c) => (
            <col key={c.optionId} />
          ))}
        </colgroup>
        <thead>
          <tr className="border-b border-line-strong">
            <th scope="col" className="px-3 py-2 text-left text-xs font-semibold text-ink-soft">
              {caption}
            </th>
            {table.columns.map((c) => (
              <th key={c.optionId} scope="col" className="px-3 py-2 text-left align-bottom font-semibold">
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {table.rows.map((r) => (
            <tr key={r.key} className="border-b border-line align-top last:border-0" data-row={r.key}>
              <th scope="row" className="px-3 py-1.5 text-left font-normal">
                {r.label}
              </th>
              {r.cells.map((c, i) => (
                <td key={i} className={`px-3 py-1.5 ${c.value !== null ? "num text-left" : "text-ink-soft"}`}>
                  {c.text}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <ul className="mt-2 space-y-1 text-xs text-ink-faint">
        {table.notes.map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
    </div>
  );
}

/**
 * Each option's condenser and upkeep plan with its refrigerant inventory (kg and lb) and the
 * process-safety cautions, then its water and carbon footprint. Present values only: every viewer may see it.
 */
export function CondenserFootprintPanel({
  result,
  system,
  currency,
}: {
  result: CondenserFootprintResult;
  system: UnitSystem;
  currency: string;
}) {
  const plans = condenserPlanTable(result, system, currency);
  const footprint = footprintTable(result, system, currency);
  const cautions = inventoryCautionTexts(result);
  if (!plans && !footprint) return null;
  return (
    <div className="space-y-6" data-testid="condenser-footprint">
      {plans ? (
        <div>
          <h3 className="mb-2 text-sm font-semibold">Condenser construction, refrigerant and upkeep plan</h3>
          <RowsTable table={plans} caption="Each option's condenser" testId="condenser-plans" />
          {cautions.length > 0 ? (
            <ul className="mt-3 space-y-2" data-testid="inventory-cautions">
              {cautions.map((c) => (
                <li
                  key={c}
                  className="rounded-md border border-caution-200 bg-caution-50 px-3 py-2 text-xs text-ink-soft"
                >
                  {c}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {footprint ? (
        <div>
          <h3 className="mb-2 text-sm font-semibold">Water and carbon footprint</h3>
          <RowsTable table={footprint} caption="Per year unless noted" testId="footprint" />
        </div>
      ) : null}
    </div>
  );
}
