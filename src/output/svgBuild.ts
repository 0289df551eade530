/**
 * A small SVG element builder: the few element kinds our drawings use, attributes in the order they are
 * set, serialised as SVG text. It replaces svg.js on a server-side DOM (svgdom), which declared Node ≥ 22.13
 * and made every install on Node 20 warn (EBADENGINE); it writes the same text those did for our drawings
 * (every sample drawing and report compared byte for byte when it went in).
 */

type Value = string | number;

function escapeAttr(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

const escapeText = escapeAttr;

export class SvgEl {
  private readonly attrs = new Map<string, string>();
  private readonly children: (SvgEl | string)[] = [];
  constructor(readonly name: string) {}

  /** Set attributes (numbers written as String(n), the shortest round-trip text). */
  attr(a: Record<string, Value>): this {
    for (const [k, v] of Object.entries(a)) this.attrs.set(k, String(v));
    return this;
  }

  /** The value of an attribute, or undefined. */
  get(name: string): string | undefined {
    return this.attrs.get(name);
  }

  element(name: string): SvgEl {
    const e = new SvgEl(name);
    this.children.push(e);
    return e;
  }

  /** Replace the content with a text. */
  words(text: string): this {
    this.children.length = 0;
    this.children.push(text);
    return this;
  }

  group(): SvgEl { return this.element('g'); }
  rect(width: Value, height: Value): SvgEl { return this.element('rect').attr({ width, height }); }
  /** Top-left corner of a rectangle. */
  move(x: number, y: number): this { return this.attr({ x, y }); }
  /** A circle of the given diameter; place it with center(). */
  circle(diameter: number): SvgEl { return this.element('circle').attr({ r: diameter / 2 }); }
  center(x: number, y: number): this { return this.attr({ cx: x, cy: y }); }
  line(x1: number, y1: number, x2: number, y2: number): SvgEl { return this.element('line').attr({ x1, y1, x2, y2 }); }
  path(d: string): SvgEl { return this.element('path').attr({ d }); }
  /** A text element holding `text` as it is. */
  plain(text: string): SvgEl { return this.element('text').words(text); }

  /** Serialise this element and its content. */
  svg(): string {
    let s = `<${this.name}`;
    for (const [k, v] of this.attrs) s += ` ${k}="${escapeAttr(v)}"`;
    s += '>';
    for (const c of this.children) s += typeof c === 'string' ? escapeText(c) : c.svg();
    return `${s}</${this.name}>`;
  }
}

/** A root <svg> element with the SVG and XLink namespaces. */
export function svgRoot(): SvgEl {
  return new SvgEl('svg').attr({ xmlns: 'http://www.w3.org/2000/svg', 'xmlns:xlink': 'http://www.w3.org/1999/xlink', version: '1.1' });
}
