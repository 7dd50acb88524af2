/** Seeded random edits of example files, for the mutation runs (in process and over HTTP). */

/** One random edit of a text: delete, duplicate, swap, insert junk, change a digit, truncate. */
export function mutate(text: string, r: () => number): string {
  const pos = Math.floor(r() * text.length);
  const len = 1 + Math.floor(r() * 12);
  const junk = ['"', ",", "{", "}", "[", "]", "<", ">", "NaN", "1e999", "-", "\u0000", "é", "\n", " ", "0", "null", "&amp;", "ground"];
  switch (Math.floor(r() * 7)) {
    case 0:
      return text.slice(0, pos) + text.slice(pos + len);
    case 1:
      return text.slice(0, pos) + text.slice(pos, pos + len) + text.slice(pos);
    case 2:
      return text.slice(0, pos) + junk[Math.floor(r() * junk.length)] + text.slice(pos);
    case 3:
      return text.replace(/\d/g, (d) => (r() < 0.05 ? String((Number(d) + 1 + Math.floor(r() * 8)) % 10) : d));
    case 4:
      return text.slice(0, pos);
    case 5:
      return text.replace(/"(body|on)": "[^"]*"/, `"$1": "nowhere"`);
    default: {
      const q = Math.floor(r() * text.length);
      const a = text.slice(pos, pos + len);
      return text.slice(0, pos) + text.slice(q, q + len) + text.slice(pos + len, q) + a + text.slice(q + len);
    }
  }
}
