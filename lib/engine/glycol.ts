/**
 * Properties of the process-loop fluid: water, or aqueous ethylene or propylene glycol.
 *
 * Source: Å. Melinder, "Properties of Secondary Working Fluids for Indirect Systems", IIR (2010),
 * as tabulated (SecCool tables, columns = mass % glycol) in the open CoolProp property library's
 * incompressible-liquid data files "Melinder, Ethylene glycol_*.txt" and "Melinder, Propylene
 * Glycol_*.txt". Values at 20 °C and 40 °C are transcribed below for the columns listed; between
 * columns the properties are interpolated linearly in mass fraction (viscosity in its logarithm),
 * between 20 and 40 °C linearly in temperature (viscosity in its logarithm) and held outside.
 * The column labels were checked against the published freezing points (e.g. 30 % ethylene glycol
 * freezes near −15 °C). Screening accuracy: a few per cent.
 */

export type GlycolKind = "none" | "ethyleneGlycol" | "propyleneGlycol";

export interface FluidProperties {
  densityKgPerM3: number;
  specificHeatKJPerKgK: number;
  viscosityPaS: number;
  conductivityWPerMK: number;
}

interface Table {
  massFractions: number[];
  /** [20 °C row, 40 °C row] for each property. */
  densityKgPerM3: [number[], number[]];
  specificHeatJPerKgK: [number[], number[]];
  /** 1e−5 Pa·s, as in the source tables. */
  viscosity1e5PaS: [number[], number[]];
  conductivityWPerMK: [number[], number[]];
}

// Water (x = 0) is the table's 0 % column (Melinder EG file), shared by both glycols.
const ETHYLENE_GLYCOL: Table = {
  massFractions: [0, 0.11, 0.21, 0.31, 0.41, 0.51],
  densityKgPerM3: [
    [998.42, 1013.11, 1026.54, 1040.08, 1053.96, 1067.2],
    [992.51, 1006.32, 1018.43, 1030.57, 1043.18, 1055.32],
  ],
  specificHeatJPerKgK: [
    [4181.8, 4054.7, 3912.5, 3715.8, 3490.6, 3274.7],
    [4177.3, 4071.1, 3951.8, 3778.3, 3576.1, 3384.5],
  ],
  viscosity1e5PaS: [
    [100.42, 130.85, 170.74, 222.08, 292.12, 392.31],
    [65.384, 84.255, 106.92, 135.66, 174.3, 223.89],
  ],
  conductivityWPerMK: [
    [0.5979, 0.5483, 0.5042, 0.4611, 0.4211, 0.3858],
    [0.6279, 0.5723, 0.524, 0.4781, 0.4359, 0.3979],
  ],
};

const PROPYLENE_GLYCOL: Table = {
  massFractions: [0, 0.15, 0.22, 0.32, 0.42, 0.52],
  densityKgPerM3: [
    [998.42, 1010.69, 1016.64, 1026.01, 1033.68, 1039.87],
    [992.51, 1003.62, 1008.11, 1015.12, 1021.15, 1026.33],
  ],
  specificHeatJPerKgK: [
    [4181.8, 4071.3, 4002.6, 3884.2, 3718.6, 3536.3],
    [4177.3, 4069.9, 4016.9, 3914.6, 3762.1, 3594.6],
  ],
  viscosity1e5PaS: [
    [100.42, 172.21, 223.42, 324.9, 477.0, 693.27],
    [65.384, 103.21, 126.37, 167.42, 230.85, 319.69],
  ],
  conductivityWPerMK: [
    [0.5979, 0.5153, 0.4833, 0.4348, 0.392, 0.352],
    [0.6279, 0.538, 0.5029, 0.45, 0.4033, 0.361],
  ],
};

function interpolateColumn(xs: number[], row: number[], x: number, logarithmic: boolean): number {
  const last = xs.length - 1;
  const xc = x <= 0 ? 0 : x >= (xs[last] ?? 0) ? (xs[last] ?? 0) : x;
  let i = 0;
  while (i < last - 1 && xc > (xs[i + 1] ?? 0)) i++;
  const x0 = xs[i] ?? 0;
  const x1 = xs[i + 1] ?? 1;
  const w = (xc - x0) / (x1 - x0);
  const y0 = row[i] ?? 0;
  const y1 = row[i + 1] ?? 0;
  return logarithmic ? Math.exp((1 - w) * Math.log(y0) + w * Math.log(y1)) : (1 - w) * y0 + w * y1;
}

