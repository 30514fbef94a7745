"use client";

/**
 * The selection's extra rating points: 1–5 tower rating points that fit the characteristic's C and n, or a
 * cooler's extra wet ratings that fit the tube-side share of its wet resistance (the dry rating stays in the
 * cooler group). After an analysis, the fit and each point's residual (rated vs predicted leaving
 * temperature) are shown under the rows.
 */
import { createContext, useContext } from "react";
import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { useUnits } from "@/components/forms";
import { RatingFitTable } from "@/components/comparison/rating-fit-table";
import type { RatingFitSummary } from "@/lib/engine/types";
import type { EditorValues } from "@/lib/scenarios/editor-values";
import { FlowField, Group, Num } from "./fields";

type V = EditorValues;

/** The last analysis's fit of each option, by option id (null before any analysis of these inputs). */
export type RatingFits = Record<string, RatingFitSummary>;
export const RatingFitsContext = createContext<{ fits: RatingFits; stale: boolean }>({
  fits: {},
  stale: false,
});

function FitAfterAnalysis({ i, device }: { i: number; device: "tower" | "cooler" }) {
  const { fits, stale } = useContext(RatingFitsContext);
  const { system } = useUnits();
  const id = useWatch<V, `options.${number}.id`>({ name: `options.${i}.id` });
  const fit = id ? fits[id] : undefined;
  if (!fit || fit.device !== device)
    return (
      <p className="text-xs text-ink-soft sm:col-span-2 xl:col-span-3">
        Save and analyse to see the fit and each point&apos;s residual here.
      </p>
    );
  return (
    <div className="rounded-md bg-paper-sunk p-3 sm:col-span-2 xl:col-span-3" data-testid="rating-fit-result">
      <RatingFitTable fit={fit} system={system} title="Fit from the last analysis" />
      {stale ? (
        <p className="mt-1 text-xs text-caution-800">Inputs changed since: save and analyse to update it.</p>
      ) : null}
    </div>
  );
}

/** One rating's fields on a row, with its remove button (`columns`: how many fields the row holds). */
function RatingRow(props: {
  columns: 5 | 6;
  removeLabel: string;
  onRemove: () => void;
  testId?: string;
  children: React.ReactNode;
}) {
  const cols =
    props.columns === 6 ? "xl:grid-cols-[repeat(6,1fr)_auto]" : "xl:grid-cols-[repeat(5,1fr)_auto]";
  return (
    <div
      className={`grid items-end gap-2 rounded-md border border-line p-2 sm:grid-cols-3 ${cols}`}
      data-testid={props.testId}
    >
      {props.children}
      <button
        type="button"
        className="mb-1 rounded border border-line px-2 py-1 text-xs hover:bg-danger-50"
        onClick={props.onRemove}
        aria-label={props.removeLabel}
      >
        Remove
      </button>
    </div>
  );
}

/** The rows of a rating list, its add button (off at `max`) and, after an analysis, the fit. */
function RatingList(props: {
  testId: string;
  count: number;
  max: number;
  onAdd: () => void;
  addTestId: string;
  addLabel: string;
  maxText: string;
  children: React.ReactNode;
}) {
  const full = props.count >= props.max;
  return (
    <div className="space-y-3 sm:col-span-2 xl:col-span-3" data-testid={props.testId}>
      {props.children}
      <button
        type="button"
        className="rounded border border-line-strong px-2 py-1 text-xs hover:bg-paper-sunk disabled:opacity-50"
        onClick={props.onAdd}
        disabled={full}
        data-testid={props.addTestId}
      >
        {props.addLabel}
        {full ? ` (${props.maxText})` : ""}
      </button>
    </div>
  );
}

