/**
 * From a file's bytes to text: byte-order marks, a named encoding, strict
 * UTF-8 with an error that names the line and the likely encoding, and the
 * signatures of files that are not text at all (workbooks, Parquet, Arrow,
 * compressed files).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** What a file's first bytes say it is, when it is not plain text. */
export type _BinaryKind = "xlsx" | "parquet" | "arrow" | "arrow-stream" | "xls" | "gzip" | "zip";

/** Formats recognised by their first bytes (their published signatures). */
export function _sniffBinary(bytes: Uint8Array): _BinaryKind | null {
  const at = (k: number, ...b: number[]) => b.every((x, i) => bytes[k + i] === x);
  // Office Open XML workbooks are zip archives ("PK\x03\x04") holding xl/workbook.xml.
  if (at(0, 0x50, 0x4b, 0x03, 0x04)) return _zipHas(bytes, "xl/") ? "xlsx" : "zip";
  if (at(0, 0x50, 0x41, 0x52, 0x31)) return "parquet"; // "PAR1"
  if (at(0, 0x41, 0x52, 0x52, 0x4f, 0x57, 0x31)) return "arrow"; // "ARROW1"
  // An Arrow IPC stream starts with a continuation marker and a schema message.
  if (at(0, 0xff, 0xff, 0xff, 0xff) && bytes.length >= 8 && bytes[4] !== 0xff) {
    return "arrow-stream";
  }
  if (at(0, 0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1)) return "xls"; // OLE2 (legacy .xls)
  if (at(0, 0x1f, 0x8b)) return "gzip";
  return null;
}

/** Whether a zip archive's first entries name a path starting with `prefix`. */
function _zipHas(bytes: Uint8Array, prefix: string): boolean {
  const head = new TextDecoder("latin1").decode(bytes.subarray(0, Math.min(bytes.length, 1 << 16)));
  return head.includes(prefix) || head.includes("[Content_Types].xml");
}

/** The text encodings a byte-order mark announces. */
export function _bomEncoding(bytes: Uint8Array): { encoding: string; length: number } | null {
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) {
    return { encoding: "utf-8", length: 3 };
  }
  if (bytes[0] === 0xff && bytes[1] === 0xfe) {
    if (bytes[2] === 0 && bytes[3] === 0) return { encoding: "utf-32le", length: 4 };
    return { encoding: "utf-16le", length: 2 };
  }
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return { encoding: "utf-16be", length: 2 };
  if (bytes[0] === 0 && bytes[1] === 0 && bytes[2] === 0xfe && bytes[3] === 0xff) {
    return { encoding: "utf-32be", length: 4 };
  }
  return null;
}

/**
 * Decode bytes with a named encoding (any WHATWG label: `"windows-1252"`,
 * `"iso-8859-15"`, `"utf-16le"`, `"shift_jis"`, …), refusing bytes that the
 * encoding cannot hold.
 */
export function _decodeAs(bytes: Uint8Array, encoding: string, source: string): string {
  let decoder: TextDecoder;
  try {
    decoder = new TextDecoder(encoding, { fatal: true });
  } catch {
    throw new PlumbError(
      "bad-option",
      `Unknown encoding ${
        JSON.stringify(encoding)
      }: give a label such as "utf-8", "windows-1252", "iso-8859-1", "utf-16le" or "shift_jis"`,
    );
  }
  try {
    return decoder.decode(bytes);
  } catch {
    throw new PlumbError(
      "malformed",
      `Cannot read ${source} as ${encoding}: it holds bytes that are not ${encoding} text; check the file's encoding (the program that wrote it usually says) and pass it as the encoding option`,
      { source },
    );
  }
}

/** Strict UTF-8 decoding; invalid bytes give {@linkcode _utf8Error}. */
export function _decodeUtf8(bytes: Uint8Array, source: string, firstLine = 1): string {
  try {
    return _strict.decode(bytes);
  } catch {
    const offset = _firstInvalidUtf8(bytes);
    throw _utf8Error(bytes, offset, source, _lineAt(bytes, offset, firstLine));
  }
}

/** The line of `bytes[offset]`, counting `\n`, `\r\n` and a lone `\r` as line ends. */
export function _lineAt(bytes: Uint8Array, offset: number, firstLine = 1): number {
  let line = firstLine;
  for (let i = 0; i < offset; i++) {
    if (bytes[i] === 10 || (bytes[i] === 13 && bytes[i + 1] !== 10)) line++;
  }
  return line;
}

const _strict = new TextDecoder("utf-8", { fatal: true });

/**
 * Where the first byte that is not part of valid UTF-8 sits (RFC 3629:
 * no overlong forms, no surrogates, nothing above U+10FFFF), or −1.
 */
export function _firstInvalidUtf8(bytes: Uint8Array, from = 0): number {
  let i = from;
  const n = bytes.length;
  while (i < n) {
    const c = bytes[i];
    if (c < 0x80) {
      i++;
      continue;
    }
    let need = 0;
    let min = 0;
    if (c >= 0xc2 && c <= 0xdf) [need, min] = [1, 0x80];
    else if (c >= 0xe0 && c <= 0xef) [need, min] = [2, 0x800];
    else if (c >= 0xf0 && c <= 0xf4) [need, min] = [3, 0x10000];
    else return i;
    if (i + need >= n) return i;
    let cp = c & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      const d = bytes[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (d & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

/**
 * The error for bytes that are not UTF-8: the line, the byte, and the
 * encoding the file is most likely in, with the option that reads it.
 */
export function _utf8Error(
  bytes: Uint8Array,
  offset: number,
  source: string,
  line: number,
): PlumbError {
  const byte = bytes[offset];
  const hex = `0x${byte.toString(16).toUpperCase().padStart(2, "0")}`;
  const guess = _guessEncoding(bytes);
  let meaning = "";
  if (guess === "windows-1252") {
    const c = new TextDecoder("windows-1252").decode(Uint8Array.of(byte));
    meaning = ` (where ${hex} is ${JSON.stringify(c)})`;
  }
  return new PlumbError(
    "malformed",
    `Cannot read ${source} as UTF-8 at line ${line}: the byte ${hex} is not UTF-8 text; the file is probably in ${guess}${meaning}: pass { encoding: "${guess}" }`,
    { source, line, offset, encoding: guess },
  );
}

/**
 * The likely encoding of bytes that are not UTF-8: UTF-16 when every other
 * byte of the start is zero (text mostly in ASCII), else windows-1252, the
 * usual single-byte encoding of spreadsheet exports on Western systems
 * (common practice; a guess, said as one).
 */
export function _guessEncoding(bytes: Uint8Array): string {
  const n = Math.min(bytes.length, 4096) & ~1;
  let evenZero = 0;
  let oddZero = 0;
  for (let i = 0; i < n; i += 2) {
    if (bytes[i] === 0) evenZero++;
    if (bytes[i + 1] === 0) oddZero++;
  }
  const half = n / 2;
  if (half > 0 && oddZero > 0.3 * half && evenZero < 0.05 * half) return "utf-16le";
  if (half > 0 && evenZero > 0.3 * half && oddZero < 0.05 * half) return "utf-16be";
  return "windows-1252";
}
