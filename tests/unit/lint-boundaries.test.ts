/** The import boundaries of the layer map (eslint.config.mjs) fire where they must and stay quiet where they must not. */
import { describe, expect, it } from "vitest";
import { ESLint } from "eslint";

const eslint = new ESLint({ cwd: process.cwd() });
const boundaryErrors = async (filePath: string, code: string) => {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === "no-restricted-imports").map((m) => m.message);
};

describe("import boundaries", () => {
  it.each([
    [
      "a component importing the database layer",
      "components/x/probe.tsx",
      'import { listProjects } from "@/lib/db/projects";\nexport const p = listProjects;\n',
      /Components import DTO types/,
    ],
    ["the analysis importing the database", "lib/analysis/probe.ts", 'import { db } from "@/lib/db/knex";\nexport const p = db;\n', /Pure layers/],
    ["a rule importing React", "rules/probe.ts", 'import { useState } from "react";\nexport const p = useState;\n', /Pure layers/],
    ["the layout reader importing Next", "lib/layout/probe.ts", 'import { headers } from "next/headers";\nexport const p = headers;\n', /Pure layers/],
    ["a route handler opening a query", "app/api/probe/route.ts", 'import { db } from "@/lib/db/knex";\nexport const p = db;\n', /Queries live in lib\/db/],
    ["a library module importing knex", "lib/report/probe.ts", 'import knex from "knex";\nexport const p = knex;\n', /Queries live in lib\/db/],
  ])("refuses %s", async (_name, file, code, message) => {
    expect((await boundaryErrors(file, code)).join(" ")).toMatch(message);
  });

  it.each([
    ["a component importing contracts", "components/x/probe.tsx", 'import type { ProjectDto } from "@/lib/contracts/projects";\nexport type P = ProjectDto;\n'],
    ["an entity file using the connection", "lib/db/probe.ts", 'import { db } from "./knex";\nexport const p = db;\n'],
    ["a route handler calling lib/db", "app/api/probe/route.ts", 'import { listProjects } from "@/lib/db/projects";\nexport const p = listProjects;\n'],
  ])("allows %s", async (_name, file, code) => {
    expect(await boundaryErrors(file, code)).toEqual([]);
  });
});
