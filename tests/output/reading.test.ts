/**
 * How a drawing was read, in every output: measure's text and JSON, draw (muted marking and ignored
 * geometry with a key, the unit's source in the title), report, and batch rows. The sample
 * samples/etched-plate-ep7.svg is invented demo data. Reference figures are closed forms:
 * area 160·80 − 4·π·6² − (40·20 − (4 − π)·5²) (rectangle, circles πr², rounded rectangle b·h − (4 − π)r²);
 * marking length 2·(40 + 10) + 25 (a rectangle's perimeter and a straight line).
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli } from '../helpers.js';

const EP7 = join(ROOT, 'samples', 'etched-plate-ep7.svg');
const AREA = 160 * 80 - 4 * Math.PI * 36 - (40 * 20 - (4 - Math.PI) * 25);
const MARKING = 2 * (40 + 10) + 25;
const dir = mkdtempSync(join(tmpdir(), 'pw-reading-'));

describe('the interpretation in every output', () => {
  it('measure text and JSON: counts with reasons, the unit source, the marking length', () => {
    const t = runCli(['measure', EP7]);
    expect(t.status, t.stderr).toBe(0);
    expect(t.stdout).toMatch(/read as \(svg\): 1 outline, 5 cut-outs, 2 marking \(marking-layer 2\), 3 ignored \(text 1, hidden 2\)/);
    expect(t.stdout).toMatch(/length unit mm: stated by the file/);
    const j = runCli(['measure', EP7, '--json']);
    const doc = JSON.parse(j.stdout);
    expect(Math.abs(doc.quantities.area.value - AREA) / AREA).toBeLessThan(1e-13);
    expect(doc.units.lengthSource).toBe('file');
    expect(Math.abs(doc.markingLength - MARKING)).toBeLessThan(1e-9);
    expect(doc.interpretation.cutouts).toBe(5);
    expect(doc.interpretation.ignored).toEqual({ text: 1, hidden: 2 });
  });

  it('an SVG without units says the unit was assumed, in text and JSON', () => {
    const f = join(dir, 'nounits.svg');
    writeFileSync(f, '<svg xmlns="http://www.w3.org/2000/svg" width="160" height="80"><rect width="160" height="80"/></svg>');
    const t = runCli(['measure', f]);
    expect(t.status, t.stderr).toBe(0);
    expect(t.stdout).toMatch(/length unit mm: ASSUMED/);
    expect(t.stdout).toMatch(/warning: the drawing states no length unit/);
    // 160 CSS px = 160 × 25.4 / 96 mm (CSS Values and Units, absolute lengths)
    const doc = JSON.parse(runCli(['measure', f, '--json']).stdout);
    expect(doc.units.lengthSource).toBe('assumed');
    expect(Math.abs(doc.quantities.width.value - 160 * 25.4 / 96)).toBeLessThan(1e-9);
  });

  it('draw shows marking dashed and ignored geometry dotted, with a key, and the unit source in the title', () => {
    const out = join(dir, 'ep7.svg');
    const r = runCli(['draw', EP7, '-o', out]);
    expect(r.status, r.stderr).toBe(0);
    const svg = readFileSync(out, 'utf8');
    expect(svg).toMatch(/data-role="marking" data-count="2"/);
    expect(svg).toMatch(/data-role="ignored" data-count="2"/);
    expect(svg).toMatch(/data-role="reading-key"/);
    expect(svg).toMatch(/lengths in mm \(stated by the file\)/);
    // the plain part file: no muted groups, no key
    const out2 = join(dir, 'bp1.svg');
    expect(runCli(['draw', join(ROOT, 'samples', 'base-plate-bp1.json'), '-o', out2]).status).toBe(0);
    expect(readFileSync(out2, 'utf8')).not.toMatch(/data-role="(marking|ignored|reading-key)"/);
  });

  it('report lists how the drawing was read', () => {
    const out = join(dir, 'ep7.html');
    const r = runCli(['report', EP7, '-o', out]);
    expect(r.status, r.stderr).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toMatch(/<ul data-role="reading"><li>read as \(svg\): 1 outline, 5 cut-outs/);
    expect(html).toMatch(/marking length of this part: 125 mm/);
  });

  it('batch rows carry the unit source and the marking length', () => {
    const m = join(dir, 'job.csv');
    writeFileSync(m, `file,thickness,material\n${EP7},6 mm,steel\n`);
    const r = runCli(['batch', m, '--jsonl']);
    expect(r.status, r.stderr).toBe(0);
    const row = JSON.parse(r.stdout.trim().split('\n')[0]);
    expect(row.unitsFrom).toBe('file');
    expect(Math.abs(row.markingLength - MARKING)).toBeLessThan(1e-9);
    const c = runCli(['batch', m]);
    const [head, first] = c.stdout.trim().split(/\r?\n/);
    const cols = head.split(','), vals = first.split(',');
    expect(vals[cols.indexOf('unitsFrom')]).toBe('file');
    expect(Number(vals[cols.indexOf('markingLength [mm]')])).toBeCloseTo(MARKING, 9);
  });

  it('a DXF outline with a gap over the join tolerance is refused with the place; --join-tolerance joins it and reports the gap', () => {
    // tests/fixtures/dxf/loose-plate.dxf: layer GAPPY has a 1e-5 mm gap (invented, written by ezdxf)
    const dxf = join(ROOT, 'tests', 'fixtures', 'dxf', 'loose-plate.dxf');
    const bad = runCli(['measure', dxf]);
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
    expect(bad.stderr).toMatch(/layer GAPPY.*the contour is open: two ends are 0\.00001 apart near \(310, 100\).*--join-tolerance/);
    const ok = runCli(['measure', dxf, '--join-tolerance', '1e-4']);
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout).toMatch(/joined: 1 gap between loose ends closed \(largest 1e-5 mm/);
    const out = join(dir, 'gappy.svg');
    expect(runCli(['draw', dxf, '--join-tolerance', '1e-4', '--sheet', '-o', out]).status).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/data-role="joined-gaps" data-count="1"/);
  });

  it('loose DXF lines: a stretch drawn twice over is refused naming both entities; an exact duplicate is left out and reported', () => {
    // invented drawings: a 100 × 50 plate of loose LINEs (area b·h = 5000, closed form)
    const dxf = (extra: number[][]) => {
      const L = ['0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES'];
      let h = 0x30;
      for (const [a, b, c, d] of [[0, 0, 100, 0], [100, 0, 100, 50], [100, 50, 0, 50], [0, 50, 0, 0], ...extra]) {
        L.push('0', 'LINE', '5', (h++).toString(16).toUpperCase(), '8', 'CUT', '10', String(a), '20', String(b), '30', '0', '11', String(c), '21', String(d), '31', '0');
      }
      L.push('0', 'ENDSEC', '0', 'EOF', '');
      return L.join('\n');
    };
    const f1 = join(dir, 'retraced.dxf');
    writeFileSync(f1, dxf([[20, 0, 60, 0]]));
    const bad = runCli(['measure', f1]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^platewise: dxf LINE #30 layer CUT \/ dxf LINE #34 layer CUT \(layer CUT\): drawn twice over: these entities retrace each other for 40 near \(40, 0\)/);
    const f2 = join(dir, 'duplicated.dxf');
    writeFileSync(f2, dxf([[100, 0, 100, 50]]));
    const ok = runCli(['measure', f2, '--json']);
    expect(ok.status, ok.stderr).toBe(0);
    const doc = JSON.parse(ok.stdout);
    expect(Math.abs(doc.quantities.area.value - 5000)).toBeLessThan(1e-9);
    expect(doc.interpretation.ignored.duplicate).toBe(1);
    expect(doc.interpretation.joinFindings.map((x: { finding: string }) => x.finding)).toContain('duplicate');
  });
});

describe('axis labels never sit on the drawing\'s lines', () => {
  it('the I1 and I2 labels stand in the margin above every axis line and apart from each other (three samples)', () => {
    // (base-plate-bp1 is square-symmetric: I1 = I2, no axes drawn)
    for (const sample of ['samples/gusset-g2.json', 'samples/etched-plate-ep7.svg', 'samples/lifting-lug-ll4.json']) {
      const out = join(dir, `axes-${sample.replace(/\W/g, '-')}.svg`);
      const r = runCli(['draw', join(ROOT, sample), '-o', out]);
      expect(r.status, r.stderr).toBe(0);
      const svg = readFileSync(out, 'utf8');
      const axisYs = [...svg.matchAll(/<line [^>]*data-axis="I[12]"[^>]*>/g)].flatMap((m) => [/y1="([-\d.]+)"/.exec(m[0])![1], /y2="([-\d.]+)"/.exec(m[0])![1]].map(Number));
      const labels = [...svg.matchAll(/<text [^>]*data-role="(I[12])-label"[^>]*>([^<]*)</g)].map((m) => ({ x: Number(/ x="([-\d.]+)"/.exec(m[0])![1]), y: Number(/ y="([-\d.]+)"/.exec(m[0])![1]), text: m[2] }));
      expect(labels, sample).toHaveLength(2);
      // a 12 px label occupies about [y − 12, y + 3]; every axis line stays below it
      for (const l of labels) expect(l.y + 3, sample).toBeLessThan(Math.min(...axisYs));
      // generous 7.5 px per character for a 12 px bold font: the first label ends before the second begins
      const [a, b] = labels.sort((p, q) => p.x - q.x);
      expect(a.x + 7.5 * a.text.length, sample).toBeLessThan(b.x);
    }
  });

  it('section-mark labels (shear centre, plastic neutral axes, net lines) stand in the key under the part, clear of every drawn line and of each other', () => {
    const cases: [string, string[]][] = [
      ['samples/gusset-g2.json', ['--show', 'shear-centre,plastic-axes', '--net-line', '30,-10 30,100 100,140 100,320']],
      ['samples/lifting-lug-ll4.json', ['--show', 'plastic-axes', '--net-line', '-1000,10 1000,12', '--net-line', '0,-1000 1,1000']],
    ];
    const num = (m: string, k: string) => Number(new RegExp(` ${k}="([-\\d.e]+)"`).exec(m)![1]);
    for (const [sample, args] of cases) {
      const out = join(dir, `marks-${sample.replace(/\W/g, '-')}.svg`);
      const r = runCli(['draw', join(ROOT, sample), ...args, '-o', out]);
      expect(r.status, r.stderr).toBe(0);
      const svg = readFileSync(out, 'utf8');
      const lines = [...svg.matchAll(/<line [^>]*>/g)].map((m) => [num(m[0], 'x1'), num(m[0], 'y1'), num(m[0], 'x2'), num(m[0], 'y2')]);
      expect(svg).toMatch(/data-role="net-run"/);
      expect(svg).toMatch(/data-role="plastic-axis"/);
      const labels = [...svg.matchAll(/<text [^>]*data-role="mark-label"[^>]*>([^<]*)</g)].map((m) => ({ x: num(m[0], 'x'), y: num(m[0], 'y'), n: m[1].length }));
      expect(labels.length, sample).toBeGreaterThanOrEqual(2);
      const width = Number(/<svg [^>]*width="([\d.]+)"/.exec(svg)![1]);
      // an 11 px label occupies about [y − 11, y + 3] and 6.4 px per character (generous)
      const boxes = labels.map((l) => [l.x, l.y - 11, l.x + 6.4 * l.n, l.y + 3]);
      for (const b of boxes) {
        expect(b[2], `${sample}: label inside the drawing`).toBeLessThanOrEqual(width);
        for (const [x1, y1, x2, y2] of lines) {
          // Liang–Barsky: does the segment meet the box?
          let t0 = 0, t1 = 1;
          const dx = x2 - x1, dy = y2 - y1;
          const p = [-dx, dx, -dy, dy], q = [x1 - b[0], b[2] - x1, y1 - b[1], b[3] - y1];
          let meets = true;
          for (let i = 0; i < 4 && meets; i++) {
            if (p[i] === 0) { if (q[i] < 0) meets = false; continue; }
            const t = q[i] / p[i];
            if (p[i] < 0) t0 = Math.max(t0, t); else t1 = Math.min(t1, t);
            if (t0 > t1) meets = false;
          }
          expect(meets, `${sample}: label box ${b.map((v) => v.toFixed(1))} meets line ${[x1, y1, x2, y2].map((v) => v.toFixed(1))}`).toBe(false);
        }
      }
      // below the part and its frame (the material path's lowest point), and apart from each other
      const frameBottom = Math.max(...[...svg.matchAll(/data-role="bounding-box"[\s\S]*?<rect [^>]*>/g)].map((m) => num(/<rect [^>]*>/.exec(m[0])![0], 'y') + num(/<rect [^>]*>/.exec(m[0])![0], 'height')));
      for (const b of boxes) expect(b[1], sample).toBeGreaterThan(frameBottom);
      for (let i = 1; i < boxes.length; i++) expect(boxes[i][1], sample).toBeGreaterThanOrEqual(boxes[i - 1][3]);
    }
  });
});
