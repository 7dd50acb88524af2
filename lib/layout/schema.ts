/** The zod schema of mount-layout/1 and the cross-reference checks every encoding goes through. */
import { z } from "zod";
import { FORMAT, GROUND, MAX_BODIES, MAX_CONTACTS, type Layout, type LayoutError, type Material, type ParseResult } from "./model";
import { forceUnits, lengthUnits } from "./units";
import { builtinMaterialIds } from "./materials";
import { bladeFrame, flexureLength, flexureRowIds } from "./flexures";

const finite = z.number({ error: "must be a number" }).refine(Number.isFinite, { error: "must be a finite number" });
const positive = finite.refine((v) => v > 0, { error: "must be greater than zero" });
const vec3 = z.tuple([finite, finite, finite], { error: "must be a list of three numbers [x, y, z]" });
const identifier = z
  .string({ error: "must be a text id" })
  .min(1, { error: "must not be empty" })
  .max(100, { error: "is longer than 100 characters" })
  // eslint-disable-next-line no-control-regex -- refusing control characters is the point of this pattern
  .regex(/^[^\s\u0000-\u001f]+$/, { error: "must not contain spaces or control characters" });
const label = z
  .string({ error: "must be text" })
  .min(1, { error: "must not be empty" })
  .max(200, { error: "is longer than 200 characters" })
  // eslint-disable-next-line no-control-regex -- refusing control characters is the point of this pattern
  .regex(/^[^\u0000-\u001f]+$/, { error: "must not contain control characters" });
const radius = z.union([finite.refine((v) => v !== 0, { error: "a radius of zero is not allowed (use null for flat)" }), z.null()]);

const nonNegative = finite.refine((v) => v >= 0, { error: "must not be negative" });

const bodySchema = z.object({
  id: identifier,
  mass: positive.optional(),
  centerOfMass: vec3.optional(),
  material: identifier.optional(),
});

const materialSchema = z.object({
  id: identifier,
  youngsModulusGPa: positive.optional(),
  poissonRatio: finite.refine((v) => v > -1 && v < 0.5, { error: "must lie between -1 and 0.5" }).optional(),
  allowableContactPressureMPa: positive.optional(),
  expansionPerK: nonNegative.optional(),
});

const hertzSchema = z.object({
  radii: z.tuple([z.tuple([radius, radius]), z.tuple([radius, radius])], {
    error: "must be [[body r1, body r2], [on r1, on r2]] (numbers or null for flat)",
  }),
  angleDeg: finite.default(0),
  materials: z.tuple([identifier, identifier], { error: "must name two materials [body side, on side]" }),
});

const contactSchema = z.object({
  id: identifier,
  body: identifier,
  on: identifier.default(GROUND),
  feature: label.optional(),
  point: vec3,
  normal: vec3,
  sense: z.enum(["unilateral", "bilateral"], { error: "must be unilateral or bilateral" }).default("unilateral"),
  stiffness: positive.optional(),
  hertz: hertzSchema.optional(),
  scatter: nonNegative.optional(),
});

const flexureCommon = {
  id: identifier,
  body: identifier,
  on: identifier.default(GROUND),
  feature: label.optional(),
  material: identifier.optional(),
  scatter: nonNegative.optional(),
};
const wireSchema = z.object({ ...flexureCommon, kind: z.literal("wire"), from: vec3, to: vec3, diameter: positive.optional() });
const bladeSchema = z.object({
  ...flexureCommon,
  kind: z.literal("blade"),
  root: vec3,
  tip: vec3,
  widthDirection: vec3,
  width: positive,
  thickness: positive.optional(),
});
const flexureSchema = z.discriminatedUnion("kind", [wireSchema, bladeSchema], { error: 'kind must be "wire" or "blade"' });

const loadSchema = z.object({
  id: identifier,
  body: identifier,
  force: vec3,
  point: vec3,
  moment: vec3.optional(),
});

