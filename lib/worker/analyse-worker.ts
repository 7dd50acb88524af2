/** Worker thread (pooled by piscina, see run-analysis.ts): parses and analyses one layout file off the server's event loop. */
import { parseLayoutBytes, type Encoding } from "@/lib/layout";
import { detectEncoding } from "@/lib/layout";
import type { ForceUnit, LengthUnit } from "@/lib/layout/units";
import type { Material } from "@/lib/layout/model";
import { runEngine } from "@/lib/engine";
import type { RuleOverride } from "@/rules";

export interface WorkerRequest {
  bytes: Uint8Array;
  fileName: string;
  encoding?: Encoding;
  length?: LengthUnit;
  force?: ForceUnit;
  /** the project's rule overrides in force */
  overrides?: Record<string, RuleOverride>;
  /** the project's materials library */
  library?: Material[];
}

/** One task: the parse errors, or the layout with its report; an engine exception comes back as `crashed`. */
export function analyse(req: WorkerRequest) {
  try {
    const bytes = new Uint8Array(req.bytes);
    const parsed = parseLayoutBytes(bytes, { fileName: req.fileName, encoding: req.encoding, length: req.length, force: req.force, library: req.library });
    if (!parsed.ok) return { ok: false, errors: parsed.errors };
    const text = new TextDecoder().decode(bytes);
    const encoding = req.encoding ?? detectEncoding(text, req.fileName);
    const { report } = runEngine(parsed.layout, req.overrides ?? {});
    return { ok: true, layout: parsed.layout, report, encoding, text, warnings: parsed.warnings };
  } catch (err) {
    return { ok: false, crashed: true, message: (err as Error).message };
  }
}
