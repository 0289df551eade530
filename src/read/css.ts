/**
 * The part of CSS a drawing reader needs: `<style>` sheets and `style` attributes parsed with css-tree
 * (CSS Syntax Level 3 tokenizer and parser), selectors matched with css-select (through a small adapter over
 * our XML tree), and the cascade of CSS Cascading and Inheritance Level 4 for the few properties that decide
 * what is cut: `display`, `visibility`, `transform`, `transform-origin`, `stroke`, `fill`.
 *
 * Cascade order, lowest first (CSS Cascade 4, section 6; SVG 2, section 6.8 "presentation attributes" count as
 * author rules of specificity 0 that come before every style sheet): presentation attribute < style sheet rule
 * (by specificity, then document order) < `style` attribute < `!important` sheet rule < `!important` style
 * attribute. `visibility`, `stroke` and `fill` inherit; `display` and `transform` do not (`display: none` hides
 * the whole subtree all the same). The keyword `inherit` takes the parent's computed value.
 *
 * The choice of parser and selector engine, with figures, is recorded in docs/css-parser-decision.md.
 */
import { createRequire } from 'node:module';
import type * as CssTreeModule from 'css-tree';
import type * as CssSelectModule from 'css-select';
import type { Options as SelectOptions } from 'css-select';
import type * as CssWhatModule from 'css-what';
import type { Selector } from 'css-what';
import { InputError } from '../base/errors.js';

// The CSS libraries are loaded on first use (about 0.2 s), so that drawings without any CSS, and every command
// that reads no SVG, do not pay for them at start-up. css-tree ships a CommonJS build; css-select and css-what
// are ES modules, loaded by require() as Node ≥ 20.19 allows (css-select 7 requires that Node anyway).
const load = createRequire(import.meta.url);
let treeModule: typeof CssTreeModule | undefined;
let selectModule: typeof CssSelectModule | undefined;
let whatModule: typeof CssWhatModule | undefined;
const csstreeLib = () => (treeModule ??= load('css-tree') as typeof CssTreeModule);
const compile: typeof CssSelectModule.compile = (...a) => (selectModule ??= load('css-select') as typeof CssSelectModule).compile(...a);
const parseSelector: typeof CssWhatModule.parse = (...a) => (whatModule ??= load('css-what') as typeof CssWhatModule).parse(...a);
/** The css-tree functions used here, resolved lazily. */
const csstree = {
  parse: (...a: Parameters<typeof CssTreeModule.parse>) => csstreeLib().parse(...a),
  walk: (...a: Parameters<typeof CssTreeModule.walk>) => csstreeLib().walk(...a),
  generate: (...a: Parameters<typeof CssTreeModule.generate>) => csstreeLib().generate(...a),
};
// eslint-disable-next-line @typescript-eslint/no-namespace
declare namespace csstree {
  type CssNode = CssTreeModule.CssNode;
  type Declaration = CssTreeModule.Declaration;
  type Rule = CssTreeModule.Rule;
  type Atrule = CssTreeModule.Atrule;
  type Value = CssTreeModule.Value;
}
import type { XmlElement } from './xml.js';

/** Properties the cascade resolves. */
export const CASCADED = ['display', 'visibility', 'transform', 'transform-origin', 'stroke', 'fill'] as const;
export type CascadedProperty = (typeof CASCADED)[number];
const INHERITED: ReadonlySet<CascadedProperty> = new Set(['visibility', 'stroke', 'fill']);
const WANTED: ReadonlySet<string> = new Set(CASCADED);

export interface Declaration { property: CascadedProperty; value: string; important: boolean }

/** Declarations of a declaration list (a `style` attribute), only the cascaded properties, in order. */
export function parseDeclarations(text: string, where: string): Declaration[] {
  const out: Declaration[] = [];
  let ast: csstree.CssNode;
  try {
    ast = csstree.parse(text, { context: 'declarationList', parseValue: false, onParseError: (e) => { throw e; } });
  } catch (e) {
    throw new InputError(where, `expected CSS declarations ("property: value; …"): ${(e as Error).message}`);
  }
  csstree.walk(ast, {
    visit: 'Declaration',
    enter(d: csstree.Declaration) {
      const p = d.property.toLowerCase();
      if (!WANTED.has(p)) return;
      out.push({ property: p as CascadedProperty, value: rawValue(d), important: d.important !== false });
    },
  });
  return out;
}

function rawValue(d: csstree.Declaration): string {
  const v = d.value;
  return (v.type === 'Raw' ? v.value : csstree.generate(v)).trim();
}

// -------------------------------------------------------------------------------------------------
// selectors

/** A node of the tree css-select walks: the XML element with its parent and siblings. */
export interface CssNode {
  el: XmlElement;
  name: string;
  parent: CssNode | null;
  children: CssNode[];
}