const loadCaseSchema = z.object({ id: identifier, gravity: vec3.optional(), loads: z.array(identifier).optional() });

const pointSchema = z.object({ id: identifier, body: identifier, point: vec3, allowance: positive.optional() });

export const rawLayoutSchema = z.object({
  format: z.literal(FORMAT, { error: `must be "${FORMAT}"` }),
  name: z.string({ error: "must be text" }).max(200, { error: "is longer than 200 characters" }).default("unnamed layout"),
  units: z
    .object({
      length: z.enum(lengthUnits, { error: `must be one of ${lengthUnits.join(", ")}` }).default("mm"),
      force: z.enum(forceUnits, { error: `must be one of ${forceUnits.join(", ")}` }).default("N"),
    })
    .default({ length: "mm", force: "N" }),
  gravity: vec3.default([0, 0, -9.80665]),
  tolerance: positive.refine((v) => v < 1, { error: "must be below 1" }).default(1e-6),
  intendedFreedoms: z.number({ error: "must be a number" }).int({ error: "must be a whole number" }).min(0, { error: "must not be negative" }).default(0),
  bodies: z
    .array(bodySchema, { error: "must be a list of bodies" })
    .min(1, { error: "must declare at least one body" })
    .max(MAX_BODIES, { error: `has more than ${MAX_BODIES} bodies` }),
  materials: z.array(materialSchema).max(200, { error: "has more than 200 materials" }).default([]),
  contacts: z.array(contactSchema, { error: "must be a list of contacts" }).max(MAX_CONTACTS, { error: `has more than ${MAX_CONTACTS} contacts` }),
  flexures: z
    .array(flexureSchema, { error: "must be a list of flexures" })
    .max(MAX_CONTACTS, { error: `has more than ${MAX_CONTACTS} flexures` })
    .default([]),
  loads: z
    .array(loadSchema)
    .max(MAX_CONTACTS, { error: `has more than ${MAX_CONTACTS} loads` })
    .default([]),
  points: z
    .array(pointSchema)
    .max(MAX_CONTACTS, { error: `has more than ${MAX_CONTACTS} points` })
    .default([]),
  loadCases: z.array(loadCaseSchema).max(100, { error: "has more than 100 load cases" }).optional(),
  groundMaterial: identifier.optional(),
  temperatureSwing: positive.optional(),
  defaultScatter: nonNegative.optional(),
});

const itemShapes: Record<string, z.ZodObject> = {
  bodies: bodySchema,
  materials: materialSchema,
  contacts: contactSchema,
  loads: loadSchema,
  points: pointSchema,
};

/**
 * Fields the format does not know are ignored (so later additions never break an older reader), but a
 * misspelt optional field would silently drop data: each one is reported as a located warning.
 */
function unknownFieldWarnings(raw: unknown, locate: (ptr: string) => string): string[] {
  const out: string[] = [];
  if (!raw || typeof raw !== "object" || Array.isArray(raw)) return out;
  const check = (obj: unknown, known: string[], ptr: string) => {
    if (!obj || typeof obj !== "object" || Array.isArray(obj)) return;
    for (const key of Object.keys(obj))
      if (!known.includes(key) && out.length < 50) out.push(`${locate(`${ptr}/${key}`)}: unknown field "${key}" was ignored (check the spelling)`);
  };
  const r = raw as Record<string, unknown>;
  check(r, Object.keys(rawLayoutSchema.shape), "");
  check(r.units, ["length", "force"], "/units");
  if (Array.isArray(r.flexures)) {
    r.flexures.forEach((item, i) => {
      const kind = (item as Record<string, unknown> | null)?.kind;
      const shape = kind === "wire" ? wireSchema : kind === "blade" ? bladeSchema : null;
      if (shape) check(item, Object.keys(shape.shape), `/flexures/${i}`);
    });
  }
  for (const [list, schema] of Object.entries(itemShapes)) {
    if (!Array.isArray(r[list])) continue;
    (r[list] as unknown[]).forEach((item, i) => {
      check(item, Object.keys(schema.shape), `/${list}/${i}`);
      if (list === "contacts") check((item as Record<string, unknown> | null)?.hertz, Object.keys(hertzSchema.shape), `/contacts/${i}/hertz`);
    });
  }
  if (Array.isArray(r.loadCases)) r.loadCases.forEach((lc, i) => check(lc, ["id", "gravity", "loads"], `/loadCases/${i}`));
  return out;
}

