/** The exchange-format help: the fields, the three encodings, and the example files to download. */
import type { Metadata } from "next";
import { readdirSync } from "node:fs";
import path from "node:path";
import { requirePageUser } from "@/lib/auth/session";
import { builtinMaterials } from "@/lib/layout/materials";

export const metadata: Metadata = { title: "Exchange format" };

export default async function FormatHelpPage() {
  await requirePageUser("/help/format");
  const files = readdirSync(path.join(process.cwd(), "examples")).filter((f) => /\.(json|xml|csv)$/.test(f)).sort();
  const names = [...new Set(files.map((f) => f.replace(/\.(json|xml|csv)$/, "")))];
  return (
    <div className="max-w-4xl space-y-6 text-sm leading-relaxed">
      <h1>The mount-layout exchange format</h1>
      <p>
        One neutral file a CAD export script writes: bodies, contact points and contact normals, with optional mass, loads, stiffness, Hertz
        data and functional points. JSON is the primary encoding; XML carries the same content in attributes; CSV carries contacts only. The
        version string <code>mount-layout/1</code> is required, and a file accepted once stays accepted.
      </p>
      <section className="sheet p-4">
        <h2>Frame, units and signs</h2>
        <ul className="ml-5 list-disc">
          <li>One right-handed frame. <code>ground</code> is the fixed body and may not be declared.</li>
          <li><code>units.length</code>: m, mm (default), µm (<code>um</code>), in. <code>units.force</code>: N (default), kN, lbf. Mass in kg, accelerations in m/s².</li>
          <li>A contact stops motion of <code>body</code> relative to <code>on</code> along <code>normal</code> at <code>point</code>. The normal points into <code>body</code> (the direction of the force <code>on</code> applies). Any non-zero length.</li>
          <li><code>sense</code>: <code>unilateral</code> (a seat; it may lift off) or <code>bilateral</code> (a strut or flexure blade line).</li>
          <li><code>feature</code> groups the contacts of one seat: a vee has 2, a socket 3, a flat 1. Couplings are recognised from these groups.</li>
          <li>Hertz radii are signed (convex +, concave −, <code>null</code> or <code>flat</code> for a plane). A ball in a true cone touches along a ring, not at points: model a socket as three point contacts.</li>
        </ul>
      </section>
      <section className="sheet p-4">
        <h2>Fields</h2>
        <table className="tbl mt-2 text-xs">
          <thead><tr><th>field</th><th>meaning</th></tr></thead>
          <tbody>
            <tr><td><code>format</code></td><td>required, <code>mount-layout/1</code></td></tr>
            <tr><td><code>bodies[]</code></td><td>id, optional mass (kg) and centerOfMass (file length units)</td></tr>
            <tr><td><code>contacts[]</code></td><td>id, body, on, feature, point, normal, sense, stiffness (force/length), hertz {"{radii, angleDeg, materials}"}</td></tr>
            <tr><td><code>loads[]</code></td><td>id, body, force, point, optional moment (file units)</td></tr>
            <tr><td><code>points[]</code></td><td>functional points whose error motion is reported</td></tr>
            <tr><td><code>loadCases[]</code></td><td>id, gravity (acceleration field, m/s²), loads (active load ids; default all)</td></tr>
            <tr><td><code>tolerance</code></td><td>relative rank tolerance after length scaling (default 1e-6)</td></tr>
            <tr><td><code>intendedFreedoms</code></td><td>freedoms the design means to keep (default 0)</td></tr>
          </tbody>
        </table>
        <p className="mt-2">Numbers follow JSON number syntax in every encoding: <code>9.9e-17</code> is fine; <code>NaN</code>, <code>Infinity</code> and <code>1,5</code> are errors. Limits: 5 MB, 500 bodies, 5,000 contacts.</p>
      </section>
      <section className="sheet p-4">
        <h2>Built-in materials</h2>
        <table className="tbl mt-2 text-xs">
          <thead><tr><th>id</th><th className="text-right">E (GPa)</th><th className="text-right">ν</th><th className="text-right">allowable p₀ (MPa)</th><th>source</th></tr></thead>
          <tbody>
            {builtinMaterials.map((m) => (
              <tr key={m.id}><td><code>{m.id}</code></td><td className="num text-right">{m.youngsModulusGPa}</td><td className="num text-right">{m.poissonRatio}</td><td className="num text-right">{m.allowableContactPressureMPa}</td><td>{m.source}</td></tr>
            ))}
          </tbody>
        </table>
      </section>
      <section className="sheet p-4">
        <h2>Examples to download</h2>
        <p className="text-xs text-graphite-soft">Invented layouts of Larkspur Photonics. CSV files carry no units: choose them at upload.</p>
        <ul className="mt-2 space-y-1">
          {names.map((n) => (
            <li key={n}>
              {n}:{" "}
              {["json", "xml", "csv"].filter((e) => files.includes(`${n}.${e}`)).map((e) => (
                <a key={e} className="mr-2" href={`/api/examples/${n}.${e}`} download>{e.toUpperCase()}</a>
              ))}
            </li>
          ))}
        </ul>
      </section>
      <section className="sheet p-4">
        <h2>Errors</h2>
        <p>A refused file lists every error with its place: a JSON pointer (<code>/contacts/3/normal</code>), an XML element and attribute (<code>mount-layout/contact[4] @normal</code>) or a CSV line and column (<code>line 5, column 3 (y)</code>). Nothing from a refused file is stored except the record of the attempt.</p>
      </section>
    </div>
  );
}
