/**
 * The editor's number box in an IP project: it shows a converted value rounded (22 kW → "29.5" hp, hand
 * calculation with 1 hp = 745.6999 W, NIST SP 811 (2008) App. B.8) while the form keeps the stored SI value
 * to the last bit, so a box nobody edits saves back exactly what was stored (no drift through the rounding:
 * 29.5 hp would be 21.998 kW). Rendered on the server (react-dom/server); no browser.
 */
import { renderToStaticMarkup } from "react-dom/server";
import { FormProvider, useForm, type UseFormReturn } from "react-hook-form";
import { describe, expect, it } from "vitest";
import { NumberField, UnitsProvider } from "@/components/forms";
import type { UnitSystem } from "@/lib/units";

type Values = { fanPowerKW: number; wetBulbC: number };
const STORED: Values = { fanPowerKW: 22, wetBulbC: 23.8 };

function render(system: UnitSystem): { html: string; values: Values } {
  let form: UseFormReturn<Values> | undefined;
  function Editor() {
    const f = useForm<Values>({ defaultValues: { ...STORED } });
    form = f;
    return (
      <UnitsProvider system={system} currency="USD">
        <FormProvider {...f}>
          <NumberField<Values> name="fanPowerKW" label="Fan motor input" kind="powerKW" />
          <NumberField<Values> name="wetBulbC" label="Design wet bulb" kind="temperatureC" />
        </FormProvider>
      </UnitsProvider>
    );
  }
  const html = renderToStaticMarkup(<Editor />);
  if (!form) throw new Error("form not rendered");
  return { html, values: form.getValues() };
}

const valueOf = (html: string, name: string) => new RegExp(`name="${name}"[^>]*value="([^"]*)"`).exec(html)?.[1];

describe("number box in IP: rounded text, exact stored value", () => {
  it("shows 22 kW as 29.5 hp and 23.8 °C as 74.84 °F (1.8 × 23.8 + 32 = 74.84)", () => {
    const { html } = render("IP");
    expect(valueOf(html, "fanPowerKW")).toBe("29.5");
    expect(valueOf(html, "wetBulbC")).toBe("74.84");
  });

  it("keeps the untouched stored values exactly (22 kW, not 29.5 hp = 21.998 kW)", () => {
    const { values } = render("IP");
    expect(values.fanPowerKW).toBe(22);
    expect(values.wetBulbC).toBe(23.8);
  });

  it("SI shows the stored values as they are", () => {
    const { html, values } = render("SI");
    expect(valueOf(html, "fanPowerKW")).toBe("22");
    expect(valueOf(html, "wetBulbC")).toBe("23.8");
    expect(values).toEqual(STORED);
  });
});
