/**
 * Bytes to text as every input is read: strict UTF-8, with the DXF exceptions (binary DXF refused by name, old
 * DXF in its code page). No file access here, so the page in the browser decodes dropped files the same way.
 */
import { InputError } from './errors.js';

/** Largest input accepted, in bytes. */
export const MAX_INPUT_BYTES = 32 * 1024 * 1024;

export function decodeUtf8(bytes: Uint8Array, label: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    const head = new TextDecoder('latin1').decode(bytes.subarray(0, 22));
    if (head.startsWith('AutoCAD Binary DXF')) throw new InputError(label, 'is a binary DXF, which is not read; save the drawing as ASCII DXF');
    // DXF before AutoCAD 2007 is written in the drawing's code page ($DWGCODEPAGE, mostly Windows-1252); its
    // geometry is ASCII and its text is not read, so decoding it as Windows-1252 changes no figure
    if (/\.dxf$/i.test(label)) return new TextDecoder('windows-1252').decode(bytes);
    throw new InputError(label, `is not UTF-8 text (invalid byte sequence at byte offset ${firstBadUtf8(bytes)})`);
  }
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 well-formedness). */
export function firstBadUtf8(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i];
    let n = 0, min = 0;
    if (c < 0x80) { i++; continue; }
    if (c >= 0xc2 && c <= 0xdf) { n = 1; min = 0x80; } else if (c >= 0xe0 && c <= 0xef) { n = 2; min = 0x800; } else if (c >= 0xf0 && c <= 0xf4) { n = 3; min = 0x10000; } else return i;
    let cp = c & (0x3f >> n);
    for (let k = 1; k <= n; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (d & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += n + 1;
  }
  return b.length;
}
