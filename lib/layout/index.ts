/** Reading a layout file in any encoding: size limit, encoding choice, one typed model or located errors. */
import { MAX_FILE_BYTES, type Encoding, type ParseResult } from "./model";
import { parseCsvLayout, type CsvOptions } from "./parse-csv";
import { parseJsonLayout } from "./parse-json";
import { parseXmlLayout } from "./parse-xml";

export * from "./model";
export { metresPer, newtonsPer, unitLabel, lengthUnits, forceUnits } from "./units";

/** Picks the encoding from a file name, a content type, or the first character. */
export function detectEncoding(text: string, hint?: string): Encoding {
  const h = (hint ?? "").toLowerCase();
  if (/\.json$|json/.test(h)) return "json";
  if (/\.xml$|xml/.test(h)) return "xml";
  if (/\.csv$|csv/.test(h)) return "csv";
  const first = text.replace(/^\uFEFF/, "").trimStart()[0];
  return first === "{" ? "json" : first === "<" ? "xml" : "csv";
}

/** Decodes bytes as UTF-8 strictly; returns null when they are not valid UTF-8 text. */
export function decodeText(bytes: Uint8Array): string | null {
  try {
    const text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return text.includes("\u0000") ? null : text;
  } catch {
    return null;
  }
}

/** Parses a layout file's bytes. */
export function parseLayoutBytes(bytes: Uint8Array, options: CsvOptions & { encoding?: Encoding; fileName?: string } = {}): ParseResult {
  if (bytes.byteLength > MAX_FILE_BYTES) {
    return {
      ok: false,
      errors: [{ location: "file", message: `the file is ${(bytes.byteLength / 1048576).toFixed(1)} MB; the limit is ${MAX_FILE_BYTES / 1048576} MB` }],
    };
  }
  const text = decodeText(bytes);
  if (text === null) return { ok: false, errors: [{ location: "file", message: "the file is not UTF-8 text (binary data or another encoding)" }] };
  return parseLayoutText(text, options);
}

/** Parses layout text in the given or detected encoding. */
export function parseLayoutText(text: string, options: CsvOptions & { encoding?: Encoding; fileName?: string } = {}): ParseResult {
  if (text.length > MAX_FILE_BYTES) {
    return { ok: false, errors: [{ location: "file", message: `the file is larger than the ${MAX_FILE_BYTES / 1048576} MB limit` }] };
  }
  const encoding = options.encoding ?? detectEncoding(text, options.fileName);
  if (encoding === "json") return parseJsonLayout(text, options.library);
  if (encoding === "xml") return parseXmlLayout(text, options.library);
  const name = options.name ?? options.fileName?.replace(/^.*[\\/]/, "").replace(/\.csv$/i, "");
  return parseCsvLayout(text, { ...options, name });
}
