/**
 * Built-in contact materials. Each value names where it comes from; "value from memory" marks a
 * handbook figure recalled, not re-read. Allowable pressures are maximum Hertz pressures p0 for
 * static, non-repeating contact; precision mounts usually stay well below them for repeatability.
 * Expansion coefficients are mid-range values near 20 °C from handbook ranges not re-read here
 * (value from memory): a project should enter its supplier's figure as a custom material.
 */
import type { Material } from "./model";

export interface BuiltinMaterial extends Material {
  name: string;
  youngsModulusGPa: number;
  poissonRatio: number;
  expansionPerK: number;
  source: string;
}

export const builtinMaterials: BuiltinMaterial[] = [
  {
    id: "bearing-steel",
    name: "Through-hardened bearing steel (100Cr6 / 52100 type)",
    youngsModulusGPa: 210,
    poissonRatio: 0.3,
    allowableContactPressureMPa: 4200,
    expansionPerK: 11.9e-6,
    source:
      "E, ν: bearing handbooks 200–210 GPa / 0.3 (value from memory); p0 4200 MPa: ISO 76 static load rating basis for ball bearings; α 11.9e-6/K near 20 °C: bearing-steel handbook range 11–12.5e-6/K (value from memory)",
  },
  {
    id: "stainless-martensitic",
    name: "Martensitic stainless steel (440C type), hardened",
    youngsModulusGPa: 200,
    poissonRatio: 0.28,
    allowableContactPressureMPa: 3900,
    expansionPerK: 10.2e-6,
    source:
      "E, ν: steel handbooks (value from memory); p0 ≈ 3900 MPa from a vendor's ≈20 % lower static capacity than bearing steel with p0 ∝ C0^(1/3); α 10.2e-6/K near 20 °C: martensitic stainless ≈ 10e-6/K (value from memory)",
  },
  {
    id: "silicon-nitride",
    name: "Silicon nitride, bearing grade (HIP Si3N4)",
    youngsModulusGPa: 310,
    poissonRatio: 0.27,
    allowableContactPressureMPa: 4200,
    expansionPerK: 3.2e-6,
    source:
      "E, ν: 300–320 GPa / 0.26–0.27, handbooks (value from memory); p0: ISO 20056 rates ceramic balls somewhat above ISO 76, so the ISO 76 figure is kept (common practice, conservative); α 3.2e-6/K: silicon nitride ≈ 3e-6/K (value from memory)",
  },
  {
    id: "cemented-carbide",
    name: "Cemented tungsten carbide (WC–Co, ~6 % Co)",
    youngsModulusGPa: 620,
    poissonRatio: 0.22,
    allowableContactPressureMPa: 4500,
    expansionPerK: 5.5e-6,
    source:
      "E, ν: 600–650 GPa / 0.22, handbooks (value from memory); p0: compressive strength well above 4.5 GPa, figure kept conservative (common practice); α 5.5e-6/K: cemented carbide 5–6e-6/K (value from memory)",
  },
  {
    id: "alumina",
    name: "Alumina ceramic, 99.5 %",
    youngsModulusGPa: 370,
    poissonRatio: 0.22,
    allowableContactPressureMPa: 2000,
    expansionPerK: 7.5e-6,
    source:
      "E, ν: technical-ceramic data sheets (value from memory); p0 2000 MPa: brittle material, kept low against ring cracking (common practice); α 7.5e-6/K: alumina 7–8e-6/K (value from memory)",
  },
  {
    id: "fused-silica",
    name: "Fused silica (synthetic, optical grade)",
    youngsModulusGPa: 72.7,
    poissonRatio: 0.16,
    allowableContactPressureMPa: 500,
    expansionPerK: 0.55e-6,
    source:
      "E, ν: optical glass maker's data (value from memory); p0 500 MPa: glass fails in tension at the contact edge, figure kept low (common practice); α 0.55e-6/K: fused silica ≈ 0.55e-6/K (value from memory)",
  },
  {
    id: "aluminium-alloy",
    name: "Aluminium alloy 6061-T6",
    youngsModulusGPa: 68.9,
    poissonRatio: 0.33,
    allowableContactPressureMPa: 440,
    expansionPerK: 23.6e-6,
    source:
      "E, ν, yield 276 MPa: aluminium handbooks (value from memory); p0 = 1.6 Y, onset of yield under a sphere, Johnson, Contact Mechanics §6.2 (value from memory); α 23.6e-6/K: 6061 aluminium ≈ 23–24e-6/K (value from memory)",
  },
  {
    id: "low-expansion-alloy",
    name: "Iron–36 % nickel low-expansion alloy, annealed",
    youngsModulusGPa: 141,
    poissonRatio: 0.26,
    allowableContactPressureMPa: 440,
    expansionPerK: 1.3e-6,
    source:
      "E, ν, yield ≈ 276 MPa: alloy maker's data (value from memory); p0 = 1.6 Y, Johnson, Contact Mechanics §6.2 (value from memory); α 1.3e-6/K: iron–36 % nickel 1.2–1.6e-6/K annealed (value from memory)",
  },
];

export const builtinMaterialIds: string[] = builtinMaterials.map((m) => m.id);

/** A material by id: the layout's own first, then the built-in table. */
export function findMaterial(layout: { materials: Material[] }, id: string | undefined): Material | undefined {
  if (id === undefined) return undefined;
  return layout.materials.find((m) => m.id === id) ?? builtinMaterials.find((m) => m.id === id);
}
