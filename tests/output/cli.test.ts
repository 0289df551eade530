/**
 * `platewise draw` and `platewise report` through the built CLI (dist/, made by tsc): files written,
 * several parts, inputs never overwritten, one-line errors, the report's trace, numbers and self-containment.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT, runCli as platewise } from '../helpers.js';
import { parseXml } from '../../src/read/xml.js';
import { formatValue } from '../../src/output/numbers.js';

const dir = mkdtempSync(join(tmpdir(), 'platewise-report-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));


// Invented test data: two separate plates in one SVG drawing (user units taken as mm).
const TWO_PARTS = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 300 100">
  <rect x="0" y="0" width="100" height="60"/><circle cx="50" cy="30" r="10"/>
  <rect x="150" y="0" width="120" height="80"/><circle cx="180" cy="40" r="8"/><circle cx="240" cy="40" r="8"/>
</svg>`;

describe('platewise draw', () => {
  it('prints one SVG to standard output without -o', () => {
    const r = platewise(['draw', 'samples/base-plate-bp1.json']);
    expect(r.status, r.stderr).toBe(0);
    const root = parseXml(r.stdout, {}, 'stdout');
    expect(root.name).toBe('svg');
  });

  it('writes name-1.svg, name-2.svg for a file with two parts, and one sheet with --sheet', () => {
    const src = join(dir, 'two.svg');
    writeFileSync(src, TWO_PARTS);
    const out = join(dir, 'drawing.svg');
    const r = platewise(['draw', src, '--units', 'mm', '-o', out]);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toBe('');
    const cut = (f: string) => (readFileSync(f, 'utf8').match(/data-loop="cutout"/g) ?? []).length;
    expect(cut(join(dir, 'drawing-1.svg')) + cut(join(dir, 'drawing-2.svg'))).toBe(3);
    expect(existsSync(out)).toBe(false);
    const sheet = join(dir, 'sheet.svg');
    expect(platewise(['draw', src, '--units', 'mm', '--sheet', '-o', sheet]).status).toBe(0);
    expect((readFileSync(sheet, 'utf8').match(/data-role="part-drawing"/g) ?? []).length).toBe(2);
  });

  it('never writes over its input (exit 2, one line, input unchanged)', () => {
    const src = join(dir, 'keep.svg');
    writeFileSync(src, TWO_PARTS.replace(/<rect x="150"[\s\S]*?\/>\s*<circle cx="180"[^>]*\/>\s*<circle cx="240"[^>]*\/>/, ''));
    const before = readFileSync(src, 'utf8');
    const r = platewise(['draw', src, '--units', 'mm', '-o', src]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^platewise: .*input/);
    expect(readFileSync(src, 'utf8')).toBe(before);
  });

  it('a bad --shade expression is a located one-line error and nothing is written', () => {
    const out = join(dir, 'bad.svg');
    const r = platewise(['draw', 'samples/base-plate-bp1.json', '--shade', '2*', '-o', out]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^platewise: --shade/);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(out)).toBe(false);
  });
});

describe('platewise draw --shade thickness', () => {
  it('shades by the part file\'s own thickness field; values lie in its range over the part', () => {
    // invented test plate: 200 × 100 mm, thickness 20 − 0.05·x mm, so 10 ≤ t ≤ 20 on the plate
    const src = join(dir, 'tapered.json');
    writeFileSync(src, JSON.stringify({ part: 'tapered', units: 'mm', thickness: '20 - 0.05*x', density: 7850, outline: { rectangle: { corner: [0, 0], size: [200, 100] } } }));
    const r = platewise(['draw', src, '--shade', 'thickness']);
    expect(r.status, r.stderr).toBe(0);
    const values = [...r.stdout.matchAll(/<path d="[^"]*"[^>]*data-value="([^"]+)"/g)].map((m) => Number(m[1]));
    expect(values.length).toBeGreaterThan(0);
    for (const v of values) { expect(v).toBeGreaterThan(10); expect(v).toBeLessThan(20); }
    expect(r.stdout).toContain('thickness = 20 - 0.05*x mm');
    const bad = platewise(['draw', 'samples/bracket.svg', '--shade', 'thickness']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^platewise: --shade: .*part JSON/);
  });
});

describe('platewise report', () => {
  const out = join(dir, 'bp1.html');
  const run = platewise(['report', 'samples/base-plate-bp1.json', '-o', out]);
  const html = run.status === 0 ? readFileSync(out, 'utf8') : '';

  it('writes one HTML file', () => {
    expect(run.status, run.stderr).toBe(0);
    expect(html.startsWith('<!doctype html>')).toBe(true);
  });

  it('each table value and estimate is the very number measure --json prints', () => {
    const json = JSON.parse(platewise(['measure', 'samples/base-plate-bp1.json', '--json']).stdout);
    const table = html.slice(html.indexOf('<table data-role="quantities">'), html.indexOf('</table>', html.indexOf('<table data-role="quantities">')));
    const rows = [...table.matchAll(/<tr data-key="([^"]+)">.*?data-value="([^"]+)".*?data-error="([^"]+)"/g)];
    const keys = Object.keys(json.quantities);
    expect(rows.map((m) => m[1])).toEqual(keys);
    for (const [, key, v, e] of rows) {
      expect(Number(v), key).toBe(json.quantities[key].value);
      expect(Number(e), key).toBe(json.quantities[key].error);
    }
  });

  it('traces its input: SHA-256 of the bytes (node:crypto as reference), version, ISO date', () => {
    const sha = createHash('sha256').update(readFileSync(join(ROOT, 'samples/base-plate-bp1.json'))).digest('hex');
    expect(html).toContain(`<code data-role="sha256">${sha}</code>`);
    expect(html).toContain('samples/base-plate-bp1.json');
    const version = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).version;
    expect(html).toContain(`<span data-role="version">${version}</span>`);
    const date = /datetime="([^"]+)"/.exec(html)![1];
    expect(new Date(date).toISOString()).toBe(date);
  });

  it('is self-contained: no scripts, links, imports or remote URLs', () => {
    expect(html).not.toMatch(/<script|<link|<img|@import|url\(|<iframe|<object/i);
    const urls = [...html.matchAll(/https?:\/\/[^\s"')<]+/g)].map((m) => m[0]);
    // only XML namespace names, which are identifiers and never fetched
    for (const u of urls) expect(['http://www.w3.org/2000/svg', 'http://www.w3.org/1999/xlink']).toContain(u);
  });

  it('has the parts a reader needs: drawing with origin, method, convergence note (exact boundary result), fabrication, cautions, print rules', () => {
    expect(html).toContain('data-role="drawing"');
    expect(html).toContain('data-role="origin"');
    expect(html).toContain('data-role="method"');
    expect(html).not.toContain('data-role="convergence"');
    expect(html).toMatch(/data-role="convergence-note">No convergence to show: the values come from exact boundary integrals/);
    expect(html).toMatch(/<table data-role="fabrication">.*<tr data-key="cutLength">/s);
    expect(html).toMatch(/<tr data-key="pierces">.*?data-value="6"/);
    expect(html).toContain('Caution: these are geometric properties');
    expect(html).toMatch(/@page \{ size: auto; margin:/);
    expect(html).toContain('data-role="mass-missing"');
  });

  it('shows mass when the part gives thickness and density: m = ρ·t·A (common practice, no source)', () => {
    // invented test plate: 1000 × 500 mm, 10 mm thick, 7850 kg/m³ → 7850 × 1 × 0.5 × 0.01 = 39.25 kg
    const src = join(dir, 'heavy.json');
    writeFileSync(src, JSON.stringify({ part: 'test plate', units: 'mm', thickness: 10, density: 7850, outline: { rectangle: { corner: [0, 0], size: [1000, 500] } } }));
    const o = join(dir, 'heavy.html');
    const r = platewise(['report', src, '-o', o]);
    expect(r.status, r.stderr).toBe(0);
    const h = readFileSync(o, 'utf8');
    const m = /<tr data-key="mass">.*?data-value="([^"]+)"/.exec(h);
    expect(m).not.toBeNull();
    expect(Math.abs(Number(m![1]) - 39.25) / 39.25).toBeLessThan(1e-12);
    expect(h).toContain('Caution: masses and centres of gravity');
  });
});

describe('markup in names', () => {
  it('a part name with markup is shown as text, never run (HTML and SVG escaping)', () => {
    const src = join(dir, 'markup.json');
    writeFileSync(src, JSON.stringify({ part: 'x"><script>alert(1)</script> & co', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [20, 10] } } }));
    const o = join(dir, 'markup.html');
    expect(platewise(['report', src, '-o', o]).status).toBe(0);
    const h = readFileSync(o, 'utf8');
    expect(h).not.toMatch(/<script/i);
    expect(h).toContain('x&quot;&gt;&lt;script&gt;alert(1)&lt;/script&gt; &amp; co');
    const svg = platewise(['draw', src]).stdout;
    expect(parseXml(svg, {}, 'drawing').name).toBe('svg');
    expect(svg).not.toMatch(/<script/i);
  });
});

describe('report settings carry their units', () => {
  it('a bare thickness is in the part\'s unit, a bare density in kg/m³, an expression says its unit', async () => {
    const { settingText } = await import('../../src/output/html.js');
    expect(settingText('thickness', '10', 'mm')).toBe('thickness 10 mm');
    expect(settingText('thickness', '3/8 in', 'mm')).toBe('thickness 3/8 in');
    expect(settingText('density', '7850', 'in')).toBe('density 7850 kg/m³');
    expect(settingText('thickness', '10 + x/100', 'mm')).toBe('thickness 10 + x/100 (mm)');
    expect(settingText('levels', '3', 'mm')).toBe('3 refinement levels');
    const o = join(dir, 'settings.html');
    expect(platewise(['report', 'samples/gusset-g2.json', '--thickness', '10', '--density', '7850', '-o', o]).status).toBe(0);
    expect(readFileSync(o, 'utf8')).toMatch(/<dt>settings<\/dt><dd>thickness 10 mm, density 7850 kg\/m³<\/dd>/);
  });
  it('a constant plate\'s mass comes from the boundary, and the method line says so (no "degree 0, 0 triangles")', () => {
    const h = readFileSync(join(dir, 'settings.html'), 'utf8');
    expect(h).toMatch(/Mass method: thickness and density constant or polynomials in x and y, so exact boundary integrals/);
    expect(h).not.toMatch(/Dunavant degree 0, 0 triangles/);
  });
});

describe('the report shows values rounded to their estimates (tests/output/rounding.test.ts has the rule)', () => {
  it('each value cell shows the rounded value and keeps the full one in data-value; the rule is stated once', () => {
    const o = join(dir, 'rounded.html');
    expect(platewise(['report', 'samples/gusset-g2.json', '-o', o]).status).toBe(0);
    const h = readFileSync(o, 'utf8');
    const json = JSON.parse(platewise(['measure', 'samples/gusset-g2.json', '--json']).stdout);
    for (const [key, q] of Object.entries(json.quantities) as [string, { value: number; error: number }][]) {
      const m = new RegExp(`<tr data-key="${key}">.*?data-value="([^"]+)">([^<]*)<`).exec(h);
      expect(m, key).not.toBeNull();
      expect(Number(m![1]), key).toBe(q.value);
      expect(m![2], key).toBe(formatValue(q.value, q.error));
    }
    expect(h.split('data-role="rounding-rule"').length - 1).toBe(1);
  });
});

describe('section marks on draw and report (--show, --net-line)', () => {
  // invented splice plate, symmetric about y = 100: the shear centre lies on that axis (symmetry, common practice)
  const plate = join(dir, 'marks-plate.json');
  writeFileSync(plate, JSON.stringify({
    part: 'splice (invented)', units: 'mm', thickness: 10, outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
    cutouts: [[100, 40], [100, 160], [160, 100]].map((center) => ({ circle: { center, diameter: 22 } })),
  }));

  it('draw marks the shear centre where member puts it, the plastic axes and the net runs; report carries the same key', () => {
    const svgFile = join(dir, 'marks.svg');
    const d = platewise(['draw', plate, '--show', 'shear-centre,plastic-axes', '--net-line', '100,-10 100,210', '-o', svgFile]);
    expect(d.status, d.stderr).toBe(0);
    const svg = readFileSync(svgFile, 'utf8');
    const m = platewise(['member', plate, '--json']);
    const t = JSON.parse(m.stdout).parts[0].torsion;
    const sc = /data-role="shear-centre" data-x="([-\d.e]+)" data-y="([-\d.e]+)"/.exec(svg)!;
    expect(Math.abs(Number(sc[1]) - t.shearCentreX.value)).toBeLessThanOrEqual(1e-9 * 300);
    expect(Math.abs(Number(sc[2]) - 100)).toBeLessThanOrEqual(t.shearCentreY.error);
    expect([...svg.matchAll(/data-role="plastic-axis"/g)]).toHaveLength(2); // principal axes along x and y: no turned pair
    expect([...svg.matchAll(/data-role="net-run"/g)]).toHaveLength(3);
    const html = join(dir, 'marks.html');
    const r = platewise(['report', plate, '--show', 'plastic-axes', '--net-line', '100,-10 100,210', '-o', html]);
    expect(r.status, r.stderr).toBe(0);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain('Net sections are geometry only');
    expect(page).toMatch(/data-role="mark-label"[^>]*>net line 1 \(thick where material\): net 156 ± [^ ]+ of gross 200 mm, net area 1560 ±/);
  });

  it('refuses an unknown mark or a line that misses the part: exit 2, one line, nothing written', () => {
    const out = join(dir, 'never.svg');
    for (const [args, re] of [[['--show', 'centroid'], /^platewise: --show: unknown mark "centroid"/], [['--net-line', '500,0 600,0'], /^platewise: --net-line: the line .* misses the part/]] as const) {
      const r = platewise(['draw', plate, ...args, '-o', out]);
      expect(r.status).toBe(2);
      expect(r.stderr).toMatch(re);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(existsSync(out)).toBe(false);
    }
  });
});
