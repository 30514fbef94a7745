/**
 * Conversion factors, SI per IP unit. Exact where the unit is defined exactly; each carries its source.
 * Sources:
 *  [E8]  lib/methods/methods.md §8 (the project's unit definitions).
 *  [SP811] NIST Special Publication 811 (2008), "Guide for the Use of the International System of Units",
 *        Appendix B.8/B.9 (conversion factors; the international foot, pound and Btu_IT are exact by definition).
 * Derived factors are built from the exact base definitions, so their digits follow from them.
 */

/** International foot, m (exact; SP 811 B.8, international yard and pound agreement of 1959). */
export const M_PER_FT = 0.3048;
/** Inch, m (exact; SP 811 B.8). */
export const M_PER_IN = 0.0254;
/** US liquid gallon, m³ (exact: 231 in³; SP 811 B.8; [E8] 3.785411784 L). */
export const M3_PER_US_GAL = 3.785411784e-3;
/** Thousand US gallons, m³ ([E8] 1 kgal = 3.785411784 m³). */
export const M3_PER_KGAL = 3.785411784;
/** Hundred cubic feet (CCF, the US water-utility billing unit), m³ ([E8] 2.8316846592 m³; = 100 × 0.3048³). */
export const M3_PER_CCF = 2.8316846592;
/** Cubic foot, m³ (exact: 0.3048³; SP 811 B.8). */
export const M3_PER_FT3 = 0.028316846592;
/** Avoirdupois pound, kg (exact; SP 811 B.8). */
export const KG_PER_LB = 0.45359237;
/** International Table Btu, J (exact by definition, 1 Btu_IT = 1055.05585262 J; SP 811 B.8). */
export const J_PER_BTU = 1055.05585262;
/** Btu/h, W (= J_PER_BTU / 3600; [E8] 0.29307107 W). */
export const W_PER_BTU_PER_H = J_PER_BTU / 3600;
/** Ton of refrigeration = 12,000 Btu/h, kW ([E8] 3.516853 kW). */
export const KW_PER_TON_REFRIGERATION = (12_000 * W_PER_BTU_PER_H) / 1000;
/**
 * Cooling-tower ton = 15,000 Btu/h of heat rejected, kW ([E8]). It is larger than the ton of refrigeration
 * because a tower rejects the refrigeration load plus the compressor's heat (~25 % more) [practice].
 */
export const KW_PER_TON_COOLING_TOWER = (15_000 * W_PER_BTU_PER_H) / 1000;
/** Standard acceleration of gravity, m/s² (exact; SP 811 B.8 note). */
export const STANDARD_GRAVITY = 9.80665;
/** Pound-force, N (exact: lb × g_n; SP 811 B.8 4.448222 N). */
export const N_PER_LBF = KG_PER_LB * STANDARD_GRAVITY;
/** Mechanical horsepower (550 ft·lbf/s), kW (SP 811 B.8: 7.456999 E+02 W; [E8] 0.7457 kW). */
export const KW_PER_HP = (550 * M_PER_FT * N_PER_LBF) / 1000;
/** psi, kPa (exact: lbf/in²; SP 811 B.8 6.894757 E+03 Pa; [E8] 6.894757 kPa). */
export const KPA_PER_PSI = N_PER_LBF / (M_PER_IN * M_PER_IN) / 1000;
/**
 * Conventional foot of water, kPa: 1000 kg/m³ × g_n × 0.3048 m (SP 811 B.8 "foot of water, conventional"
 * 2.989067 E+03 Pa; [E8] ≈ 2.989 kPa).
 */
export const KPA_PER_FT_WATER = (1000 * STANDARD_GRAVITY * M_PER_FT) / 1000;
/** US gallon per minute, L/s ([E8] 0.0630901964 L/s = 3.785411784 L / 60 s). */
export const L_PER_S_PER_GPM = (M3_PER_US_GAL * 1000) / 60;
/** Cubic foot per minute, m³/s (exact: 0.3048³ / 60; SP 811 B.8 4.719474 E−04 m³/s). */
export const M3_PER_S_PER_CFM = M3_PER_FT3 / 60;
/** lb/ft³, kg/m³ (SP 811 B.8 1.601846 E+01 kg/m³). */
export const KG_PER_M3_PER_LB_PER_FT3 = KG_PER_LB / M3_PER_FT3;
/** Btu/(h·ft²·°F), W/(m²·K) (SP 811 B.8 5.678263 W/(m²·K)), for U-values; its reciprocal converts fouling resistances. */
export const W_PER_M2K_PER_BTU_PER_HFT2F = W_PER_BTU_PER_H / ((M_PER_FT * M_PER_FT) * (5 / 9));
/** h·ft²·°F/Btu, m²·K/W (reciprocal of the above; SP 811 B.8 1.761102 E−01 m²·K/W). */
export const M2K_PER_W_PER_HFT2F_PER_BTU = 1 / W_PER_M2K_PER_BTU_PER_HFT2F;
/** Btu/lb, kJ/kg (exact: 2.326; SP 811 B.8). */
export const KJ_PER_KG_PER_BTU_PER_LB = J_PER_BTU / KG_PER_LB / 1000;
/** Btu/(lb·°F), kJ/(kg·K) (exact: 4.1868; SP 811 B.8). */
export const KJ_PER_KGK_PER_BTU_PER_LBF = KJ_PER_KG_PER_BTU_PER_LB * 1.8;
/** Btu/(h·°F), kW/K (for UA values). */
export const KW_PER_K_PER_BTU_PER_HF = (W_PER_BTU_PER_H * 1.8) / 1000;
/** Million Btu (MMBtu), kWh (= 1e6 Btu / 3.6e6 J). */
export const KWH_PER_MMBTU = (1e6 * J_PER_BTU) / 3.6e6;
/** Temperature: a kelvin is 1.8 degrees Fahrenheit (exact; SP 811 B.8 "degree Fahrenheit" and §4.2.1.1). */
export const F_PER_K = 1.8;
/** Feet per minute, m/s (exact: 0.3048/60). */
export const M_PER_S_PER_FPM = M_PER_FT / 60;
/** Pound per hour, kg/s (exact: 0.45359237/3600; SP 811 B.8 1.259979 E−04 kg/s). */
export const KG_PER_S_PER_LB_PER_H = KG_PER_LB / 3600;
/** Square foot, m² (exact). */
export const M2_PER_FT2 = M_PER_FT * M_PER_FT;

/**
 * The one water-density convention of LoopLedger (Methods §8): water at 20 °C, 998.2 kg/m³ [pub: IAPWS-95
 * saturated-liquid density at 20 °C, 998.21 kg/m³]. Every conversion between a volume of water (a flow in
 * L/s or gpm, makeup or blowdown in m³ or gallons) and its mass uses it: engine, editor, reports, exports.
 */
export const WATER_DENSITY_KG_PER_M3 = 998.2;
/** The same density per litre, kg/L. */
export const WATER_KG_PER_L = WATER_DENSITY_KG_PER_M3 / 1000;

/** Mass flow of water, kg/s, from its volume flow in L/s. */
export function waterKgPerSFromLPerS(lPerS: number): number {
  return lPerS * WATER_KG_PER_L;
}

/** Volume flow of water, L/s, from its mass flow in kg/s. */
export function waterLPerSFromKgPerS(kgPerS: number): number {
  return kgPerS / WATER_KG_PER_L;
}
