/**
 * Hostile inputs: a corpus of bad files, each refused with a located error and no exception, and a seeded
 * random-mutation run of 2,400 files derived from the examples: every one either parses and analyses or is
 * refused with located errors — nothing throws.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseLayoutBytes, type ParseResult } from "@/lib/layout";
import { runEngine } from "@/lib/engine";
import { rng } from "../support/layouts";
import { exampleNames } from "../support/examples";
import { mutate } from "../support/mutate";

const enc = (s: string) => new TextEncoder().encode(s);
const refused = (r: ParseResult) => {
  expect(r.ok).toBe(false);
  if (!r.ok) {
    expect(r.errors.length).toBeGreaterThan(0);
    for (const e of r.errors) {
      expect(e.location.length).toBeGreaterThan(0);
      expect(e.message.length).toBeGreaterThan(3);
    }
  }
};

const corpus: [string, Uint8Array, string?][] = [
  [
    "billion laughs",
    enc(
      '<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol"><!ENTITY lol2 "&lol;&lol;&lol;&lol;">]><mount-layout format="mount-layout/1">&lol2;</mount-layout>',
    ),
    "xml",
  ],
  [
    "external entity",
    enc('<?xml version="1.0"?><!DOCTYPE x [<!ENTITY xxe SYSTEM "file:///etc/passwd">]><mount-layout format="mount-layout/1" name="&xxe;"/>'),
    "xml",
  ],
  ["parameter entity", enc('<!DOCTYPE x [<!ENTITY % p SYSTEM "http://example.invalid/x.dtd"> %p;]><mount-layout/>'), "xml"],
  ["10 MB body", new Uint8Array(10 * 1024 * 1024 + 3).fill(0x20), "json"],
  ["deeply nested JSON", enc("[".repeat(500000) + "]".repeat(500000)), "json"],
  ["deeply nested XML", enc("<a>".repeat(20000) + "</a>".repeat(20000)), "xml"],
  ["huge number", enc('{"format":"mount-layout/1","bodies":[{"id":"p"}],"contacts":[{"id":"a","body":"p","point":[1e400,0,0],"normal":[0,0,1]}]}'), "json"],
  ["NaN in XML", enc('<mount-layout format="mount-layout/1"><body id="p"/><contact id="a" body="p" point="NaN 0 0" normal="0 0 1"/></mount-layout>'), "xml"],
  ["wrong types", enc('{"format":"mount-layout/1","bodies":"p","contacts":{"id":1}}'), "json"],
  ["duplicate ids", enc('{"format":"mount-layout/1","bodies":[{"id":"p"},{"id":"p"}],"contacts":[]}'), "json"],
  ["CSV unterminated quote", enc('id,x,y,z,nx,ny,nz\n"a,0,0,0,0,0,1\n'), "csv"],
  ["CSV wrong column count", enc("id,x,y,z,nx,ny,nz\na,0,0,0,0,0,1,9\n"), "csv"],
  ["CSV formula injection as an id", enc("id,x,y,z,nx,ny,nz\n=cmd|' /C calc'!A0,0,0,0,0,0,1\n"), "csv"],
  ["binary data", Uint8Array.from({ length: 4096 }, (_, i) => (i * 7919) % 256), "json"],
  ["UTF-16 text", new Uint8Array([0xff, 0xfe, 0x7b, 0x00, 0x7d, 0x00]), "json"],
  ["Latin-1 text", new Uint8Array([0x69, 0x64, 0x0a, 0xe9, 0x2c, 0x31]), "csv"],
  ["empty file", new Uint8Array(0), "json"],
  [
    "JSON prototype pollution keys",
    enc(
      '{"format":"mount-layout/1","__proto__":{"polluted":1},"bodies":[{"id":"constructor"}],"contacts":[{"id":"__proto__","body":"constructor","point":[0,0,0],"normal":[0,0,0]}]}',
    ),
    "json",
  ],
];

describe("hostile corpus", () => {
  it.each(corpus.map(([n, b, e]) => [n, b, e] as const))("%s is refused with located errors", (_n, bytes, encoding) => {
    refused(parseLayoutBytes(bytes, { encoding: encoding as "json" | "xml" | "csv" }));
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

describe("seeded random mutations of the examples", () => {
  it("2,400 mutated files: each parses and analyses, or is refused with located errors; none throws", () => {
    const files = exampleNames.flatMap((n) => ["json", "xml", "csv"].map((e) => `examples/${n}.${e}`));
    const r = rng(20261202);
    let accepted = 0;
    let refusedCount = 0;
    for (let i = 0; i < 2400; i++) {
      const file = files[i % files.length];
      let text = readFileSync(file, "utf8");
      const edits = 1 + Math.floor(r() * 3);
      for (let k = 0; k < edits; k++) text = mutate(text, r);
      const result = parseLayoutBytes(enc(text), { fileName: file });
      if (result.ok) {
        const { report } = runEngine(result.layout);
        expect(report.counts.rank).toBeGreaterThanOrEqual(0);
        accepted++;
      } else {
        for (const e of result.errors) expect(e.location).toBeTruthy();
        refusedCount++;
      }
    }
    expect(accepted + refusedCount).toBe(2400);
    expect(refusedCount).toBeGreaterThan(500);
    expect(accepted).toBeGreaterThan(100);
  }, 60_000);
});