const ADAPTER: NonNullable<SelectOptions<CssNode, CssNode>['adapter']> = {
  isTag: (_n): _n is CssNode => true,
  getAttributeValue: (e, name) => e.el.attrs[name],
  getChildren: (n) => n.children,
  getName: (e) => e.name,
  getParent: (e) => e.parent,
  getSiblings: (n) => (n.parent ? n.parent.children : [n]),
  getText: (n) => n.el.text ?? '',
  hasAttrib: (e, name) => Object.prototype.hasOwnProperty.call(e.el.attrs, name),
  removeSubsets: (nodes) => nodes.filter((n, i) => {
    for (let p = n.parent; p; p = p.parent) if (nodes.includes(p)) return false;
    return nodes.indexOf(n) === i;
  }),
  prevElementSibling: (n) => {
    if (!n.parent) return null;
    const k = n.parent.children.indexOf(n);
    return k > 0 ? n.parent.children[k - 1] : null;
  },
};

/** Specificity (a, b, c) of one complex selector (Selectors Level 4, section 17), packed as a·10⁶ + b·10³ + c. */
function specificity(sel: Selector[]): number {
  let a = 0, b = 0, c = 0;
  for (const t of sel) {
    switch (t.type) {
      case 'attribute':
        if (t.name === 'id' && t.action === 'equals') a++; else b++;
        break;
      case 'tag': c++; break;
      case 'pseudo-element': c++; break;
      case 'pseudo':
        if (t.name === 'where') break;
        if (Array.isArray(t.data) && ['not', 'is', 'matches', 'has'].includes(t.name)) {
          const best = Math.max(0, ...t.data.map(specificity));
          a += Math.floor(best / 1e6); b += Math.floor((best % 1e6) / 1e3); c += best % 1e3;
        } else b++;
        break;
      default: break;
    }
  }
  return a * 1e6 + Math.min(b, 999) * 1e3 + Math.min(c, 999);
}

interface Rule {
  test: (n: CssNode) => boolean;
  spec: number;
  order: number;
  decls: Declaration[];
  /** Bucket key of the rightmost compound (class, id or tag), for a quick candidate filter. */
  key: string;
}

/** Keys an element can be found under: its classes, its id, its name, and the catch-all. */
function keysOf(n: CssNode): string[] {
  const out = ['*', `t:${n.name}`];
  const id = n.el.attrs.id;
  if (id !== undefined) out.push(`#${id}`);
  const cls = n.el.attrs.class;
  if (cls !== undefined) for (const c of cls.split(/\s+/)) if (c) out.push(`.${c}`);
  return out;
}

function ruleKey(sel: Selector[]): string {
  // the rightmost compound: tokens after the last combinator
  let k = sel.length;
  while (k > 0 && !['descendant', 'child', 'sibling', 'adjacent', 'parent', 'column-combinator'].includes(sel[k - 1].type)) k--;
  const last = sel.slice(k);
  for (const t of last) if (t.type === 'attribute' && t.name === 'id' && t.action === 'equals') return `#${t.value}`;
  for (const t of last) if (t.type === 'attribute' && t.name === 'class' && t.action === 'element') return `.${t.value}`;
  for (const t of last) if (t.type === 'tag') return `t:${t.name}`;
  return '*';
}

/** A parsed style sheet (all `<style>` elements of a document, in document order). */
export class StyleSheet {
  private readonly buckets = new Map<string, Rule[]>();
  /** Rules dropped because their selector could not be compiled (unknown pseudo-classes): counted, not fatal. */
  unsupportedSelectors = 0;
  ruleCount = 0;

  add(text: string, where: string): void {
    let ast: csstree.CssNode;
    try {
      ast = csstree.parse(text, { parseValue: false, parseRulePrelude: false, onParseError: (e) => { throw e; } });
    } catch (e) {
      throw new InputError(where, `expected a CSS style sheet: ${(e as Error).message}`);
    }
    csstree.walk(ast, {
      visit: 'Rule',
      enter: (r: csstree.Rule) => {
        // rules inside @media and other at-rules are not for drawings on a cutting table: skip them
        if (this.inAtrule(ast, r)) return;
        const prelude = r.prelude.type === 'Raw' ? r.prelude.value : csstree.generate(r.prelude);
        const decls: Declaration[] = [];
        csstree.walk(r.block, {
          visit: 'Declaration',
          enter(d: csstree.Declaration) {
            const p = d.property.toLowerCase();
            if (WANTED.has(p)) decls.push({ property: p as CascadedProperty, value: rawValue(d), important: d.important !== false });
          },
        });
        if (decls.length === 0) return;
        let parsed: Selector[][];
        try { parsed = parseSelector(prelude); } catch { this.unsupportedSelectors++; return; }
        for (const sel of parsed) {
          let test: (n: CssNode) => boolean;
          try {
            test = compile<CssNode, CssNode>([sel], { adapter: ADAPTER, xmlMode: true });
          } catch { this.unsupportedSelectors++; continue; }
          const rule: Rule = { test, spec: specificity(sel), order: this.ruleCount++, decls, key: ruleKey(sel) };
          const b = this.buckets.get(rule.key);
          if (b) b.push(rule); else this.buckets.set(rule.key, [rule]);
        }
      },
    });
  }

