/** Contracts of materials: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";

const optionalPositive = z.number().positive("Must be greater than zero.").nullable().optional();

export interface ProjectMaterialDto {
  id: string;
  youngsModulusGPa: number | null;
  poissonRatio: number | null;
  allowableContactPressureMPa: number | null;
  expansionPerK: number | null;
  source: string;
  setBy: string | null;
  updatedAt: string;
}

export const projectMaterialSchema = z
  .object({
    id: z
      .string()
      .trim()
      .regex(/^[a-z0-9][a-z0-9-]{0,99}$/, "Use a kebab-case id: lower-case letters, digits and hyphens."),
    youngsModulusGPa: optionalPositive,
    poissonRatio: z.number().gt(-1).lt(0.5, "Poisson's ratio lies between −1 and 0.5.").nullable().optional(),
    allowableContactPressureMPa: optionalPositive,
    expansionPerK: z.number().min(0, "Must not be negative.").max(1e-3, "That is far beyond any solid (1/K).").nullable().optional(),
    source: z.string().trim().min(5, "Name the source: a supplier datasheet, a standard or a test report.").max(500),
  })
  .refine((m) => [m.youngsModulusGPa, m.poissonRatio, m.allowableContactPressureMPa, m.expansionPerK].some((v) => v !== null && v !== undefined), {
    message: "Give at least one value.",
  });
