/**
 * A small, safe XML reader for drawings: iterative (no recursion, so deep nesting cannot overflow the
 * stack), with a size limit and a depth limit, no DTD processing and no entity expansion beyond the five
 * predefined entities and numeric character references (XML 1.0, sections 4.1 and 4.6).
 * A DOCTYPE without an internal subset is skipped and its external DTD is never read; a DOCTYPE with an
 * internal subset (where entity declarations live, as in "billion laughs" or external-entity attacks) is
 * rejected. Text content is not kept (the readers only need elements and attributes).
 */
import { InputError } from '../base/errors.js';

export interface XmlElement {
  /** Name as written, with any prefix (e.g. `svg:path`). */
  name: string;
  attrs: Record<string, string>;
  children: XmlElement[];
  /** Character offset of the `<` that opens the element. */
  offset: number;
  /** Text content (character data and CDATA, entities decoded), kept only for elements named in `keepText`. */
  text?: string;
}

export interface XmlLimits {
  /** Largest accepted text, in characters (default 20 MiB). */
  maxChars?: number;
  /** Deepest accepted element nesting (default 1000). */
  maxDepth?: number;
  /** Element names (as written, prefix included) whose direct text content is kept in `text` (e.g. style, title). */
  keepText?: ReadonlySet<string>;
}

export const XML_MAX_CHARS = 20 * 1024 * 1024;
export const XML_MAX_DEPTH = 1000;

/** "line L, column C" of a character offset (1-based). */
export function lineColumn(text: string, offset: number): string {
  let line = 1, col = 1;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) { line++; col = 1; } else col++;
  }
  return `line ${line}, column ${col}`;
}

const NAME_START = /[A-Za-z_:\u00C0-\uFFFF]/;
const NAME_CHAR = /[A-Za-z0-9_:.\-\u00B7\u00C0-\uFFFF]/;

function decodeEntities(raw: string, text: string, base: number, label: string): string {
  if (raw.indexOf('&') < 0) return raw;
  let out = '';
  let i = 0;
  while (i < raw.length) {
    const amp = raw.indexOf('&', i);
    if (amp < 0) { out += raw.slice(i); break; }
    out += raw.slice(i, amp);
    const semi = raw.indexOf(';', amp);
    const where = () => `${label} ${lineColumn(text, base + amp)}`;
    if (semi < 0 || semi - amp > 12) throw new InputError(where(), "expected an entity reference such as '&amp;' (a bare '&' must be written '&amp;')");
    const name = raw.slice(amp + 1, semi);
    let ch: string | undefined;
    switch (name) {
      case 'lt': ch = '<'; break;
      case 'gt': ch = '>'; break;
      case 'amp': ch = '&'; break;
      case 'quot': ch = '"'; break;
      case 'apos': ch = "'"; break;
      default: {
        const m = /^#(?:x([0-9A-Fa-f]+)|([0-9]+))$/.exec(name);
        if (m) {
          const code = m[1] !== undefined ? parseInt(m[1], 16) : parseInt(m[2], 10);
          if (code > 0 && code <= 0x10ffff) ch = String.fromCodePoint(code);
        }
      }
    }
    if (ch === undefined) {
      throw new InputError(where(), `entity '&${name};' is not accepted; only &lt; &gt; &amp; &quot; &apos; and numeric character references are (no DTD entities)`);
    }
    out += ch;
    i = semi + 1;
  }
  return out;
}