function interpolateTable(table: Table, rows: [number[], number[]], x: number, tC: number, logarithmic: boolean): number {
  const a = interpolateColumn(table.massFractions, rows[0], x, logarithmic);
  const b = interpolateColumn(table.massFractions, rows[1], x, logarithmic);
  const w = tC <= 20 ? 0 : tC >= 40 ? 1 : (tC - 20) / 20;
  return logarithmic ? Math.exp((1 - w) * Math.log(a) + w * Math.log(b)) : (1 - w) * a + w * b;
}

/**
 * Density, specific heat, viscosity and conductivity of water or an aqueous glycol at a mass
 * fraction (0…0.5) and temperature (20–40 °C table, held outside). SI units (kJ/(kg·K) for cp).
 * Source: Melinder (2010), IIR, via CoolProp's tables (see module comment).
 */
export function fluidProperties(kind: GlycolKind, massFraction: number, tC: number): FluidProperties {
  const table = kind === "propyleneGlycol" ? PROPYLENE_GLYCOL : ETHYLENE_GLYCOL;
  const x = kind === "none" ? 0 : massFraction;
  return {
    densityKgPerM3: interpolateTable(table, table.densityKgPerM3, x, tC, false),
    specificHeatKJPerKgK: interpolateTable(table, table.specificHeatJPerKgK, x, tC, false) / 1000,
    viscosityPaS: interpolateTable(table, table.viscosity1e5PaS, x, tC, true) * 1e-5,
    conductivityWPerMK: interpolateTable(table, table.conductivityWPerMK, x, tC, false),
  };
}

/**
 * Tube-side heat-transfer coefficient of a fluid relative to water at the same mass flow, turbulent
 * flow: Dittus–Boelter Nu = 0.023·Re^0.8·Pr^0.4 ⇒ h ∝ k^0.6·cp^0.4·μ^−0.4·(ṁ/A)^0.8.
 * Source: Dittus & Boelter (1930) / Incropera & DeWitt, Fundamentals of Heat and Mass Transfer.
 * Dimensionless; 1 for water. (Laminar flow in a strong glycol at low temperature is worse still.)
 */
export function tubeSideCoefficientRatio(fluid: FluidProperties, water: FluidProperties): number {
  return (
    Math.pow(fluid.conductivityWPerMK / water.conductivityWPerMK, 0.6) *
    Math.pow(fluid.specificHeatKJPerKgK / water.specificHeatKJPerKgK, 0.4) *
    Math.pow(fluid.viscosityPaS / water.viscosityPaS, -0.4)
  );
}

/**
 * Friction pressure drop of a fluid relative to water at the same volumetric flow in the same
 * smooth-pipe circuit, turbulent: Blasius f = 0.316·Re^−0.25 ⇒ Δp ∝ ρ^0.75·μ^0.25·V̇^1.75.
 * Source: Blasius (1913) correlation, e.g. in any fluid-mechanics text. Dimensionless.
 */
export function pressureDropRatioAtSameVolumeFlow(fluid: FluidProperties, water: FluidProperties): number {
  return (
    Math.pow(fluid.densityKgPerM3 / water.densityKgPerM3, 0.75) * Math.pow(fluid.viscosityPaS / water.viscosityPaS, 0.25)
  );
}

/**
 * Approximate freezing point of the loop fluid, °C, from the same source's freezing curves
 * (Melinder 2010) at the table columns: EG 11/21/31/41/51 % ≈ −3.5/−8.5/−15.5/−24.5/−37;
 * PG 15/22/32/42/52 % ≈ −5/−8/−14/−22/−36 (linear in between). 0 for water.
 */
export function freezingPointC(kind: GlycolKind, massFraction: number): number {
  if (kind === "none" || massFraction <= 0) return 0;
  const xs = kind === "ethyleneGlycol" ? [0, 0.11, 0.21, 0.31, 0.41, 0.51] : [0, 0.15, 0.22, 0.32, 0.42, 0.52];
  const ts = kind === "ethyleneGlycol" ? [0, -3.5, -8.5, -15.5, -24.5, -37] : [0, -5, -8, -14, -22, -36];
  return interpolateColumn(xs, ts, massFraction, false);
}
