/** The project input schema gives field errors a person can act on. */
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { projectInputSchema } from "@/lib/db/projects";

describe("projectInputSchema", () => {
  it("trims and accepts a good project", () => {
    expect(projectInputSchema.parse({ name: "  Cold plate ", description: "x" })).toMatchObject({ name: "Cold plate" });
  });
  it("names the field and the reason for a short name", () => {
    const r = projectInputSchema.safeParse({ name: "ab" });
    expect(r.success).toBe(false);
    if (!r.success) expect(z.flattenError(r.error).fieldErrors.name?.[0]).toContain("at least 3");
  });
});
