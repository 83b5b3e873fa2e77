/**
 * Reading the designer's boxes as the analysis does: a box the user has not changed stands for
 * the stored SI value behind it (plan-form.ts `exactValues`), not for its rounded text. In feet
 * a 3 m spacing shows "9.84" (2.9992 m); the spread panel's figures used to follow the text
 * (spread length 226.32 ft, end shot at 231.24 ft) while the analysis beside them used 3 m
 * (226.38 ft, 231.30 ft).
 */
import { createContext, useContext } from "react";
import { parseInput, type Quantity, type UnitSystem } from "@/lib/units";
import type { ExactValues } from "../lib/plan-form";

export type TypedNumber = (
  quantity: Quantity,
  typed: string | undefined,
  units: UnitSystem,
) => number | undefined;

/** The stored values behind the boxes (none outside the designer page: plain parsing). */
export const ExactValuesContext = createContext<ExactValues | null>(null);

/** `parseInput`, except that a box still showing a stored value gives that value exactly. */
export function typedNumber(exact: ExactValues | null): TypedNumber {
  if (!exact || exact.size === 0) return parseInput;
  // The key plan-form.ts writes: quantity and the box's text as formatInput shows it.
  return (quantity, typed, units) =>
    exact.get(`${quantity}:${(typed ?? "").trim()}`) ?? parseInput(quantity, typed, units);
}

export function useTypedNumber(): TypedNumber {
  return typedNumber(useContext(ExactValuesContext));
}
