/**
 * Checks on the raw text of a JSON input that JSON.parse cannot make: a key given twice in one object (the
 * parser keeps the last silently) and nesting deeper than any input of ours needs (the readers walk the
 * parsed tree, some recursively). One pass, iterative, O(n) time, memory proportional to the nesting.
 * Call it after JSON.parse accepted the text, so syntax errors keep their own messages.
 */
import { InputError } from './errors.js';

/** Deepest nesting of objects and arrays accepted in any JSON input. */
export const MAX_JSON_DEPTH = 256;

interface Frame { obj: boolean; seg: string; keys: Set<string> | null; key: string; index: number; expectKey: boolean }

function segment(f: Frame): string {
  return f.obj ? (/^[A-Za-z_$][\w$]*$/.test(f.key) ? `.${f.key}` : `[${JSON.stringify(f.key)}]`) : `[${f.index}]`;
}

function pathOf(stack: readonly Frame[], extra = ''): string {
  return (stack.map((f) => f.seg).join('') + extra).replace(/^\./, '');
}

/**
 * Refuse duplicate keys (naming their JSON path, as `where`) and nesting deeper than MAX_JSON_DEPTH. `label`
 * is used when the path is empty (the top level). `prefix` is put before the path (a file label and colon for
 * formats whose messages name the file).
 */
export function checkJsonText(text: string, label: string, prefix = ''): void {
  const stack: Frame[] = [];
  const where = (p: string) => (p === '' ? label : prefix + p);
  const n = text.length;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x22 /* " */) {
      const start = i;
      let escaped = false;
      for (i++; i < n; i++) {
        const d = text.charCodeAt(i);
        if (d === 0x5c) { escaped = true; i++; continue; }
        if (d === 0x22) break;
      }
      const top = stack[stack.length - 1];
      if (top && top.obj && top.expectKey) {
        const raw = text.slice(start + 1, i);
        let key = raw;
        if (escaped) { try { key = JSON.parse(text.slice(start, i + 1)) as string; } catch { /* JSON.parse reports it */ } }
        top.key = key;
        top.expectKey = false;
        if (top.keys!.has(key)) {
          throw new InputError(where(pathOf(stack, segment(top))), `key "${key}" appears twice in the same object; give it once (with duplicate keys the last would silently win)`);
        }
        top.keys!.add(key);
      }
    } else if (c === 0x7b /* { */ || c === 0x5b /* [ */) {
      const parent = stack[stack.length - 1];
      const seg = parent ? segment(parent) : '';
      if (stack.length >= MAX_JSON_DEPTH) {
        throw new InputError(label, `objects and arrays are nested deeper than ${MAX_JSON_DEPTH} levels (at character ${i + 1}); no input needs that many`);
      }
      const obj = c === 0x7b;
      stack.push({ obj, seg, keys: obj ? new Set() : null, key: '', index: 0, expectKey: obj });
    } else if (c === 0x7d /* } */ || c === 0x5d /* ] */) {
      stack.pop();
    } else if (c === 0x2c /* , */) {
      const top = stack[stack.length - 1];
      if (top) { if (top.obj) top.expectKey = true; else top.index++; }
    }
  }
}
