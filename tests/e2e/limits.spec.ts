/**
 * Hostile uploads over real HTTP: a body with no Content-Length is cut off at the limit while it streams, and
 * seeded random mutations of the examples are each answered 201 or 422 (never a server error).
 */
import { readFileSync } from "node:fs";
import http from "node:http";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";
import { mutate } from "../support/mutate";
import { rng } from "../support/layouts";
import { exampleNames } from "../support/examples";

/** Streams up to `megabytes` MB of spaces in 64 kB chunks without a Content-Length; resolves with the answer. */
function chunkedUpload(path: string, headers: Record<string, string>, megabytes: number): Promise<{ status: number; body: string; sentMB: number }> {
  return new Promise((resolve, reject) => {
    let sent = 0;
    const chunk = Buffer.alloc(65536, 0x20);
    const req = http.request({ host: "127.0.0.1", port: 3100, path, method: "POST", headers: { ...headers, "transfer-encoding": "chunked" } }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (d) => (body += d));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body, sentMB: sent / 1048576 }));
    });
    req.on("error", (e) => (sent > 5 << 20 ? undefined : reject(e))); // the server may close the socket once it has answered
    const pump = () => {
      while (sent < megabytes * 1048576) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once("drain", pump);
      }
      req.end();
    };
    pump();
  });
}

test("an upload without Content-Length is refused at 5 MB with 413 on both upload routes, and nothing is stored", async ({ page }) => {
  await signInAs(page, "designer");
  const created = await page.request.post("/api/tokens", { data: { name: "e2e limits" } });
  const { token } = await created.json();
  const auth = { authorization: `Bearer ${token}` };
  const layoutId = (await (await page.request.get("/api/projects/1")).json()).layouts[0].id;
  const revisions = async () => (await (await page.request.get(`/api/layouts/${layoutId}`)).json()).revisions.length;
  const before = await revisions();

  const api = await chunkedUpload(`/api/v1/layouts/${layoutId}/revisions`, { ...auth, "content-type": "application/json" }, 200);
  expect(api.status).toBe(413);
  expect(JSON.parse(api.body)).toMatchObject({
    error: expect.stringMatching(/5 MB limit\. Nothing was stored/),
    errors: [{ location: "file", message: "larger than 5 MB" }],
  });

  const form = await chunkedUpload(`/api/layouts/${layoutId}/revisions`, { ...auth, "content-type": "multipart/form-data; boundary=xyz" }, 200);
  expect(form.status).toBe(413);

  expect(await revisions()).toBe(before);
  // the server is still answering normally
  expect((await page.request.get(`/api/v1/layouts/${layoutId}/findings`, { headers: auth })).status()).toBe(200);
});

test("400 mutated example files posted to the token API: each 201 or 422 with located errors, none a server error; only accepted ones stored", async ({
  page,
}) => {
  test.setTimeout(180_000);
  await signInAs(page, "designer");
  const { token } = await (await page.request.post("/api/tokens", { data: { name: "e2e mutations" } })).json();
  const auth = { authorization: `Bearer ${token}` };
  const created = await page.request.post("/api/projects/1/layouts", { data: { name: `Mutation bench ${Date.now()}`, description: "" } });
  const layoutId = (await created.json()).layout.id;
  const files = exampleNames.flatMap((n) => ["json", "xml", "csv"].map((e) => `examples/${n}.${e}`));
  const types: Record<string, string> = { json: "application/json", xml: "application/xml", csv: "text/csv" };
  const r = rng(20261203);
  const statuses: Record<number, number> = {};
  for (let i = 0; i < 400; i++) {
    const file = files[i % files.length];
    let text = readFileSync(file, "utf8");
    const edits = 1 + Math.floor(r() * 3);
    for (let k = 0; k < edits; k++) text = mutate(text, r);
    const res = await page.request.post(`/api/v1/layouts/${layoutId}/revisions`, {
      headers: { ...auth, "content-type": types[file.split(".").pop()!], "x-file-name": `m${i}` },
      data: text,
    });
    const s = res.status();
    statuses[s] = (statuses[s] ?? 0) + 1;
    if (s === 422) {
      const body = await res.json();
      expect(body.errors?.length, `${file} #${i}: ${JSON.stringify(body).slice(0, 200)}`).toBeGreaterThan(0);
      for (const e of body.errors) expect(e.location, file).toBeTruthy();
    } else expect(s, `${file} #${i}: ${(await res.text()).slice(0, 200)}`).toBe(201);
  }
  expect(Object.keys(statuses).sort()).toEqual(["201", "422"]);
  const stored = (await (await page.request.get(`/api/layouts/${layoutId}`)).json()).revisions.length;
  expect(stored).toBe(statuses[201]);
});
