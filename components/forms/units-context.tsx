"use client";

import { createContext, useContext, type ReactNode } from "react";
import type { UnitSystem } from "@/lib/units";

export interface UnitsContextValue {
  system: UnitSystem;
  /** ISO 4217 code shown in money units ("USD/kgal"). */
  currency: string;
}

const UnitsContext = createContext<UnitsContextValue>({ system: "SI", currency: "USD" });

/** Gives every NumberField below it the project's unit system and currency. */
export function UnitsProvider({ system, currency, children }: UnitsContextValue & { children: ReactNode }) {
  return <UnitsContext.Provider value={{ system, currency }}>{children}</UnitsContext.Provider>;
}

export function useUnits(): UnitsContextValue {
  return useContext(UnitsContext);
}