/** Parse an XML document into its root element. Throws InputError (with line and column) on anything malformed or unsafe. */
export function parseXml(text: string, limits: XmlLimits = {}, label = 'xml'): XmlElement {
  const maxChars = limits.maxChars ?? XML_MAX_CHARS;
  const maxDepth = limits.maxDepth ?? XML_MAX_DEPTH;
  const keep = limits.keepText;
  if (text.length > maxChars) {
    throw new InputError(label, `file is ${text.length} characters; the limit is ${maxChars} (${(maxChars / 1048576).toFixed(0)} MiB)`);
  }
  const at = (i: number) => `${label} ${lineColumn(text, i)}`;
  const stack: XmlElement[] = [];
  let root: XmlElement | undefined;
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const n = text.length;
  const readName = (): string => {
    const start = i;
    if (i >= n || !NAME_START.test(text[i])) throw new InputError(at(i), 'expected a name');
    i++;
    while (i < n && NAME_CHAR.test(text[i])) i++;
    return text.slice(start, i);
  };
  const skipSpace = () => { while (i < n && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++; };

  while (i < n) {
    const lt = text.indexOf('<', i);
    const textEnd = lt < 0 ? n : lt;
    if (textEnd > i) {
      const chunk = text.slice(i, textEnd);
      if (stack.length === 0) {
        if (chunk.trim() !== '') throw new InputError(at(i), 'expected only markup outside the root element');
      } else {
        const decoded = decodeEntities(chunk, text, i, label); // checks the references
        const top = stack[stack.length - 1];
        if (keep?.has(top.name)) top.text = (top.text ?? '') + decoded;
      }
    }
    if (lt < 0) break;
    i = lt;
    if (text.startsWith('<!--', i)) {
      const end = text.indexOf('-->', i + 4);
      if (end < 0) throw new InputError(at(i), "comment is not closed (expected '-->')");
      i = end + 3;
    } else if (text.startsWith('<![CDATA[', i)) {
      if (stack.length === 0) throw new InputError(at(i), 'CDATA section outside the root element');
      const end = text.indexOf(']]>', i + 9);
      if (end < 0) throw new InputError(at(i), "CDATA section is not closed (expected ']]>')");
      const top = stack[stack.length - 1];
      if (keep?.has(top.name)) top.text = (top.text ?? '') + text.slice(i + 9, end);
      i = end + 3;
    } else if (text.startsWith('<?', i)) {
      const end = text.indexOf('?>', i + 2);
      if (end < 0) throw new InputError(at(i), "processing instruction is not closed (expected '?>')");
      i = end + 2;
    } else if (text.startsWith('<!DOCTYPE', i)) {
      if (root || stack.length > 0) throw new InputError(at(i), 'DOCTYPE after the root element');
      let j = i + 9;
      let quote = '';
      for (; j < n; j++) {
        const c = text[j];
        if (quote) { if (c === quote) quote = ''; continue; }
        if (c === '"' || c === "'") quote = c;
        else if (c === '[') {
          throw new InputError(at(j), 'DOCTYPE with an internal subset (entity or element declarations) is not accepted; remove the [...] part');
        } else if (c === '>') break;
      }
      if (j >= n) throw new InputError(at(i), "DOCTYPE is not closed (expected '>')");
      i = j + 1;
    } else if (text.startsWith('<!', i)) {
      throw new InputError(at(i), 'markup declarations (<!ENTITY ...>, <!ELEMENT ...>) are not accepted');
    } else if (text.startsWith('</', i)) {
      const start = i;
      i += 2;
      const name = readName();
      skipSpace();
      if (text[i] !== '>') throw new InputError(at(i), `expected '>' to end </${name}`);
      i++;
      const open = stack.pop();
      if (!open) throw new InputError(at(start), `closing tag </${name}> without an opening tag`);
      if (open.name !== name) throw new InputError(at(start), `expected </${open.name}> (opened at ${lineColumn(text, open.offset)}), got </${name}>`);
    } else {
      const start = i;
      i++;
      const name = readName();
      const el: XmlElement = { name, attrs: Object.create(null) as Record<string, string>, children: [], offset: start };
      let selfClosing = false;
      for (;;) {
        const before = i;
        skipSpace();
        if (i >= n) throw new InputError(at(start), `element <${name}> is not closed (expected '>')`);
        if (text[i] === '>') { i++; break; }
        if (text.startsWith('/>', i)) { i += 2; selfClosing = true; break; }
        if (i === before) throw new InputError(at(i), `expected a space before the next attribute of <${name}>`);
        const an = readName();
        skipSpace();
        if (text[i] !== '=') throw new InputError(at(i), `expected '=' after attribute ${an} of <${name}>`);
        i++;
        skipSpace();
        const q = text[i];
        if (q !== '"' && q !== "'") throw new InputError(at(i), `expected a quoted value for attribute ${an} of <${name}>`);
        const end = text.indexOf(q, i + 1);
        if (end < 0) throw new InputError(at(i), `value of attribute ${an} is not closed`);
        const raw = text.slice(i + 1, end);
        const badLt = raw.indexOf('<');
        if (badLt >= 0) throw new InputError(at(i + 1 + badLt), `'<' is not allowed in an attribute value (write &lt;)`);
        if (Object.prototype.hasOwnProperty.call(el.attrs, an)) throw new InputError(at(before), `attribute ${an} appears twice on <${name}>`);
        el.attrs[an] = decodeEntities(raw, text, i + 1, label);
        i = end + 1;
      }
      if (stack.length > 0) stack[stack.length - 1].children.push(el);
      else if (root) throw new InputError(at(start), 'expected a single root element; found a second one');
      else root = el;
      if (!selfClosing) {
        if (stack.length >= maxDepth) {
          throw new InputError(at(start), `elements are nested more than ${maxDepth} deep; the limit guards against malicious files`);
        }
        stack.push(el);
      }
    }
  }
  if (stack.length > 0) {
    const open = stack[stack.length - 1];
    throw new InputError(at(open.offset), `element <${open.name}> is never closed`);
  }
  if (!root) throw new InputError(label, 'expected an XML document with a root element, found none');
  return root;
}
