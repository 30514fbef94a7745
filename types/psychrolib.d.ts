/**
 * Types for the `psychrolib` npm package (1.1.1), which ships none. Only the functions LoopLedger
 * calls are declared. The library keeps one global unit system; lib/engine/psychrometrics.ts sets
 * it to SI and is the only module that should import this package.
 * Units below are the SI ones: °C, Pa, kg/kg dry air, J/kg dry air, RH as a fraction 0…1.
 */
declare module "psychrolib" {
  interface Psychrolib {
    readonly IP: 1;
    readonly SI: 2;
    SetUnitSystem(unitSystem: 1 | 2): void;
    GetUnitSystem(): 1 | 2 | undefined;

    GetSatVapPres(tDryBulbC: number): number;
    GetSatHumRatio(tDryBulbC: number, pressurePa: number): number;
    GetSatAirEnthalpy(tDryBulbC: number, pressurePa: number): number;
    GetMoistAirEnthalpy(tDryBulbC: number, humRatio: number): number;
    GetHumRatioFromVapPres(vapPresPa: number, pressurePa: number): number;
    GetVapPresFromHumRatio(humRatio: number, pressurePa: number): number;
    GetStandardAtmPressure(altitudeM: number): number;

    GetTWetBulbFromTDewPoint(tDryBulbC: number, tDewPointC: number, pressurePa: number): number;
    GetTWetBulbFromRelHum(tDryBulbC: number, relHum: number, pressurePa: number): number;
    GetTWetBulbFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number;
    GetRelHumFromTWetBulb(tDryBulbC: number, tWetBulbC: number, pressurePa: number): number;
    GetRelHumFromTDewPoint(tDryBulbC: number, tDewPointC: number): number;
    GetRelHumFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number;
    GetTDewPointFromRelHum(tDryBulbC: number, relHum: number): number;
    GetTDewPointFromTWetBulb(tDryBulbC: number, tWetBulbC: number, pressurePa: number): number;
    GetTDewPointFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number;
    GetTDewPointFromVapPres(tDryBulbC: number, vapPresPa: number): number;
    GetHumRatioFromTWetBulb(tDryBulbC: number, tWetBulbC: number, pressurePa: number): number;
    GetHumRatioFromRelHum(tDryBulbC: number, relHum: number, pressurePa: number): number;
    GetHumRatioFromTDewPoint(tDewPointC: number, pressurePa: number): number;
  }
  const psychrolib: Psychrolib;
  export = psychrolib;
}
