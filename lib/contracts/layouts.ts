/** Contracts of layouts: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";

export const layoutInputSchema = z.object({
  name: z.string().trim().min(3, "Name needs at least 3 characters.").max(160, "Name is at most 160 characters."),
  description: z.string().trim().max(2000, "Description is at most 2000 characters.").default(""),
});

export interface LayoutSummaryDto {
  id: number;
  projectId: number;
  projectName: string;
  name: string;
  description: string;
  createdBy: string;
  createdAt: string;
  revisions: number;
  latestRevision: { id: number; number: number; createdAt: string; freedoms: number; redundancies: number } | null;
  openErrors: number;
  openWarnings: number;
  openInfos: number;
  waived: number;
  released: boolean;
  releaseRequested: boolean;
}
