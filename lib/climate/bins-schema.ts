/**
 * The submitted bin table: the scenario climate schema's bin tables (lib/scenarios/schema-climate.ts) plus a
 * name. Client-safe, so the editor validates as the person types with the very schema the server applies.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { dryBulbBinsClimateInputSchema, wetBulbBinsClimateInputSchema } from "@/lib/scenarios/schema-climate";

const name = text().trim().min(1, "Name the bin table.").max(200, "Keep the name under 200 characters.");

export const binTableSubmissionSchema = z.discriminatedUnion("source", [
  wetBulbBinsClimateInputSchema.extend({ name }),
  dryBulbBinsClimateInputSchema.extend({ name }),
]);

export type BinTableSubmission = z.input<typeof binTableSubmissionSchema>;

/** The stored field names of a bin row, by table kind: [binned temperature, coincident temperature]. */
export const BIN_FIELDS = {
  wetBulbBins: ["wetBulbC", "meanCoincidentDryBulbC"],
  dryBulbBins: ["dryBulbC", "meanCoincidentWetBulbC"],
} as const;
