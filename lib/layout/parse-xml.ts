/**
 * XML encoding (attribute-based). DOCTYPE and entity declarations are refused before parsing and
 * entities are never expanded. Errors name the element path and the attribute.
 */
import { XMLParser, XMLValidator } from "fast-xml-parser";
import type { LayoutError, Material, ParseResult } from "./model";
import { readList, readNumber } from "./numbers";
import { validateRaw } from "./schema";

type Attrs = Record<string, string>;
interface XmlNode {
  tag: string;
  attrs: Attrs;
  children: XmlNode[];
}

/** attribute name → JSON key, and how to read it */
type Kind = "text" | "number" | "vec3" | "radii" | "idlist2" | "idlist";
const flexureFields: Record<string, [string, Kind]> = {
  id: ["id", "text"],
  kind: ["kind", "text"],
  body: ["body", "text"],
  on: ["on", "text"],
  feature: ["feature", "text"],
  material: ["material", "text"],
  scatter: ["scatter", "number"],
  from: ["from", "vec3"],
  to: ["to", "vec3"],
  diameter: ["diameter", "number"],
  root: ["root", "vec3"],
  tip: ["tip", "vec3"],
  "width-direction": ["widthDirection", "vec3"],
  width: ["width", "number"],
  thickness: ["thickness", "number"],
};
const fields: Record<string, Record<string, [string, Kind]>> = {
  "mount-layout": {
    format: ["format", "text"],
    name: ["name", "text"],
    gravity: ["gravity", "vec3"],
    tolerance: ["tolerance", "number"],
    "intended-freedoms": ["intendedFreedoms", "number"],
    "ground-material": ["groundMaterial", "text"],
    "temperature-swing": ["temperatureSwing", "number"],
    "default-scatter": ["defaultScatter", "number"],
  },
  body: { id: ["id", "text"], mass: ["mass", "number"], "center-of-mass": ["centerOfMass", "vec3"], material: ["material", "text"] },
  material: {
    id: ["id", "text"],
    "youngs-modulus-gpa": ["youngsModulusGPa", "number"],
    "poisson-ratio": ["poissonRatio", "number"],
    "allowable-contact-pressure-mpa": ["allowableContactPressureMPa", "number"],
    "expansion-per-k": ["expansionPerK", "number"],
  },
  contact: {
    id: ["id", "text"],
    body: ["body", "text"],
    on: ["on", "text"],
    feature: ["feature", "text"],
    point: ["point", "vec3"],
    normal: ["normal", "vec3"],
    sense: ["sense", "text"],
    stiffness: ["stiffness", "number"],
    scatter: ["scatter", "number"],
  },
  flexure: flexureFields,
  hertz: { "angle-deg": ["angleDeg", "number"], materials: ["materials", "idlist2"] },
  load: { id: ["id", "text"], body: ["body", "text"], force: ["force", "vec3"], point: ["point", "vec3"], moment: ["moment", "vec3"] },
  point: { id: ["id", "text"], body: ["body", "text"], at: ["point", "vec3"], allowance: ["allowance", "number"] },
  "load-case": { id: ["id", "text"], gravity: ["gravity", "vec3"], loads: ["loads", "idlist"] },
};
const listKey: Record<string, string> = {
  body: "bodies",
  material: "materials",
  contact: "contacts",
  flexure: "flexures",
  load: "loads",
  point: "points",
  "load-case": "loadCases",
};

function lineOf(text: string, index: number): number {
  return text.slice(0, index).split("\n").length;
}

function toNodes(ordered: unknown[]): XmlNode[] {
  const out: XmlNode[] = [];
  for (const item of ordered as Record<string, unknown>[]) {
    const tag = Object.keys(item).find((k) => k !== ":@");
    if (!tag || tag === "#text" || tag.startsWith("?")) continue;
    out.push({ tag, attrs: (item[":@"] as Attrs) ?? {}, children: toNodes(item[tag] as unknown[]) });
  }
  return out;
}

