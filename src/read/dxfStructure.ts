/**
 * DXF file structure over the tokenized group codes: sections (HEADER, TABLES, BLOCKS, ENTITIES),
 * header variables, the LAYER table, block definitions and entity records (AutoCAD DXF Reference,
 * "DXF Format": general structure; "TABLES", "BLOCKS" and "ENTITIES" sections). Iterative; no recursion.
 *
 * An entity is a range of group codes [start, end) after its "0 TYPE" pair. A POLYLINE keeps its VERTEX
 * records as children; ATTRIB records after an INSERT become entities of their own (ignored later).
 */
import { InputError } from '../base/errors.js';
import type { DxfTags } from './dxfTags.js';

export interface DxfEntity {
  type: string;
  /** First group code after the "0 TYPE" pair, and one past the last. */
  start: number; end: number;
  /** Line number of the "0" group code. */
  line: number;
  handle: string;
  layer: string;
  /** VERTEX records of a POLYLINE. */
  children?: DxfEntity[];
}

export interface DxfLayer {
  name: string;
  /** Colour number as written: negative means the layer is off. */
  colour: number;
  /** Flags (group 70): bit 1 frozen. */
  flags: number;
  trueColour?: number;
}

export interface DxfBlock {
  name: string;
  baseX: number; baseY: number;
  flags: number;
  line: number;
  entities: DxfEntity[];
}

export interface DxfFile {
  tags: DxfTags;
  header: Map<string, { code: number; value: string; line: number }[]>;
  /** Keyed by upper-case name (layer names compare without regard to case). */
  layers: Map<string, DxfLayer>;
  /** Keyed by upper-case name (block names compare without regard to case). */
  blocks: Map<string, DxfBlock>;
  entities: DxfEntity[];
}

/** Value of the first group `code` in [start, end) before extended data (1001), or undefined. */
export function findValue(t: DxfTags, start: number, end: number, code: number): string | undefined {
  for (let i = start; i < end; i++) {
    const c = t.codes[i];
    if (c === 1001) return undefined;
    if (c === code) return t.values[i];
  }
  return undefined;
}