/** Turns a zod/JS path into a JSON pointer. */
export function pointer(path: readonly PropertyKey[]): string {
  return path.length === 0 ? "/" : "/" + path.map((p) => String(p).replace(/~/g, "~0").replace(/\//g, "~1")).join("/");
}

function valueAt(raw: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = raw;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<PropertyKey, unknown>)[key];
  }
  return v;
}

const itemNames: Record<string, string> = {
  bodies: "body",
  materials: "material",
  contacts: "contact",
  flexures: "flexure",
  loads: "load",
  points: "point",
  loadCases: "load case",
};

/**
 * A person's sentence for a schema issue: which item (by its id when it has one), which field, what is
 * wrong and the offending value — "contact 'S2': normal[2] must be a number (got "x")".
 */
function issueMessage(issue: z.core.$ZodIssue, raw: unknown): string {
  const path = issue.path;
  const desc = describeIssue(issue, raw);
  const value = valueAt(raw, path);
  const shown = value === undefined || (typeof value === "object" && value !== null) ? "" : ` (got ${JSON.stringify(value).slice(0, 60)})`;
  const list = typeof path[0] === "string" ? itemNames[path[0]] : undefined;
  if (list && typeof path[1] === "number") {
    const item = valueAt(raw, path.slice(0, 2)) as Record<string, unknown> | undefined;
    const id = item && typeof item.id === "string" ? `'${item.id}'` : `#${path[1] + 1}`;
    const rest = path.slice(2);
    const field = rest.length ? rest.map((k, j) => (typeof k === "number" ? `[${k}]` : `${j ? "." : ""}${String(k)}`)).join("") : "entry";
    return `${list} ${id}: ${field} ${desc}${shown}`;
  }
  const field = path.length ? path.map((k) => (typeof k === "number" ? `[${k}]` : String(k))).join(".") : "file";
  return `${field} ${desc}${shown}`;
}

/** The parts of a refused file that do parse, item by item (others null, positions kept), for the reference checks. */
function salvage(raw: unknown): Layout {
  const r = (raw && typeof raw === "object" ? raw : {}) as Record<string, unknown>;
  const items = <T>(key: string, schema: z.ZodType<T>): T[] =>
    Array.isArray(r[key]) ? (r[key] as unknown[]).map((item) => (schema.safeParse(item).success ? schema.parse(item) : (null as T))) : [];
  const top = <T>(schema: z.ZodType<T>, v: unknown): T | undefined => (schema.safeParse(v).success ? schema.parse(v) : undefined);
  return {
    format: FORMAT,
    name: "",
    units: { length: "mm", force: "N" },
    gravity: [0, 0, -9.80665],
    tolerance: 1e-6,
    intendedFreedoms: 0,
    bodies: items("bodies", bodySchema),
    materials: items("materials", materialSchema),
    contacts: items("contacts", contactSchema) as Layout["contacts"],
    flexures: items("flexures", flexureSchema) as Layout["flexures"],
    loads: items("loads", loadSchema),
    points: items("points", pointSchema),
    loadCases: Array.isArray(r.loadCases) ? (items("loadCases", loadCaseSchema) as Layout["loadCases"]) : undefined,
    groundMaterial: top(identifier, r.groundMaterial),
  };
}

function describeIssue(issue: z.core.$ZodIssue, raw: unknown): string {
  if (issue.code === "invalid_type" && valueAt(raw, issue.path) === undefined) return "is required";
  if (issue.code === "unrecognized_keys") return issue.message;
  return issue.message;
}

