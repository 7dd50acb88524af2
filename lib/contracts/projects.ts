/** Contracts of projects: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";

export interface ProjectDto {
  id: number;
  name: string;
  description: string;
  checker: { id: number; name: string } | null;
  createdBy: string | null;
  createdAt: string;
  /** layouts in the project */
  layouts: number;
  /** findings open or reopened on the layouts' newest revisions */
  openFindings: number;
}

export const projectInputSchema = z.object({
  name: z.string().trim().min(3, "Name needs at least 3 characters.").max(120, "Name is at most 120 characters."),
  description: z.string().trim().max(2000, "Description is at most 2000 characters.").default(""),
  checkerId: z.coerce.number().int().positive().nullable().optional(),
});

export type ProjectInput = z.infer<typeof projectInputSchema>;

export const assignCheckerSchema = z.object({ checkerId: z.coerce.number().int().positive().nullable() });