export function parseDxfStructure(t: DxfTags, label: string): DxfFile {
  const header: DxfFile['header'] = new Map();
  const layers = new Map<string, DxfLayer>();
  const blocks = new Map<string, DxfBlock>();
  let entities: DxfEntity[] = [];
  const n = t.count;
  let i = 0;
  const at = (k: number) => `${label} line ${t.lines[Math.min(k, n - 1)] ?? 0}`;
  const isZero = (k: number, v: string) => t.codes[k] === 0 && t.values[k].toUpperCase() === v;

  // entity records from i up to a "0" whose value is in stop; returns the index of that stop tag
  const readEntities = (from: number, stop: string[], sectionName: string): [DxfEntity[], number] => {
    const out: DxfEntity[] = [];
    let k = from;
    let openPolyline: DxfEntity | undefined;
    while (k < n) {
      if (t.codes[k] !== 0) throw new InputError(at(k), `expected an entity ("0" group code) in ${sectionName}, got group code ${t.codes[k]}`);
      const type = t.values[k].toUpperCase();
      if (stop.includes(type)) return [out, k];
      if (type === 'EOF') break;
      let e = k + 1;
      while (e < n && t.codes[e] !== 0) e++;
      const ent: DxfEntity = { type, start: k + 1, end: e, line: t.lines[k], handle: '', layer: '0' };
      ent.handle = findValue(t, k + 1, e, 5) ?? findValue(t, k + 1, e, 105) ?? '';
      ent.layer = findValue(t, k + 1, e, 8) ?? '0';
      if (type === 'VERTEX' && openPolyline) {
        openPolyline.children!.push(ent);
      } else if (type === 'SEQEND') {
        openPolyline = undefined;
      } else {
        openPolyline = undefined;
        if (type === 'POLYLINE') { ent.children = []; openPolyline = ent; }
        out.push(ent);
      }
      k = e;
    }
    throw new InputError(at(n - 1), `file ends inside the ${sectionName} section (truncated file?)`);
  };

  while (i < n) {
    if (t.codes[i] !== 0) throw new InputError(at(i), `expected "0 SECTION", got group code ${t.codes[i]}`);
    const v = t.values[i].toUpperCase();
    if (v === 'EOF') break;
    if (v !== 'SECTION') throw new InputError(at(i), `expected "0 SECTION", got "0 ${t.values[i].slice(0, 30)}"`);
    if (i + 1 >= n || t.codes[i + 1] !== 2) throw new InputError(at(i + 1), 'expected the section name (group code 2)');
    const name = t.values[i + 1].toUpperCase();
    i += 2;
    if (name === 'ENTITIES') {
      const [ents, k] = readEntities(i, ['ENDSEC'], 'ENTITIES');
      entities = entities.concat(ents);
      i = k + 1;
      continue;
    }
    if (name === 'BLOCKS') {
      while (i < n && !isZero(i, 'ENDSEC')) {
        if (!isZero(i, 'BLOCK')) throw new InputError(at(i), `expected "0 BLOCK" in the BLOCKS section, got "${t.codes[i]} ${t.values[i].slice(0, 30)}"`);
        let e = i + 1;
        while (e < n && t.codes[e] !== 0) e++;
        const bname = findValue(t, i + 1, e, 2) ?? findValue(t, i + 1, e, 3) ?? '';
        const bx = Number(findValue(t, i + 1, e, 10) ?? 0), by = Number(findValue(t, i + 1, e, 20) ?? 0);
        const flags = Number(findValue(t, i + 1, e, 70) ?? 0);
        if (!Number.isFinite(bx) || !Number.isFinite(by)) throw new InputError(at(i), `block "${bname}" has a base point that is not a number`);
        const [ents, k] = readEntities(e, ['ENDBLK'], `BLOCKS (block "${bname}")`);
        // skip ENDBLK's own group codes
        let m = k + 1;
        while (m < n && t.codes[m] !== 0) m++;
        if (bname !== '') blocks.set(bname.toUpperCase(), { name: bname, baseX: bx, baseY: by, flags: Number.isFinite(flags) ? flags : 0, line: t.lines[i], entities: ents });
        i = m;
      }
      if (i >= n) throw new InputError(at(n - 1), 'file ends inside the BLOCKS section (truncated file?)');
      i++;
      continue;
    }
    // HEADER, TABLES and any other section: scan to ENDSEC
    let e = i;
    while (e < n && !isZero(e, 'ENDSEC')) e++;
    if (e >= n) throw new InputError(at(n - 1), `file ends inside the ${name} section (truncated file?)`);
    if (name === 'HEADER') {
      let cur = '';
      for (let k = i; k < e; k++) {
        if (t.codes[k] === 9) { cur = t.values[k].toUpperCase(); continue; }
        if (cur === '') continue;
        let list = header.get(cur);
        if (!list) { list = []; header.set(cur, list); }
        list.push({ code: t.codes[k], value: t.values[k], line: t.lines[k] });
      }
    } else if (name === 'TABLES') {
      let inLayerTable = false;
      for (let k = i; k < e; k++) {
        if (t.codes[k] !== 0) continue;
        const tv = t.values[k].toUpperCase();
        if (tv === 'TABLE') { inLayerTable = (findValue(t, k + 1, Math.min(e, k + 3), 2) ?? '').toUpperCase() === 'LAYER'; continue; }
        if (tv === 'ENDTAB') { inLayerTable = false; continue; }
        if (inLayerTable && tv === 'LAYER') {
          let m = k + 1;
          while (m < e && t.codes[m] !== 0) m++;
          const lname = findValue(t, k + 1, m, 2);
          if (lname !== undefined) {
            const colour = Number(findValue(t, k + 1, m, 62) ?? 7);
            const flags = Number(findValue(t, k + 1, m, 70) ?? 0);
            const tc = findValue(t, k + 1, m, 420);
            layers.set(lname.toUpperCase(), {
              name: lname,
              colour: Number.isFinite(colour) ? colour : 7,
              flags: Number.isFinite(flags) ? flags : 0,
              trueColour: tc !== undefined && Number.isFinite(Number(tc)) ? Number(tc) : undefined,
            });
          }
        }
      }
    }
    i = e + 1;
  }
  return { tags: t, header, layers, blocks, entities };
}
