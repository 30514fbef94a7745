/**
 * The table of quantity kinds the forms, tables and reports use. Each kind is named after the SI unit
 * its values are STORED in (the engine's unit: `temperatureC`, `waterFlowLPerS`…); each has the unit
 * shown in a SI project and the unit shown in an IP project. A displayed value v converts to the stored
 * value as (v − offset) × factor, and back as stored / factor + offset.
 * Money kinds carry a `{cur}` placeholder that `unitLabel` replaces with the project's ISO currency code.
 */
import * as F from "./factors";

export type UnitSystem = "SI" | "IP";

export interface DisplayUnit {
  /** Short label shown beside a field or a column heading. */
  symbol: string;
  /** Spoken/long name, for aria-labels and hover text. */
  name: string;
  /** Stored (SI) units per one displayed unit. */
  factor: number;
  /** Displayed value that corresponds to a stored 0 (only temperatures have one). */
  offset?: number;
  /** Where the factor comes from. */
  source: string;
}

export interface QuantityDef {
  label: string;
  /** The stored unit's symbol (what the kind's name ends in). */
  storedSymbol: string;
  SI: DisplayUnit;
  IP: DisplayUnit;
}

const SAME = "identical unit in both systems";
const E8 = "Methods §8";
const SP811 = "NIST SP 811 (2008) App. B.8";

const same = (symbol: string, name: string): DisplayUnit => ({ symbol, name, factor: 1, source: SAME });
const si = (symbol: string, name: string): DisplayUnit => ({ symbol, name, factor: 1, source: "SI (stored unit)" });

