/** Upload size limits over real HTTP: a body with no Content-Length is cut off at the limit while it streams. */
import http from "node:http";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

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
  expect(JSON.parse(api.body).error).toMatch(/5 MB limit\. Nothing was stored/);

  const form = await chunkedUpload(`/api/layouts/${layoutId}/revisions`, { ...auth, "content-type": "multipart/form-data; boundary=xyz" }, 200);
  expect(form.status).toBe(413);

  expect(await revisions()).toBe(before);
  // the server is still answering normally
  expect((await page.request.get(`/api/v1/layouts/${layoutId}/findings`, { headers: auth })).status()).toBe(200);
});