/** Parses an XML mount layout. */
export function parseXmlLayout(text: string, library: Material[] = []): ParseResult {
  const decl = /<!(DOCTYPE|ENTITY)/i.exec(text);
  if (decl) {
    return {
      ok: false,
      errors: [
        {
          location: `line ${lineOf(text, decl.index)}`,
          message: `${decl[1].toUpperCase()} declarations are not allowed in a layout file (entities are never expanded)`,
        },
      ],
    };
  }
  let valid: ReturnType<typeof XMLValidator.validate>;
  try {
    valid = XMLValidator.validate(text, { allowBooleanAttributes: false });
  } catch (e) {
    return { ok: false, errors: [{ location: "file", message: `the file is not well-formed XML: ${(e as Error).message}` }] };
  }
  if (valid !== true) {
    return {
      ok: false,
      errors: [{ location: `line ${valid.err.line}, column ${valid.err.col}`, message: `the file is not well-formed XML: ${valid.err.msg}` }],
    };
  }
  const parser = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: "",
    preserveOrder: true,
    processEntities: false,
    htmlEntities: false,
    parseAttributeValue: false,
    parseTagValue: false,
    trimValues: true,
  });
  let roots: XmlNode[];
  try {
    roots = toNodes(parser.parse(text) as unknown[]);
  } catch (e) {
    // the parser refuses what the validator let through (nesting limits, processing instructions)
    return { ok: false, errors: [{ location: "file", message: `the XML cannot be read: ${(e as Error).message}` }] };
  }
  if (roots.length !== 1 || roots[0].tag !== "mount-layout") {
    return { ok: false, errors: [{ location: "/", message: "the root element must be <mount-layout>" }] };
  }
  const root = roots[0];
  const errors: LayoutError[] = [];
  const warnings: string[] = [];
  const locations = new Map<string, string>();
  locations.set("/", "mount-layout");

  const readAttrs = (node: XmlNode, path: string, ptr: string, target: Record<string, unknown>) => {
    const spec = fields[node.tag];
    for (const [attr, value] of Object.entries(node.attrs)) {
      const f = spec[attr];
      if (!f) {
        const layoutLevel = node.tag === "mount-layout" && (attr === "length" || attr === "force");
        const radii = node.tag === "hertz" && (attr === "body-radii" || attr === "on-radii");
        if (!layoutLevel && !radii && warnings.length < 50) warnings.push(`${path} @${attr}: unknown attribute "${attr}" was ignored (check the spelling)`);
        continue;
      }
      const [key, kind] = f;
      const where = `${path} @${attr}`;
      locations.set(`${ptr}/${key}`, where);
      let v: unknown = value;
      if (kind === "number") v = readNumber(value);
      else if (kind === "vec3") v = readList(value, 3);
      else if (kind === "idlist2") v = value.trim().split(/\s+/);
      else if (kind === "idlist") v = value.trim() ? value.trim().split(/\s+/) : [];
      if (typeof v === "string" && kind !== "text") errors.push({ location: where, message: `${attr}: ${v}` });
      else target[key] = v;
    }
  };

  const raw: Record<string, unknown> = {};
  readAttrs(root, "mount-layout", "", raw);
  if (root.attrs.length || root.attrs.force) {
    const units: Record<string, string> = {};
    if (root.attrs.length) units.length = root.attrs.length;
    if (root.attrs.force) units.force = root.attrs.force;
    raw.units = units;
    locations.set("/units/length", "mount-layout @length");
    locations.set("/units/force", "mount-layout @force");
  }
  const counters: Record<string, number> = {};
  for (const child of root.children) {
    const key = listKey[child.tag];
    const n = (counters[child.tag] = (counters[child.tag] ?? 0) + 1);
    const path = `mount-layout/${child.tag}[${n}]`;
    if (!key) {
      errors.push({ location: path, message: `unknown element <${child.tag}>` });
      continue;
    }
    const list = (raw[key] ??= []) as Record<string, unknown>[];
    const ptr = `/${key}/${list.length}`;
    locations.set(ptr, path);
    const item: Record<string, unknown> = {};
    readAttrs(child, path, ptr, item);
    for (const sub of child.children) {
      if (child.tag === "contact" && sub.tag === "hertz") {
        const hPath = `${path}/hertz`;
        const hertz: Record<string, unknown> = {};
        locations.set(`${ptr}/hertz`, hPath);
        readAttrs(sub, hPath, `${ptr}/hertz`, hertz);
        const radii: unknown[] = [];
        for (const [attr, idx] of [
          ["body-radii", 0],
          ["on-radii", 1],
        ] as const) {
          locations.set(`${ptr}/hertz/radii/${idx}`, `${hPath} @${attr}`);
          const r = sub.attrs[attr] === undefined ? undefined : readList(sub.attrs[attr], 2, true);
          if (typeof r === "string") errors.push({ location: `${hPath} @${attr}`, message: `${attr}: ${r}` });
          radii[idx] = r;
        }
        locations.set(`${ptr}/hertz/radii`, `${hPath} @body-radii/@on-radii`);
        hertz.radii = radii;
        item.hertz = hertz;
      } else {
        errors.push({ location: `${path}/${sub.tag}`, message: `unknown element <${sub.tag}> inside <${child.tag}>` });
      }
    }
    list.push(item);
  }
  raw.contacts ??= [];
  raw.bodies ??= [];
  if (errors.length) return { ok: false, errors: errors.slice(0, 200) };

  const locate = (p: string): string => {
    if (locations.has(p)) return locations.get(p)!;
    const parts = p.split("/");
    for (let i = parts.length - 1; i > 0; i--) {
      const prefix = parts.slice(0, i).join("/") || "/";
      if (locations.has(prefix)) {
        const rest = parts.slice(i);
        const spec = Object.entries(fields).find(([tag]) => locations.get(prefix)!.endsWith(`]`) && locations.get(prefix)!.includes(`/${tag}[`));
        const attr = spec ? Object.entries(spec[1]).find(([, [k]]) => k === rest[0])?.[0] : undefined;
        return `${locations.get(prefix)!} @${attr ?? rest.join("/")}`;
      }
    }
    return p;
  };
  const result = validateRaw(raw, locate, library);
  return result.ok ? { ...result, warnings: [...warnings, ...result.warnings] } : result;
}