export const QUANTITIES = {
  temperatureC: {
    label: "Temperature",
    storedSymbol: "°C",
    SI: si("°C", "degrees Celsius"),
    IP: { symbol: "°F", name: "degrees Fahrenheit", factor: 1 / F.F_PER_K, offset: 32, source: `${SP811}: t°C = (t°F − 32)/1.8` },
  },
  temperatureDifferenceK: {
    label: "Temperature difference",
    storedSymbol: "K",
    SI: si("K", "kelvin (difference)"),
    IP: { symbol: "°F", name: "degrees Fahrenheit (difference)", factor: 1 / F.F_PER_K, source: `${E8}: differences convert without the 32° offset; 1 K = 1.8 °F` },
  },
  waterFlowLPerS: {
    label: "Water flow",
    storedSymbol: "L/s",
    SI: si("L/s", "litres per second"),
    IP: { symbol: "gpm", name: "US gallons per minute", factor: F.L_PER_S_PER_GPM, source: `${E8}: 1 gpm = 0.0630901964 L/s` },
  },
  waterFlowM3PerH: {
    label: "Water flow",
    storedSymbol: "m³/h",
    SI: si("m³/h", "cubic metres per hour"),
    IP: { symbol: "gpm", name: "US gallons per minute", factor: F.L_PER_S_PER_GPM * 3.6, source: `${E8}: 1 gpm = 0.0630901964 L/s; 1 L/s = 3.6 m³/h` },
  },
  volumeM3: {
    label: "Volume",
    storedSymbol: "m³",
    SI: si("m³", "cubic metres"),
    IP: { symbol: "gal", name: "US gallons", factor: F.M3_PER_US_GAL, source: `${E8}: 1 US gal = 3.785411784 L` },
  },
  waterVolumeM3: {
    label: "Water volume",
    storedSymbol: "m³",
    SI: si("m³", "cubic metres"),
    IP: { symbol: "kgal", name: "thousand US gallons", factor: F.M3_PER_KGAL, source: `${E8}: 1 kgal = 3.785411784 m³` },
  },
  waterVolumeCcfM3: {
    label: "Water volume (billing)",
    storedSymbol: "m³",
    SI: si("m³", "cubic metres"),
    IP: { symbol: "CCF", name: "hundred cubic feet", factor: F.M3_PER_CCF, source: `${E8}: 1 CCF = 2.8316846592 m³` },
  },
  powerKW: {
    label: "Power (motor)",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: { symbol: "hp", name: "horsepower", factor: F.KW_PER_HP, source: `${E8}: 1 hp = 0.7457 kW; ${SP811}: 745.6999 W` },
  },
  powerBtuPerHKW: {
    label: "Power",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: { symbol: "Btu/h", name: "Btu per hour", factor: F.W_PER_BTU_PER_H / 1000, source: `${E8}: 1 Btu/h = 0.29307107 W` },
  },
  heatDutyKW: {
    label: "Heat duty",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: { symbol: "Btu/h", name: "Btu per hour", factor: F.W_PER_BTU_PER_H / 1000, source: `${E8}: 1 Btu/h = 0.29307107 W` },
  },
  heatDutyMbhKW: {
    label: "Heat duty",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: { symbol: "MBH", name: "thousand Btu per hour", factor: F.W_PER_BTU_PER_H, source: `${E8}: 1 Btu/h = 0.29307107 W; 1 MBH = 1000 Btu/h [practice]` },
  },
  refrigerationTonsKW: {
    label: "Refrigeration load",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: {
      symbol: "TR",
      name: "tons of refrigeration (12,000 Btu/h)",
      factor: F.KW_PER_TON_REFRIGERATION,
      source: `${E8}: 1 ton of refrigeration = 12,000 Btu/h = 3.516853 kW`,
    },
  },
  coolingTowerTonsKW: {
    label: "Heat rejection",
    storedSymbol: "kW",
    SI: si("kW", "kilowatts"),
    IP: {
      symbol: "tower tons",
      name: "cooling-tower tons (15,000 Btu/h of heat rejected)",
      factor: F.KW_PER_TON_COOLING_TOWER,
      source: `${E8}: the cooling-tower ton = 15,000 Btu/h of heat rejection`,
    },
  },
  energyKWh: {
    label: "Electric energy",
    storedSymbol: "kWh",
    SI: same("kWh", "kilowatt-hours"),
    IP: same("kWh", "kilowatt-hours"),
  },
  heatEnergyKWh: {
    label: "Heat",
    storedSymbol: "kWh",
    SI: si("kWh", "kilowatt-hours"),
    IP: { symbol: "MMBtu", name: "million Btu", factor: F.KWH_PER_MMBTU, source: `${SP811}: Btu_IT = 1055.05585262 J` },
  },
  pressureKPa: {
    label: "Pressure",
    storedSymbol: "kPa",
    SI: si("kPa", "kilopascals"),
    IP: { symbol: "psi", name: "pounds per square inch", factor: F.KPA_PER_PSI, source: `${E8}: 1 psi = 6.894757 kPa` },
  },
  pressureDropKPa: {
    label: "Pressure drop",
    storedSymbol: "kPa",
    SI: si("kPa", "kilopascals"),
    IP: {
      symbol: "ft w.c.",
      name: "feet of water column",
      factor: F.KPA_PER_FT_WATER,
      source: `${E8}: 1 ft of water ≈ 2.989 kPa; ${SP811}: conventional foot of water 2.989067 kPa`,
    },
  },
  headM: {
    label: "Pump head",
    storedSymbol: "m",
    SI: si("m", "metres of water column"),
    IP: { symbol: "ft", name: "feet of water column", factor: F.M_PER_FT, source: `${SP811}: 1 ft = 0.3048 m (exact)` },
  },
  lengthM: {
    label: "Length",
    storedSymbol: "m",
    SI: si("m", "metres"),
    IP: { symbol: "ft", name: "feet", factor: F.M_PER_FT, source: `${SP811}: 1 ft = 0.3048 m (exact)` },
  },
  lengthMm: {
    label: "Length",
    storedSymbol: "mm",
    SI: si("mm", "millimetres"),
    IP: { symbol: "in", name: "inches", factor: F.M_PER_IN * 1000, source: `${SP811}: 1 in = 25.4 mm (exact)` },
  },
  elevationM: {
    label: "Elevation",
    storedSymbol: "m",
    SI: si("m", "metres above sea level"),
    IP: { symbol: "ft", name: "feet above sea level", factor: F.M_PER_FT, source: `${SP811}: 1 ft = 0.3048 m (exact)` },
  },
  areaM2: {
    label: "Area",
    storedSymbol: "m²",
    SI: si("m²", "square metres"),
    IP: { symbol: "ft²", name: "square feet", factor: F.M2_PER_FT2, source: `${SP811}: 1 ft² = 0.09290304 m² (exact)` },
  },
  massKg: {
    label: "Mass",
    storedSymbol: "kg",
    SI: si("kg", "kilograms"),
    IP: { symbol: "lb", name: "pounds", factor: F.KG_PER_LB, source: `${SP811}: 1 lb = 0.45359237 kg (exact)` },
  },
  massFlowKgPerS: {
    label: "Mass flow",
    storedSymbol: "kg/s",
    SI: si("kg/s", "kilograms per second"),
    IP: { symbol: "lb/h", name: "pounds per hour", factor: F.KG_PER_S_PER_LB_PER_H, source: `${SP811}: 1 lb/h = 1.259979e−4 kg/s` },
  },
  concentrationMgPerL: {
    label: "Concentration",
    storedSymbol: "mg/L",
    SI: si("mg/L", "milligrams per litre"),
    IP: {
      symbol: "ppm",
      name: "parts per million (by mass)",
      factor: 1,
      source: "mg/L and ppm are taken as identical for dilute water (density ≈ 1 kg/L) [practice]",
    },
  },
  conductivityUSPerCm: {
    label: "Conductivity",
    storedSymbol: "µS/cm",
    SI: same("µS/cm", "microsiemens per centimetre"),
    IP: same("µS/cm", "microsiemens per centimetre"),
  },
  heatTransferCoefficientWPerM2K: {
    label: "Heat-transfer coefficient (U)",
    storedSymbol: "W/(m²·K)",
    SI: si("W/(m²·K)", "watts per square-metre kelvin"),
    IP: {
      symbol: "Btu/(h·ft²·°F)",
      name: "Btu per hour square-foot degree Fahrenheit",
      factor: F.W_PER_M2K_PER_BTU_PER_HFT2F,
      source: `${SP811}: 1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K)`,
    },
  },
  foulingM2KPerW: {
    label: "Fouling resistance",
    storedSymbol: "m²·K/W",
    SI: si("m²·K/W", "square-metre kelvin per watt"),
    IP: {
      symbol: "h·ft²·°F/Btu",
      name: "hour square-foot degree Fahrenheit per Btu",
      factor: F.M2K_PER_W_PER_HFT2F_PER_BTU,
      source: `${SP811}: 1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K)`,
    },
  },
  uaKWPerK: {
    label: "Conductance (UA)",
    storedSymbol: "kW/K",
    SI: si("kW/K", "kilowatts per kelvin"),
    IP: { symbol: "Btu/(h·°F)", name: "Btu per hour per degree Fahrenheit", factor: F.KW_PER_K_PER_BTU_PER_HF, source: `${E8}: 1 Btu/h = 0.29307107 W; 1 K = 1.8 °F` },
  },
  airflowM3PerS: {
    label: "Airflow",
    storedSymbol: "m³/s",
    SI: si("m³/s", "cubic metres per second"),
    IP: { symbol: "cfm", name: "cubic feet per minute", factor: F.M3_PER_S_PER_CFM, source: `${SP811}: 1 cfm = 4.719474e−4 m³/s` },
  },
  velocityMPerS: {
    label: "Velocity",
    storedSymbol: "m/s",
    SI: si("m/s", "metres per second"),
    IP: { symbol: "fpm", name: "feet per minute", factor: F.M_PER_S_PER_FPM, source: `${SP811}: 1 ft/min = 0.00508 m/s (exact)` },
  },
  densityKgPerM3: {
    label: "Density",
    storedSymbol: "kg/m³",
    SI: si("kg/m³", "kilograms per cubic metre"),
    IP: { symbol: "lb/ft³", name: "pounds per cubic foot", factor: F.KG_PER_M3_PER_LB_PER_FT3, source: `${SP811}: 1 lb/ft³ = 16.01846 kg/m³` },
  },
  specificHeatKJPerKgK: {
    label: "Specific heat",
    storedSymbol: "kJ/(kg·K)",
    SI: si("kJ/(kg·K)", "kilojoules per kilogram kelvin"),
    IP: { symbol: "Btu/(lb·°F)", name: "Btu per pound degree Fahrenheit", factor: F.KJ_PER_KGK_PER_BTU_PER_LBF, source: `${SP811}: 1 Btu_IT/(lb·°F) = 4.1868 kJ/(kg·K) (exact)` },
  },
  enthalpyKJPerKg: {
    label: "Specific enthalpy",
    storedSymbol: "kJ/kg",
    SI: si("kJ/kg", "kilojoules per kilogram"),
    IP: { symbol: "Btu/lb", name: "Btu per pound", factor: F.KJ_PER_KG_PER_BTU_PER_LB, source: `${SP811}: 1 Btu_IT/lb = 2.326 kJ/kg (exact)` },
  },
  percentPerK: {
    label: "Sensitivity per degree",
    storedSymbol: "%/K",
    SI: si("%/K", "percent per kelvin"),
    // x %/°F = 1.8·x %/K, since one kelvin spans 1.8 °F.
    IP: { symbol: "%/°F", name: "percent per degree Fahrenheit", factor: F.F_PER_K, source: `${SP811}: 1 K = 1.8 °F (difference)` },
  },
  pricePerM3: {
    label: "Price per volume",
    storedSymbol: "{cur}/m³",
    SI: si("{cur}/m³", "per cubic metre"),
    // A price per kgal is the price of 3.785411784 m³: price/m³ = price/kgal ÷ 3.785411784.
    IP: { symbol: "{cur}/kgal", name: "per thousand US gallons", factor: 1 / F.M3_PER_KGAL, source: `${E8}: 1 kgal = 3.785411784 m³` },
  },
  pricePerM3Ccf: {
    label: "Price per volume (billing)",
    storedSymbol: "{cur}/m³",
    SI: si("{cur}/m³", "per cubic metre"),
    IP: { symbol: "{cur}/CCF", name: "per hundred cubic feet", factor: 1 / F.M3_PER_CCF, source: `${E8}: 1 CCF = 2.8316846592 m³` },
  },
  pricePerKWh: {
    label: "Energy price",
    storedSymbol: "{cur}/kWh",
    SI: same("{cur}/kWh", "per kilowatt-hour"),
    IP: same("{cur}/kWh", "per kilowatt-hour"),
  },
  pricePerKW: {
    label: "Demand charge",
    storedSymbol: "{cur}/kW",
    SI: same("{cur}/kW", "per kilowatt"),
    IP: same("{cur}/kW", "per kilowatt"),
  },
  pricePerKg: {
    label: "Price per mass",
    storedSymbol: "{cur}/kg",
    SI: si("{cur}/kg", "per kilogram"),
    IP: { symbol: "{cur}/lb", name: "per pound", factor: 1 / F.KG_PER_LB, source: `${SP811}: 1 lb = 0.45359237 kg (exact)` },
  },
  money: { label: "Amount", storedSymbol: "{cur}", SI: same("{cur}", "currency"), IP: same("{cur}", "currency") },
  percent: { label: "Percent", storedSymbol: "%", SI: same("%", "percent"), IP: same("%", "percent") },
  ratio: { label: "Ratio", storedSymbol: "", SI: same("", "dimensionless"), IP: same("", "dimensionless") },
  count: { label: "Count", storedSymbol: "", SI: same("", "count"), IP: same("", "count") },
  years: { label: "Duration", storedSymbol: "years", SI: same("years", "years"), IP: same("years", "years") },
  months: { label: "Duration", storedSymbol: "months", SI: same("months", "months"), IP: same("months", "months") },
  hours: { label: "Duration", storedSymbol: "h", SI: same("h", "hours"), IP: same("h", "hours") },
} as const satisfies Record<string, QuantityDef>;

export type QuantityKind = keyof typeof QUANTITIES;

export const QUANTITY_KINDS = Object.keys(QUANTITIES) as QuantityKind[];

export function isQuantityKind(v: unknown): v is QuantityKind {
  return typeof v === "string" && Object.prototype.hasOwnProperty.call(QUANTITIES, v);
}