/**
 * Validates a raw object (from any encoding) into a Layout. `locate` turns a JSON pointer into the
 * location text of the encoding (XML element/attribute, CSV line/column); JSON uses the pointer itself.
 */
export function validateRaw(raw: unknown, locate: (ptr: string) => string = (p) => p, library: Material[] = []): ParseResult {
  const parsed = rawLayoutSchema.safeParse(raw);
  if (!parsed.success) {
    const errors = parsed.error.issues.slice(0, 200).map((issue) => ({ location: locate(pointer(issue.path)), message: issueMessage(issue, raw) }));
    // one pass: the references of the items that did parse are checked too, so a file's every error comes at once
    const seen = new Set(errors.map((e) => e.location));
    const more = crossCheck(salvage(raw), locate, library).filter((e) => !seen.has(e.location));
    return { ok: false, errors: [...errors, ...more].slice(0, 200) };
  }
  const layout = parsed.data as Layout;
  for (const c of layout.contacts) c.normal = c.normal as Layout["contacts"][number]["normal"];
  const errors = crossCheck(layout, locate, library);
  if (errors.length) return { ok: false, errors };
  // the project's library resolves ids the file names but does not declare (before the built-in table)
  const declared = new Set(layout.materials.map((m) => m.id));
  layout.materials.push(...library.filter((m) => !declared.has(m.id)).map((m) => ({ ...m })));
  if (!layout.loadCases) delete layout.loadCases;
  else layout.loadCases = layout.loadCases.map((lc) => ({ ...lc, gravity: lc.gravity ?? layout.gravity }));
  return { ok: true, layout, warnings: unknownFieldWarnings(raw, locate) };
}