  private atruleRules: Set<csstree.CssNode> | undefined;
  private inAtrule(ast: csstree.CssNode, r: csstree.Rule): boolean {
    if (!this.atruleRules) {
      const s = new Set<csstree.CssNode>();
      csstree.walk(ast, { visit: 'Atrule', enter(a: csstree.Atrule) { if (a.block) csstree.walk(a.block, { visit: 'Rule', enter(x: csstree.Rule) { s.add(x); } }); } });
      this.atruleRules = s;
    }
    return this.atruleRules.has(r);
  }

  get empty(): boolean { return this.buckets.size === 0; }

  /** Matching rules for a node, in cascade order (specificity, then document order). */
  matching(n: CssNode): Rule[] {
    const out: Rule[] = [];
    for (const k of keysOf(n)) {
      const b = this.buckets.get(k);
      if (b) for (const r of b) if (r.test(n)) out.push(r);
    }
    return out.sort((x, y) => x.spec - y.spec || x.order - y.order);
  }
}

/** Computed values of the cascaded properties (undefined: initial value). */
export type Computed = Partial<Record<CascadedProperty, string>>;

/**
 * The computed values for one element, given its parent's. `presentation` holds the element's presentation
 * attributes (already read by the caller), `style` its style attribute text.
 */
export function cascade(
  node: CssNode | undefined, sheet: StyleSheet | undefined, presentation: Computed, style: string | undefined,
  parent: Computed, where: string,
): Computed {
  const specified: Computed = {};
  const importantSet = new Set<CascadedProperty>();
  for (const p of CASCADED) if (presentation[p] !== undefined) specified[p] = presentation[p];
  const rules = node && sheet && !sheet.empty ? sheet.matching(node) : [];
  for (const r of rules) for (const d of r.decls) if (!d.important) specified[d.property] = d.value;
  const inline = style !== undefined && style.trim() !== '' ? parseDeclarations(style, `${where} style`) : [];
  for (const d of inline) if (!d.important) specified[d.property] = d.value;
  for (const r of rules) for (const d of r.decls) if (d.important) { specified[d.property] = d.value; importantSet.add(d.property); }
  for (const d of inline) if (d.important) { specified[d.property] = d.value; importantSet.add(d.property); }
  const out: Computed = {};
  for (const p of CASCADED) {
    const raw = specified[p];
    const v = raw?.trim().toLowerCase();
    const inherits = v === 'inherit' || ((v === undefined || v === 'unset') && INHERITED.has(p));
    if (inherits) out[p] = parent[p];
    else if (raw === undefined || v === 'initial' || v === 'unset' || v === 'revert' || v === 'revert-layer') out[p] = undefined;
    else out[p] = raw.trim();
  }
  return out;
}

// -------------------------------------------------------------------------------------------------
// CSS transforms (CSS Transforms Level 1, section 12 "transform functions"; SVG 2 lets the `transform`
// property apply to SVG elements, with lengths in user units = CSS px)

export type Affine6 = [number, number, number, number, number, number];

const ANGLE: Readonly<Record<string, number>> = { deg: Math.PI / 180, rad: 1, grad: Math.PI / 200, turn: 2 * Math.PI };

/**
 * The matrix of a CSS `transform` value, lengths in CSS px (`pxPer` converts other absolute units).
 * Throws InputError naming the function when a value cannot be read (percentages need a reference box).
 */
