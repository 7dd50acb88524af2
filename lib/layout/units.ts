/** File units and their SI factors (from mathjs's unit definitions, not a hand-typed table). */
import { create, unitDependencies } from "mathjs";

// only the unit function and what it depends on: the full mathjs instance builds every typed function at
// load (≈ 60 ms of the command-line checker's start-up)
const { unit } = create({ unitDependencies });

export const lengthUnits = ["m", "mm", "um", "in"] as const;
export const forceUnits = ["N", "kN", "lbf"] as const;
export type LengthUnit = (typeof lengthUnits)[number];
export type ForceUnit = (typeof forceUnits)[number];

/** Metres in one file length unit. */
export function metresPer(u: LengthUnit): number {
  return unit(1, u).toNumber("m");
}

/** Newtons in one file force unit. */
export function newtonsPer(u: ForceUnit): number {
  return unit(1, u).toNumber("N");
}

/** How a unit is written for people (µm rather than um). */
export function unitLabel(u: LengthUnit | ForceUnit): string {
  return u === "um" ? "µm" : u;
}
