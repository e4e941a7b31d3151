/**
 * Byte-level helpers of the quick CSV reader: decoding a cell, finding rows
 * and fields again after the load, and cutting a column's text out of the
 * bytes when it is first asked for.
 *
 * @module
 */

const _strict = new TextDecoder("utf-8", { fatal: true });

/**
 * Decode bytes[a, b) as UTF-8 (a cheap path for short ASCII cells); `null`
 * when the bytes are not valid UTF-8.
 */
export function _decodeCell(bytes: Uint8Array, a: number, b: number): string | null {
  if (b - a <= 64) {
    let ascii = true;
    for (let i = a; i < b; i++) {
      if (bytes[i] > 127) {
        ascii = false;
        break;
      }
    }
    if (ascii) {
      return String.fromCharCode.apply(null, bytes.subarray(a, b) as unknown as number[]);
    }
  }
  try {
    return _strict.decode(bytes.subarray(a, b));
  } catch {
    return null;
  }
}

/**
 * The start offset of each of the `rows` rows that follow `pos`, skipping
 * blank lines as the reader did.
 */
export function _rowStarts(
  bytes: Uint8Array,
  pos: number,
  rows: number,
  skipBlank: boolean,
): Int32Array {
  const starts = new Int32Array(rows);
  for (let r = 0; r < rows; r++) {
    if (skipBlank) {
      for (;;) {
        const c = bytes[pos];
        if (c === 10) pos++;
        else if (c === 13 && bytes[pos + 1] === 10) pos += 2;
        else break;
      }
    }
    starts[r] = pos;
    pos = bytes.indexOf(10, pos) + 1;
  }
  return starts;
}

/** How many fields the line starting at `start` has. */
export function _fieldsOnLine(bytes: Uint8Array, start: number, dc: number): number {
  let fields = 1;
  for (let i = start; i < bytes.length && bytes[i] !== 10; i++) if (bytes[i] === dc) fields++;
  return fields;
}

/** Cut one column's cells out of the bytes, row by row, trimmed. */
export function _columnTexts(
  bytes: Uint8Array,
  starts: Int32Array,
  j: number,
  last: number,
  dc: number,
): string[] {
  const out: string[] = new Array(starts.length);
  for (let r = 0; r < starts.length; r++) {
    let a = starts[r];
    for (let k = 0; k < j; k++) a = bytes.indexOf(dc, a) + 1;
    let b: number;
    if (j < last) {
      b = bytes.indexOf(dc, a);
    } else {
      b = bytes.indexOf(10, a);
      if (b === -1) b = bytes.length;
      if (b > a && bytes[b - 1] === 13) b--;
    }
    // Every cell was decoded once during the load, so the bytes are valid UTF-8.
    // Trimmed of every Unicode space (no-break spaces too), as csv-parse trims.
    out[r] = (_decodeCell(bytes, a, b) as string).trim();
  }
  return out;
}