function crossCheck(layout: Layout, locate: (ptr: string) => string, library: Material[]): LayoutError[] {
  const errors: LayoutError[] = [];
  const err = (ptr: string, message: string) => errors.length < 200 && errors.push({ location: locate(ptr), message });
  const uniq = (list: { id: string }[], key: string, what: string) => {
    const seen = new Map<string, number>();
    list.forEach((item, i) => {
      if (!item) return;
      if (seen.has(item.id)) err(`/${key}/${i}/id`, `${what} id '${item.id}' is used twice (first at /${key}/${seen.get(item.id)})`);
      else seen.set(item.id, i);
    });
    return seen;
  };
  const bodies = uniq(layout.bodies, "bodies", "body");
  uniq(layout.contacts, "contacts", "contact");
  uniq(layout.loads, "loads", "load");
  uniq(layout.points, "points", "point");
  const materials = uniq(layout.materials, "materials", "material");
  if (layout.loadCases) uniq(layout.loadCases, "loadCases", "load case");

  layout.bodies.forEach((b, i) => {
    if (!b) return;
    if (b.id === GROUND) err(`/bodies/${i}/id`, "'ground' is the fixed body and may not be declared");
    if (b.mass !== undefined && !b.centerOfMass) err(`/bodies/${i}/centerOfMass`, "centerOfMass is required when mass is given");
  });
  layout.materials.forEach((m, i) => {
    if (!m) return;
    if (builtinMaterialIds.includes(m.id)) err(`/materials/${i}/id`, `material id '${m.id}' is a built-in material and may not be redefined`);
  });
  const knownMaterial = (id: string) => materials.has(id) || builtinMaterialIds.includes(id) || library.some((m) => m.id === id);
  layout.contacts.forEach((c, i) => {
    if (!c) return;
    if (c.body === GROUND) err(`/contacts/${i}/body`, "body may not be 'ground' (put ground in 'on')");
    else if (!bodies.has(c.body)) err(`/contacts/${i}/body`, `body '${c.body}' is not declared`);
    if (c.on !== GROUND && !bodies.has(c.on)) err(`/contacts/${i}/on`, `body '${c.on}' is not declared`);
    if (c.on === c.body) err(`/contacts/${i}/on`, `a contact cannot join body '${c.body}' to itself`);
    const [x, y, z] = c.normal;
    if (Math.hypot(x, y, z) === 0 || !Number.isFinite(Math.hypot(x, y, z))) err(`/contacts/${i}/normal`, "normal has zero length");
    if (c.hertz) {
      c.hertz.materials.forEach((m, j) => {
        if (!knownMaterial(m)) err(`/contacts/${i}/hertz/materials/${j}`, `material '${m}' is neither built in nor declared in materials`);
      });
      const [[a1, a2], [b1, b2]] = c.hertz.radii;
      if ([a1, a2, b1, b2].every((r) => r === null)) err(`/contacts/${i}/hertz/radii`, "two flat surfaces do not make a point contact");
    }
  });
  layout.bodies.forEach((b, i) => {
    if (!b) return;
    if (b.material !== undefined && !knownMaterial(b.material))
      err(`/bodies/${i}/material`, `material '${b.material}' is neither built in nor declared in materials`);
  });
  if (layout.groundMaterial !== undefined && !knownMaterial(layout.groundMaterial)) {
    err("/groundMaterial", `material '${layout.groundMaterial}' is neither built in nor declared in materials`);
  }
  const rowIds = new Map<string, string>(layout.contacts.flatMap((c, i) => (c ? [[c.id, `/contacts/${i}`] as [string, string]] : [])));
  const flexures = layout.flexures ?? [];
  flexures.forEach((f, i) => {
    if (!f) return;
    const at = `/flexures/${i}`;
    if (f.body === GROUND) err(`${at}/body`, "body may not be 'ground' (put ground in 'on')");
    else if (!bodies.has(f.body)) err(`${at}/body`, `body '${f.body}' is not declared`);
    if (f.on !== GROUND && !bodies.has(f.on)) err(`${at}/on`, `body '${f.on}' is not declared`);
    if (f.on === f.body) err(`${at}/on`, `flexure '${f.id}' cannot join body '${f.body}' to itself`);
    if (f.material !== undefined && !knownMaterial(f.material)) err(`${at}/material`, `material '${f.material}' is neither built in nor declared in materials`);
    if (!(flexureLength(f) > 0))
      err(`${at}/${f.kind === "wire" ? "to" : "tip"}`, `flexure '${f.id}' has zero length (${f.kind === "wire" ? "from and to" : "root and tip"} coincide)`);
    else if (f.kind === "blade" && !bladeFrame(f))
      err(`${at}/widthDirection`, `widthDirection of blade '${f.id}' is zero or parallel to its length (tip − root)`);
    const ids = f.kind === "wire" ? [f.id] : [f.id, ...flexureRowIds(f)];
    for (const id of ids) {
      if (rowIds.has(id)) err(`${at}/id`, `flexure '${f.id}'${id === f.id ? "" : ` (row ${id})`} collides with the id at ${rowIds.get(id)}`);
      else rowIds.set(id, at);
    }
  });
  const rows = layout.contacts.length + flexures.reduce((n, f) => n + (f?.kind === "blade" ? 3 : 1), 0);
  if (rows > MAX_CONTACTS) err("/flexures", `contacts and flexure rows together number ${rows}; the limit is ${MAX_CONTACTS}`);
  layout.loads.forEach((l, i) => {
    if (!l) return;
    if (!bodies.has(l.body)) err(`/loads/${i}/body`, `body '${l.body}' is not declared`);
  });
  layout.points.forEach((p, i) => {
    if (!p) return;
    if (!bodies.has(p.body)) err(`/points/${i}/body`, `body '${p.body}' is not declared`);
  });
  const loadIds = new Set(layout.loads.map((l) => l.id));
  layout.loadCases?.forEach((lc, i) =>
    lc?.loads?.forEach((id, j) => {
      if (!loadIds.has(id)) err(`/loadCases/${i}/loads/${j}`, `load '${id}' is not declared in loads`);
    }),
  );
  return errors;
}