export function TowerRatingPoints({ i }: { i: number }) {
  const { getValues } = useFormContext<V>();
  const name = `options.${i}.tower.ratingPoints` as const;
  const { fields, append, remove } = useFieldArray<V, `options.${number}.tower.ratingPoints`>({ name });
  const addPoint = () => {
    const t = getValues(`options.${i}.tower`);
    append({
      waterFlowKgPerS: t?.waterFlowKgPerS ?? 50,
      enteringWaterC: t?.enteringWaterC ?? 35,
      leavingWaterC: t?.leavingWaterC ?? 29,
      wetBulbC: t?.designWetBulbC ?? 24,
    });
  };
  return (
    <Group
      title="Tower rating points"
      note={
        <>
          Up to five points from the certified selection (other flows, wet-bulbs or fan speeds). With two or
          more at L/G at least 10 % apart, C and n of KaV/L = C·(L/G)
          <sup>−n</sup> are fitted by least squares; with one, n stays at its default. Give each point&apos;s
          airflow or fan motor input; with neither, the fan is taken at full speed (the design airflow from
          the design L/G).
        </>
      }
    >
      <RatingList
        testId="tower-rating-points"
        count={fields.length}
        max={5}
        onAdd={addPoint}
        addTestId="add-tower-rating-point"
        addLabel="Add a rating point"
        maxText="five at most"
      >
        {fields.map((f, j) => (
          <RatingRow
            key={f.id}
            columns={6}
            testId="tower-rating-point"
            onRemove={() => remove(j)}
            removeLabel={`Remove tower rating point ${j + 1}`}
          >
            <FlowField name={`${name}.${j}.waterFlowKgPerS`} label={`Point ${j + 1}: water flow`} />
            <Num name={`${name}.${j}.enteringWaterC`} label="Entering (hot) water" kind="temperatureC" />
            <Num name={`${name}.${j}.leavingWaterC`} label="Leaving (cold) water" kind="temperatureC" />
            <Num name={`${name}.${j}.wetBulbC`} label="Entering wet-bulb" kind="temperatureC" />
            <Num name={`${name}.${j}.airFlowKgPerS`} label="Airflow (mass)" kind="massFlowKgPerS" optional />
            <Num name={`${name}.${j}.fanPowerKW`} label="Fan motor input" kind="powerKW" optional />
          </RatingRow>
        ))}
      </RatingList>
      <FitAfterAnalysis i={i} device="tower" />
    </Group>
  );
}

export function CoolerWetRatings({ i }: { i: number }) {
  const { getValues } = useFormContext<V>();
  const name = `options.${i}.cooler.wetRatings` as const;
  const { fields, append, remove } = useFieldArray<V, `options.${number}.cooler.wetRatings`>({ name });
  const addRating = () => {
    const c = getValues(`options.${i}.cooler`);
    append({
      fluidFlowKgPerS: c?.fluidFlowKgPerS ?? 40,
      enteringFluidC: c?.enteringFluidC ?? 35,
      leavingFluidC: c?.leavingFluidC ?? 30,
      wetBulbC: c?.designWetBulbC ?? 24,
    });
  };
  return (
    <Group
      title="Extra wet ratings"
      note="Wet ratings of the same cooler at another fluid flow, airflow or wet-bulb (up to four). With the design rating held, they fit how the wet resistance splits between the tube side and the air side; without them the entered share is used. The dry rating (above) then calibrates dry operation."
    >
      <RatingList
        testId="cooler-wet-ratings"
        count={fields.length}
        max={4}
        onAdd={addRating}
        addTestId="add-cooler-wet-rating"
        addLabel="Add a wet rating"
        maxText="four at most"
      >
        {fields.map((f, j) => (
          <RatingRow
            key={f.id}
            columns={5}
            onRemove={() => remove(j)}
            removeLabel={`Remove cooler wet rating ${j + 2}`}
          >
            <FlowField name={`${name}.${j}.fluidFlowKgPerS`} label={`Rating ${j + 2}: fluid flow`} />
            <Num name={`${name}.${j}.enteringFluidC`} label="Entering fluid" kind="temperatureC" />
            <Num name={`${name}.${j}.leavingFluidC`} label="Leaving fluid" kind="temperatureC" />
            <Num name={`${name}.${j}.wetBulbC`} label="Entering wet-bulb" kind="temperatureC" />
            <Num name={`${name}.${j}.airFlowKgPerS`} label="Airflow (mass)" kind="massFlowKgPerS" optional />
          </RatingRow>
        ))}
      </RatingList>
      <FitAfterAnalysis i={i} device="cooler" />
    </Group>
  );
}