export function cssTransform(value: string, where: string, pxPer: Readonly<Record<string, number>>): Affine6 {
  const v = value.trim();
  if (v.toLowerCase() === 'none' || v === '') return [1, 0, 0, 1, 0, 0];
  let ast: csstree.CssNode;
  try {
    ast = csstree.parse(v, { context: 'value', onParseError: (e) => { throw e; } });
  } catch (e) {
    throw new InputError(`${where} style transform`, `expected CSS transform functions: ${(e as Error).message}`);
  }
  let m: Affine6 = [1, 0, 0, 1, 0, 0];
  const children = (ast as csstree.Value).children?.toArray() ?? [];
  for (const f of children) {
    if (f.type !== 'Function') throw new InputError(`${where} style transform`, `expected a transform function such as translate(10px, 0) or rotate(30deg), got "${csstree.generate(f)}"`);
    const name = f.name.toLowerCase();
    const args = f.children.toArray().filter((a) => a.type !== 'Operator' && a.type !== 'WhiteSpace');
    const w = `${where} style transform ${name}()`;
    const length = (a: csstree.CssNode): number => {
      if (a.type === 'Number') return Number(a.value);
      if (a.type === 'Dimension') {
        const k = pxPer[a.unit] ?? pxPer[a.unit.toLowerCase()];
        if (k === undefined) throw new InputError(w, `length unit "${a.unit}" is not accepted; expected px or an absolute unit`);
        return Number(a.value) * k;
      }
      throw new InputError(w, `expected a length, got "${csstree.generate(a)}"`);
    };
    const num = (a: csstree.CssNode): number => {
      if (a.type === 'Number') return Number(a.value);
      if (a.type === 'Percentage') return Number(a.value) / 100;
      throw new InputError(w, `expected a number, got "${csstree.generate(a)}"`);
    };
    const angle = (a: csstree.CssNode): number => {
      if (a.type === 'Number' && Number(a.value) === 0) return 0;
      if (a.type === 'Dimension' && ANGLE[a.unit.toLowerCase()] !== undefined) return Number(a.value) * ANGLE[a.unit.toLowerCase()];
      throw new InputError(w, `expected an angle with its unit (deg, rad, grad, turn), got "${csstree.generate(a)}"`);
    };
    const want = (lo: number, hi: number) => {
      if (args.length < lo || args.length > hi) throw new InputError(w, `expected ${lo === hi ? lo : `${lo} or ${hi}`} arguments, got ${args.length}`);
    };
    let t: Affine6;
    switch (name) {
      case 'matrix': want(6, 6); { const a = args.map(num); t = [a[0], a[1], a[2], a[3], a[4], a[5]]; } break;
      case 'translate': want(1, 2); t = [1, 0, 0, 1, length(args[0]), args[1] ? length(args[1]) : 0]; break;
      case 'translatex': want(1, 1); t = [1, 0, 0, 1, length(args[0]), 0]; break;
      case 'translatey': want(1, 1); t = [1, 0, 0, 1, 0, length(args[0])]; break;
      case 'scale': want(1, 2); { const sx = num(args[0]), sy = args[1] ? num(args[1]) : sx; t = [sx, 0, 0, sy, 0, 0]; } break;
      case 'scalex': want(1, 1); t = [num(args[0]), 0, 0, 1, 0, 0]; break;
      case 'scaley': want(1, 1); t = [1, 0, 0, num(args[0]), 0, 0]; break;
      case 'rotate': want(1, 1); { const a = angle(args[0]); t = [Math.cos(a), Math.sin(a), -Math.sin(a), Math.cos(a), 0, 0]; } break;
      case 'skew': want(1, 2); t = [1, Math.tan(args[1] ? angle(args[1]) : 0), Math.tan(angle(args[0])), 1, 0, 0]; break;
      case 'skewx': want(1, 1); t = [1, 0, Math.tan(angle(args[0])), 1, 0, 0]; break;
      case 'skewy': want(1, 1); t = [1, Math.tan(angle(args[0])), 0, 1, 0, 0]; break;
      default:
        throw new InputError(w, 'is not a two-dimensional transform function; expected matrix, translate, scale, rotate or skew');
    }
    m = [
      m[0] * t[0] + m[2] * t[1], m[1] * t[0] + m[3] * t[1],
      m[0] * t[2] + m[2] * t[3], m[1] * t[2] + m[3] * t[3],
      m[0] * t[4] + m[2] * t[5] + m[4], m[1] * t[4] + m[3] * t[5] + m[5],
    ];
  }
  return m;
}

/** The origin of a CSS `transform-origin` value in px; only lengths and left/top/center-free forms are read. */
export function cssTransformOrigin(value: string, where: string, pxPer: Readonly<Record<string, number>>): [number, number] {
  const parts = value.trim().split(/\s+/).filter((s) => s !== '');
  const one = (s: string | undefined, axis: 'x' | 'y'): number => {
    if (s === undefined) return 0;
    const low = s.toLowerCase();
    if ((axis === 'x' && low === 'left') || (axis === 'y' && low === 'top') || low === '0') return 0;
    const m = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)([a-z]*)$/i.exec(s);
    const k = m ? (m[2] === '' ? 1 : pxPer[m[2]]) : undefined;
    if (!m || k === undefined) throw new InputError(`${where} style transform-origin`, `expected lengths (e.g. 10px 20px); "${s}" needs a reference box, which drawings for cutting do not have`);
    return Number(m[1]) * k;
  };
  if (parts.length > 3) throw new InputError(`${where} style transform-origin`, `expected at most three values, got ${parts.length}`);
  return [one(parts[0], 'x'), one(parts[1], 'y')];
}
