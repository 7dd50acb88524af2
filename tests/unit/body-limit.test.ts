/** readBodyLimited: request bodies are capped while they stream, not after they are in memory. */
import { describe, expect, it } from "vitest";
import { readBodyLimited } from "@/lib/api/handler";

/** A chunked body (no Content-Length) of `chunks` × 64 kB; counts how many chunks the reader pulled. */
function streamed(chunks: number) {
  let pulled = 0;
  let cancelled = false;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (pulled >= chunks) return controller.close();
      pulled++;
      controller.enqueue(new Uint8Array(65536).fill(0x20));
    },
    cancel() {
      cancelled = true;
    },
  });
  const req = new Request("http://127.0.0.1/upload", { method: "POST", body, duplex: "half" } as RequestInit);
  return { req, pulled: () => pulled, cancelled: () => cancelled };
}

describe("readBodyLimited", () => {
  it("returns a body within the limit whole, byte for byte", async () => {
    const text = "id,x,y,z,nx,ny,nz\n".repeat(1000);
    const got = await readBodyLimited(new Request("http://127.0.0.1/", { method: "POST", body: text }), 1 << 20);
    expect(new TextDecoder().decode(got)).toBe(text);
  });

  it("refuses a declared Content-Length over the limit with 413 before reading", async () => {
    const req = new Request("http://127.0.0.1/", { method: "POST", body: "x", headers: { "content-length": String(6 << 20) } });
    await expect(readBodyLimited(req, 5 << 20)).rejects.toMatchObject({ status: 413, message: expect.stringMatching(/5 MB limit\. Nothing was stored/) });
  });

  it("stops a chunked body of 1 GB soon after 5 MB: 413, stream cancelled, the rest never pulled", async () => {
    const s = streamed(16384); // 16,384 × 64 kB = 1 GiB if it were all read
    await expect(readBodyLimited(s.req, 5 << 20)).rejects.toMatchObject({ status: 413 });
    expect(s.cancelled()).toBe(true);
    // 5 MB is 80 chunks; the stream may have one or two more queued ahead of the reader
    expect(s.pulled()).toBeLessThan(84);
  });

  it("accepts a chunked body exactly at the limit", async () => {
    const s = streamed(80);
    expect((await readBodyLimited(s.req, 80 * 65536)).byteLength).toBe(80 * 65536);
  });
});
