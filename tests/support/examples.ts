/** Loads an example layout (JSON encoding) for tests. */
import { readFileSync } from "node:fs";
import { parseLayoutText } from "@/lib/layout";
import type { Layout } from "@/lib/layout/model";

export const exampleNames = [
  "breadboard-four-feet",
  "breadboard-three-seats",
  "instrument-plate-socket-vee-flat",
  "mirror-cell-three-vee",
  "flexure-stage-one-freedom",
  "detector-sled-hidden-count",
  "flexure-stage-full-blades",
  "hexapod-wire-platform",
] as const;

/** Parses examples/<name>.json or throws. */
export function example(name: (typeof exampleNames)[number] | string): Layout {
  const r = parseLayoutText(readFileSync(`examples/${name}.json`, "utf8"), { fileName: `${name}.json` });
  if (!r.ok) throw new Error(`${name}: ${JSON.stringify(r.errors)}`);
  return r.layout;
}
