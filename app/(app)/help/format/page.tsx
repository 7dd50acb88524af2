/** The exchange-format help: the fields, the three encodings, and the example files to download. */
import type { Metadata } from "next";
import { readdirSync } from "node:fs";
import path from "node:path";
import { requirePageUser } from "@/lib/auth/session";
import { builtinMaterials } from "@/lib/layout/materials";

export const metadata: Metadata = { title: "Exchange format" };

export default async function FormatHelpPage() {
  await requirePageUser("/help/format");
  const files = readdirSync(path.join(process.cwd(), "examples"))
    .filter((f) => /\.(json|xml|csv)$/.test(f))
    .sort();
  const names = [...new Set(files.map((f) => f.replace(/\.(json|xml|csv)$/, "")))];
  return (
    <div className="max-w-4xl space-y-6 text-sm leading-relaxed">
      <h1>The mount-layout exchange format</h1>
      <p>
        One neutral file a CAD export script writes: bodies, contact points and contact normals, with optional mass, loads, stiffness, Hertz data and functional
        points. JSON is the primary encoding; XML carries the same content in attributes; CSV carries contacts only. The version string{" "}
        <code>mount-layout/1</code> is required, and a file accepted once stays accepted.
      </p>
      <section className="sheet p-4">
        <h2>Frame, units and signs</h2>
        <ul className="ml-5 list-disc">
          <li>
            One right-handed frame. <code>ground</code> is the fixed body and may not be declared.
          </li>
          <li>
            <code>units.length</code>: m, mm (default), µm (<code>um</code>), in. <code>units.force</code>: N (default), kN, lbf. Mass in kg, accelerations in
            m/s².
          </li>
          <li>
            A contact stops motion of <code>body</code> relative to <code>on</code> along <code>normal</code> at <code>point</code>. The normal points into{" "}
            <code>body</code> (the direction of the force <code>on</code> applies). Any non-zero length.
          </li>
          <li>
            <code>sense</code>: <code>unilateral</code> (a seat; it may lift off) or <code>bilateral</code> (a strut or flexure blade line).
          </li>
          <li>
            <code>feature</code> groups the contacts of one seat: a vee has 2, a socket 3, a flat 1. Couplings are recognised from these groups.
          </li>
          <li>
            Hertz radii are signed (convex +, concave −, <code>null</code> or <code>flat</code> for a plane). A ball in a true cone touches along a ring, not at
            points: model a socket as three point contacts.
          </li>
        </ul>
      </section>
      <section className="sheet p-4">
        <h2>Fields</h2>
        <table className="tbl mt-2 text-xs">
          <thead>
            <tr>
              <th>field</th>
              <th>meaning</th>
            </tr>
          </thead>
          <tbody>
            <tr>
              <td>
                <code>format</code>
              </td>
              <td>
                required, <code>mount-layout/1</code>
              </td>
            </tr>
            <tr>
              <td>
                <code>bodies[]</code>
              </td>
              <td>id, optional mass (kg), centerOfMass (in the file&apos;s length unit) and material (its expansion drives the temperature analysis)</td>
            </tr>
            <tr>
              <td>
                <code>materials[]</code>
              </td>
              <td>
                id and any of youngsModulusGPa, poissonRatio, allowableContactPressureMPa, expansionPerK (1/K); a check that needs a missing value is skipped
                and listed
              </td>
            </tr>
            <tr>
              <td>
                <code>contacts[]</code>
              </td>
              <td>
                id, body, on, feature, point, normal, sense, stiffness (force/length), scatter (1σ along the normal, length), hertz{" "}
                {"{radii, angleDeg, materials}"}
              </td>
            </tr>
            <tr>
              <td>
                <code>flexures[]</code>
              </td>
              <td>
                wires (from, to, diameter) and blades (root, tip, widthDirection, width, thickness), with body, on, feature, material, scatter — see below
              </td>
            </tr>
            <tr>
              <td>
                <code>loads[]</code>
              </td>
              <td>id, body, force, point, optional moment (force and length in the file&apos;s units)</td>
            </tr>
            <tr>
              <td>
                <code>points[]</code>
              </td>
              <td>
                functional points whose error motion is reported; allowance (length) is the largest error motion allowed — thermal drift over the swing and 3σ
                repeatability are compared with it
              </td>
            </tr>
            <tr>
              <td>
                <code>groundMaterial</code>, <code>temperatureSwing</code>
              </td>
              <td>the base&apos;s material; the uniform temperature change (K) the mount must ride through</td>
            </tr>
            <tr>
              <td>
                <code>defaultScatter</code>
              </td>
              <td>scatter (length) of contacts and flexures that give none</td>
            </tr>
            <tr>
              <td>
                <code>loadCases[]</code>
              </td>
              <td>id, gravity (acceleration field, m/s²), loads (active load ids; default all)</td>
            </tr>
            <tr>
              <td>
                <code>tolerance</code>
              </td>
              <td>relative rank tolerance after length scaling (default 1e-6)</td>
            </tr>
            <tr>
              <td>
                <code>intendedFreedoms</code>
              </td>
              <td>freedoms the design means to keep (default 0)</td>
            </tr>
          </tbody>
        </table>
        <p className="mt-2">
          Numbers follow JSON number syntax in every encoding: <code>9.9e-17</code> is fine; <code>NaN</code>, <code>Infinity</code> and <code>1,5</code> are
          errors. Limits: 5 MB, 500 bodies, 5,000 contacts and flexure rows together.
        </p>
      </section>
      <section className="sheet p-4">
        <h2>Flexures</h2>
        <p className="mt-2">A flexure is written as it is drawn and becomes bilateral rows after the contacts, in file order:</p>
        <ul className="ml-5 mt-1 list-disc">
          <li>
            <b>wire</b> from <code>from</code> (on <code>on</code>) to <code>to</code> (on <code>body</code>): one row, id = the flexure&apos;s id, at{" "}
            <code>to</code> along the wire. Stiffness <i>EA/ℓ</i> with <i>A = πd²/4</i>.
          </li>
          <li>
            <b>blade</b> with <code>root</code> (centre of the clamped edge on <code>on</code>), <code>tip</code>, <code>widthDirection</code> and{" "}
            <code>width</code>: rows <code>id.a</code> and <code>id.b</code> at the tip&apos;s two corners along the blade, <code>id.s</code> at the tip across
            it. It constrains the three motions in its plane and leaves three free. Stiffness <i>E·w·t/(2ℓ)</i> for each axial row and <i>E·t·w³/ℓ³</i> in
            plane.
          </li>
        </ul>
        <p className="mt-2 text-xs text-graphite-soft">
          The in-plane value is the Euler–Bernoulli beam clamped at both ends with one end guided: good for blades much longer than wide. A wide, short blade is
          softer in its plane through shear than this says. Stiffness needs the material&apos;s Young&apos;s modulus and the section (diameter, or thickness).
        </p>
      </section>
      <section className="sheet p-4">
        <h2>Built-in materials</h2>
        <table className="tbl mt-2 text-xs">
          <thead>
            <tr>
              <th>id</th>
              <th className="text-right">E (GPa)</th>
              <th className="text-right">ν</th>
              <th className="text-right">allowable p₀ (MPa)</th>
              <th className="text-right">α (µm/(m·K))</th>
              <th>source</th>
            </tr>
          </thead>
          <tbody>
            {builtinMaterials.map((m) => (
              <tr key={m.id}>
                <td>
                  <code>{m.id}</code>
                </td>
                <td className="num text-right">{m.youngsModulusGPa}</td>
                <td className="num text-right">{m.poissonRatio}</td>
                <td className="num text-right">{m.allowableContactPressureMPa}</td>
                <td className="num text-right">{Number((m.expansionPerK * 1e6).toPrecision(3))}</td>
                <td>{m.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-xs text-graphite-soft">
          Values marked &ldquo;value from memory&rdquo; are typical handbook figures not re-read from a published table: typical values, confirm with your
          supplier, and enter the supplier&apos;s figure as a custom material where a result depends on it.
        </p>
      </section>
      <section className="sheet p-4">
        <h2>Examples to download</h2>
        <p className="text-xs text-graphite-soft">Invented layouts of Larkspur Photonics. CSV files carry no units: choose them at upload.</p>
        <ul className="mt-2 space-y-1">
          {names.map((n) => (
            <li key={n}>
              {n}:{" "}
              {["json", "xml", "csv"]
                .filter((e) => files.includes(`${n}.${e}`))
                .map((e) => (
                  <a key={e} className="mr-2" href={`/api/examples/${n}.${e}`} download>
                    {e.toUpperCase()}
                  </a>
                ))}
            </li>
          ))}
        </ul>
      </section>
      <section className="sheet p-4">
        <h2>Errors</h2>
        <p>
          A refused file lists every error with its place: a JSON pointer (<code>/contacts/3/normal</code>), an XML element and attribute (
          <code>mount-layout/contact[4] @normal</code>) or a CSV line and column (<code>line 5, column 3 (y)</code>). Nothing from a refused file is stored
          except the record of the attempt.
        </p>
      </section>
    </div>
  );
}
