/**
 * The one schema of a project's editable fields, used by the project form (zodResolver) for instant
 * feedback and by the server actions as the authority. Client-safe.
 * Elevation is stored in metres (SI); the form shows it in the project's unit system through lib/units.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { MAX_REVISION } from "@/lib/validation/limits";
import { UNIT_SYSTEMS } from "@/lib/auth/roles";

/** Lowest and highest site elevations accepted, m. Below the Dead Sea shore (≈ −430 m) or above 5,000 m
 * the standard-atmosphere pressure the engine derives from elevation is no longer a plant site's [practice]. */
export const MIN_ELEVATION_M = -500;
export const MAX_ELEVATION_M = 5000;

const ISO_CURRENCY = /^[A-Z]{3}$/;

/** ISO 4217 codes this runtime knows (Intl), or null where Intl cannot list them. */
function knownCurrencies(): Set<string> | null {
  try {
    const list = (Intl as unknown as { supportedValuesOf?: (k: string) => string[] }).supportedValuesOf?.("currency");
    return list && list.length > 0 ? new Set(list) : null;
  } catch {
    return null;
  }
}
const CURRENCIES = knownCurrencies();

const requiredText = (what: string, max = 200) =>
  text({ error: `Enter the ${what}.` })
    .trim()
    .min(1, `Enter the ${what}.`)
    .max(max, `Keep the ${what} under ${max} characters.`);

export const projectSchema = z.object({
  clientName: requiredText("client's name"),
  name: requiredText("project name"),
  siteName: requiredText("site name"),
  locationLabel: text().trim().max(200, "Keep the location under 200 characters.").default(""),
  elevationM: z
    .number({ error: "Enter the site elevation as a number." })
    .refine(Number.isFinite, "Enter the site elevation as a number.")
    .min(MIN_ELEVATION_M, "The elevation must be at least −500 m (−1,640 ft).")
    .max(MAX_ELEVATION_M, "The elevation must be at most 5,000 m (16,404 ft)."),
  unitSystem: z.enum(UNIT_SYSTEMS, { error: "Choose SI or IP units." }),
  currency: text({ error: "Enter a currency code." })
    .trim()
    .toUpperCase()
    .regex(ISO_CURRENCY, "Use a three-letter ISO 4217 code such as USD, EUR or CAD.")
    .refine((c) => !CURRENCIES || CURRENCIES.has(c), "That is not an ISO 4217 currency code."),
});

/** Editing also names the revision the form was opened at (a stale edit is refused). */
export const projectUpdateSchema = projectSchema.extend({
  revision: z
    .number({ error: "The form is out of date; reload the page." })
    .int("The form is out of date; reload the page.")
    .min(1, "The form is out of date; reload the page.")
    .max(MAX_REVISION, "The form is out of date; reload the page."),
});

/** Creating also names the consulting firm the project belongs to (a member may belong to several). */
export const projectCreateSchema = projectSchema.extend({
  firmId: z.uuid({ error: "Choose the firm this project belongs to." }),
});

export type ProjectInput = z.input<typeof projectSchema>;
export type ProjectFields = z.output<typeof projectSchema>;
export type ProjectCreateInput = z.input<typeof projectCreateSchema>;
export type ProjectCreateFields = z.output<typeof projectCreateSchema>;

/** The form's starting values for a new project. */
export const newProjectDefaults: Omit<ProjectCreateFields, "firmId"> = {
  clientName: "",
  name: "",
  siteName: "",
  locationLabel: "",
  elevationM: 0,
  unitSystem: "SI",
  currency: "USD",
};

/** Field labels, for the error summary and audit details. */
export const PROJECT_FIELD_LABELS: Record<keyof ProjectCreateFields, string> = {
  firmId: "Consulting firm",
  clientName: "Client",
  name: "Project name",
  siteName: "Site name",
  locationLabel: "Location",
  elevationM: "Site elevation",
  unitSystem: "Units",
  currency: "Currency",
};
