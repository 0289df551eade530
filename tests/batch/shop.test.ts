/**
 * Batch for quoting (issue 17): rows in job order, units in the CSV headings, totals per material and
 * thickness, the manifest's note and the warnings in the rows, line totals, spreadsheet-locale CSV and shop
 * rates. Every number is checked against an independent figure written out here: closed forms of invented
 * rectangles with round holes (A = w·h − k·π·d²/4, cut length = 2(w + h) + k·π·d, pierces = k + 1: common
 * practice, no source), densities steel 7850 kg/m³ (EN 1993-1-1:2005, 3.2.6) and aluminium 2700 kg/m³
 * (EN 1999-1-1:2007, 3.2.5), 1 in = 25.4 mm exactly (NIST SP 811, appendix B), and cost arithmetic done
 * by hand in the comments.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CLI, runCli } from '../helpers.js';
import { parseCsvRecords } from '../../src/base/csv.js';
import { InJobOrder } from '../../src/batch/order.js';
import { parseRates } from '../../src/batch/rates.js';

const dir = mkdtempSync(join(tmpdir(), 'pw-shop-'));
const cli = (args: string[]) => runCli(args, undefined, { cwd: dir });

/** A rectangle w × h (mm unless `units`) with k round holes of diameter d on its mid-line (invented). */
function plate(name: string, w: number, h: number, k: number, d: number, units = 'mm'): { area: number; cut: number; pierces: number } {
  const cutouts = Array.from({ length: k }, (_, j) => ({ circle: { center: [(w / (k + 1)) * (j + 1), h / 2], diameter: d } }));
  writeFileSync(join(dir, name), JSON.stringify({ part: `${name} (invented)`, units, outline: { rectangle: { corner: [0, 0], size: [w, h] } }, cutouts }));
  return { area: w * h - (k * Math.PI * d * d) / 4, cut: 2 * (w + h) + k * Math.PI * d, pierces: k + 1 };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('rows in job order', () => {
  it('InJobOrder: jobs delivered 2, 0, 3, 1 come out 0, 1, 2, 3; flush hands on the held ones in order, skipping gaps', () => {
    const out: number[] = [];
    const o = new InJobOrder<string>((_, k) => out.push(k));
    o.put(2, 'c');
    expect(out).toEqual([]);
    o.put(0, 'a');
    expect(out).toEqual([0]);
    o.put(3, 'd');
    expect(o.waiting).toBe(2);
    o.put(1, 'b');
    expect(out).toEqual([0, 1, 2, 3]);
    const cut: number[] = [];
    const p = new InJobOrder<string>((_, k) => cut.push(k));
    p.put(4, 'e');
    p.put(1, 'b');
    p.put(0, 'a');
    p.flush(); // an interruption: 2 and 3 never finished
    expect(cut).toEqual([0, 1, 4]);
    expect(() => p.put(1, 'again')).toThrow(/twice/);
  });

  it('a slow first row (a plate with 400 holes) and quick ones on 2 workers: written in manifest order', () => {
    const holes = Array.from({ length: 400 }, (_, j) => ({ circle: { center: [10 + (j % 40) * 20, 10 + Math.floor(j / 40) * 20], diameter: 8 } }));
    writeFileSync(join(dir, 'slow.json'), JSON.stringify({ part: 'slow (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [800, 200] } }, cutouts: holes }));
    const names = Array.from({ length: 12 }, (_, i) => { plate(`q${i}.json`, 50 + i, 40, 1, 10); return `q${i}.json`; });
    writeFileSync(join(dir, 'order.csv'), ['file,quantity', 'slow.json,1', ...names.map((n) => `${n},1`)].join('\n') + '\n');
    const r = cli(['batch', 'order.csv', '--jobs', '2', '--levels', '2', '--quiet']);
    expect(r.status, r.stderr).toBe(0);
    const recs = parseCsvRecords(r.stdout, 'out').records;
    expect(recs.map((x) => x.file)).toEqual(['slow.json', ...names]);
    expect(recs.map((x) => Number(x.row))).toEqual(recs.map((_, i) => i + 1));
  });
});

describe('interrupted with 2 workers', () => {
  it('SIGINT: exit 130, every written row whole, row numbers ascending, as many rows as the summary says', async () => {
    const sub = mkdtempSync(join(dir, 'int-'));
    writeFileSync(join(sub, 'p.json'), JSON.stringify({ part: 'p (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [100, 60] } }, cutouts: [{ circle: { center: [50, 30], diameter: 10 } }] }));
    const holes = Array.from({ length: 300 }, (_, j) => ({ circle: { center: [10 + (j % 30) * 20, 10 + Math.floor(j / 30) * 20], diameter: 8 } }));
    writeFileSync(join(sub, 'big.json'), JSON.stringify({ part: 'big (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [600, 200] } }, cutouts: holes }));
    // every 25th row is a slower part, so rows finish out of order and some wait behind it
    writeFileSync(join(sub, 'job.csv'), ['file,quantity', ...Array.from({ length: 3000 }, (_, i) => `${i % 25 === 0 ? 'big' : 'p'}.json,1`)].join('\n') + '\n');
    const status = await new Promise<number | null>((done) => {
      const c = spawn(process.execPath, [CLI, 'batch', 'job.csv', '-o', 'out.csv', '--quiet', '--jobs', '2', '--levels', '2'], { cwd: sub });
      let sent = false;
      // signal once rows are on disk (the temporary file has grown): a state, not a time
      const poll = setInterval(() => {
        const tmp = readdirSync(sub).find((f) => f.endsWith('.tmp'));
        if (!sent && tmp && readFileSync(join(sub, tmp), 'utf8').split('\n').length > 60) { sent = true; c.kill('SIGINT'); }
      }, 20);
      const t = setTimeout(() => c.kill('SIGKILL'), 180000);
      c.on('close', (code) => { clearInterval(poll); clearTimeout(t); done(code); });
    });
    expect(status).toBe(130);
    const t = parseCsvRecords(readFileSync(join(sub, 'out.csv'), 'utf8'), 'out'); // a torn row would not parse with the header's width
    const ids = t.records.map((r) => Number(r.row));
    expect(ids).toEqual([...ids].sort((a, b) => a - b));
    expect(new Set(ids).size).toBe(ids.length);
    const s = JSON.parse(readFileSync(join(sub, 'out.summary.json'), 'utf8')).summary;
    expect(s.complete).toBe(false);
    expect(s.interrupted.rowsFinished).toBe(ids.length);
    expect(s.parts).toBe(ids.length);
  }, 200000);
});

describe('units in the headings, line totals, notes and warnings', () => {
  // a: 200 × 100 mm, one Ø20 hole; b: 4 × 2 in, no hole (lengths converted to mm in the CSV)
  const a = plate('a.json', 200, 100, 1, 20);
  plate('b.json', 4, 2, 0, 0, 'in');
  writeFileSync(join(dir, 'units.csv'), [
    'file,quantity,material,thickness [mm],density,note',
    'a.json,5,steel,10,,"order 4711, painted"',
    'b.json,3,,6,7.85,=cmd|evil', // 7.85 kg/m³: a density written in g/cm³ by mistake, plausibility warning
  ].join('\n') + '\n');
  const r = cli(['batch', 'units.csv', '--quiet']);
  const recs = parseCsvRecords(r.stdout, 'out').records;

  it('every numeric heading carries its unit in brackets; an inch part\'s lengths are in mm', () => {
    expect(r.status, r.stderr).toBe(0);
    const head = r.stdout.split('\r\n')[0].split(',');
    for (const h of ['thickness [mm]', 'density [kg/m3]', 'area [mm2]', 'Ix [mm4]', 'principalAngle [deg]', 'cutLength [mm]', 'netMass [kg]', 'lineMass [kg]', 'lineCutLength [mm]']) expect(head).toContain(h);
    const b = recs[1];
    expect(b.drawingUnit).toBe('in');
    // 4 × 2 in = 8 in² = 8 · 645.16 mm² = 5161.28 mm² (1 in = 25.4 mm exactly)
    expect(rel(Number(b['area [mm2]']), 5161.28)).toBeLessThan(1e-14);
    // Ix of a 4 × 2 in rectangle: b·h³/12 = 4·8/12 in⁴ = 8/3 in⁴, × 25.4⁴ mm⁴ per in⁴ (handbook closed form, from memory)
    expect(rel(Number(b['Ix [mm4]']), (8 / 3) * 25.4 ** 4)).toBeLessThan(1e-12);
    expect(rel(Number(b['cutLength [mm]']), 12 * 25.4)).toBeLessThan(1e-14);
    expect(Number(b['thickness [mm]'])).toBe(6);
  });

  it('line totals are quantity × value (closed forms re-multiplied here)', () => {
    const x = recs[0];
    expect(rel(Number(x['lineArea [mm2]']), 5 * a.area)).toBeLessThan(1e-12);
    expect(rel(Number(x['lineCutLength [mm]']), 5 * a.cut)).toBeLessThan(1e-12);
    expect(Number(x.linePierces)).toBe(5 * a.pierces);
    // 5 × A · 10 mm · 7850 kg/m³
    expect(rel(Number(x['lineMass [kg]']), 5 * a.area * 10 * 7850e-9)).toBeLessThan(1e-12);
    // blank = the 200 × 100 rectangle: 5 × 0.2 · 0.1 · 0.01 m³ · 7850 = 7.85 kg
    expect(rel(Number(x['lineBlankMass [kg]']), 7.85)).toBeLessThan(1e-12);
  });

  it('the note reaches the row (text neutralised in CSV, exact in JSON Lines); the warning is worded in the row', () => {
    expect(recs[0].note).toBe('order 4711, painted');
    expect(recs[1].note).toBe("'=cmd|evil");
    expect(recs[1].warnings).toMatch(/density/);
    expect(recs[0].warnings).toBe('');
    const j = cli(['batch', 'units.csv', '--jsonl', '--quiet']);
    const lines = j.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines[1].note).toBe('=cmd|evil');
    expect(lines[0].lineTotals.pierces).toBe(10);
    expect(lines[1].warnings[0].code).toBe('density-implausible');
  });
});

describe('totals per material and thickness', () => {
  // invented job: steel 10 mm (two lines), steel 6 mm, aluminium 6 mm, one part with no material
  const p = [plate('t1.json', 300, 200, 2, 18), plate('t2.json', 150, 150, 1, 22), plate('t3.json', 400, 100, 3, 14), plate('t4.json', 250, 120, 0, 0), plate('t5.json', 90, 90, 1, 30)];
  const lines = [
    { f: 't1.json', q: 4, m: 'steel', t: 10, rho: 7850 },
    { f: 't2.json', q: 7, m: 'S355J2+N', t: 10, rho: 7850 },
    { f: 't3.json', q: 2, m: 'steel', t: 6, rho: 7850 },
    { f: 't4.json', q: 3, m: 'aluminium', t: 6, rho: 2700 },
    { f: 't5.json', q: 9, m: '', t: 0, rho: 0 },
  ];
  writeFileSync(join(dir, 'groups.csv'), ['file,quantity,material,thickness [mm]', ...lines.map((l) => `${l.f},${l.q},${l.m},${l.t || ''}`)].join('\n') + '\n');
  const r = cli(['batch', 'groups.csv', '-o', 'groups-out.csv']);
  const s = JSON.parse(readFileSync(join(dir, 'groups-out.summary.json'), 'utf8')).summary;
  // re-summed by hand from the closed forms
  const sum = (pick: (l: (typeof lines)[number], k: number) => boolean, f: (l: (typeof lines)[number], k: number) => number) => lines.reduce((acc, l, k) => acc + (pick(l, k) ? f(l, k) : 0), 0);
  const massOf = (l: (typeof lines)[number], k: number) => l.q * p[k].area * l.t * l.rho * 1e-9;

  it('groups: steel 10 mm (steel and S355J2+N together), steel 6 mm, aluminium 6 mm, no material', () => {
    expect(r.status, r.stderr).toBe(0);
    const g = s.byMaterialAndThickness.map((x: { material: string | null; thicknessMm: number | null }) => [x.material, x.thicknessMm]);
    expect(g).toEqual([['steel', 10], ['steel', 6], ['aluminium', 6], [null, null]]);
    const steel10 = s.byMaterialAndThickness[0];
    expect(steel10.pieces).toBe(11);
    expect(rel(steel10.netMassKg, sum((l) => l.m !== 'aluminium' && l.t === 10, massOf))).toBeLessThan(1e-12);
    expect(rel(steel10.cutLengthM, (4 * p[0].cut + 7 * p[1].cut) / 1000)).toBeLessThan(1e-12);
    expect(steel10.pierces).toBe(4 * 3 + 7 * 2);
    const alu = s.byMaterialAndThickness[2];
    expect(rel(alu.netMassKg, 3 * 250 * 120 * 6 * 2700e-9)).toBeLessThan(1e-12);
    const none = s.byMaterialAndThickness[3];
    expect(none.partsWithoutMass).toBe(1);
    expect(none.netMassKg).toBe(0);
    expect(rel(none.areaM2, (9 * p[4].area) / 1e6)).toBeLessThan(1e-12);
  });

  it('the grand total equals the hand sum and the sum of the groups; the text shows the table and the total', () => {
    const all = sum(() => true, massOf);
    expect(rel(s.netMassKg, all)).toBeLessThan(1e-12);
    const groups = s.byMaterialAndThickness.reduce((a: number, g: { netMassKg: number }) => a + g.netMassKg, 0);
    expect(rel(groups, all)).toBeLessThan(1e-12);
    expect(s.pierces).toBe(sum(() => true, (l, k) => l.q * p[k].pierces));
    expect(r.stderr).toMatch(/totals by material and thickness \(× quantity\):\n {2}material +thickness +pieces/);
    expect(r.stderr).toMatch(/\n {2}steel +10 mm +11 /);
    expect(r.stderr).toMatch(/\n {2}aluminium +6 mm +3 /);
    expect(r.stderr).toMatch(/\n {2}no material +— +9 +— +— /);
    for (const l of r.stderr.split('\n')) expect(l.length, l).toBeLessThanOrEqual(100);
  });
});

describe('spreadsheet-locale CSV: --decimal-comma', () => {
  plate('dc.json', 120, 80, 1, 20);
  writeFileSync(join(dir, 'dc.csv'), 'file;quantity;material;thickness;note\ndc.json;2;steel;1,5 mm;"semicolon; inside"\n');
  writeFileSync(join(dir, 'dc-point.csv'), 'file,quantity,material,thickness\ndc.json,2,steel,1.5 mm\n');

  it('reads a semicolon manifest with a decimal comma and writes semicolons and decimal commas, the same numbers', () => {
    const r = cli(['batch', 'dc.csv', '--decimal-comma', '--quiet']);
    expect(r.status, r.stderr).toBe(0);
    const semi = parseCsvRecords(r.stdout, 'out', { separator: ';' }).records[0];
    const plain = parseCsvRecords(cli(['batch', 'dc-point.csv', '--quiet']).stdout, 'out').records[0];
    expect(semi.note).toBe('semicolon; inside');
    expect(semi['thickness [mm]']).toBe('1,5');
    for (const k of ['area [mm2]', 'netMass [kg]', 'cutLength [mm]', 'lineMass [kg]']) {
      expect(semi[k]).toContain(',');
      expect(Number(semi[k].replace(',', '.'))).toBe(Number(plain[k]));
    }
  });

  it('a decimal point in a decimal-comma manifest is refused (it could be a thousands separator); each dialect hints at the other', () => {
    writeFileSync(join(dir, 'dc-bad.csv'), 'file;quantity;thickness\ndc.json;1;1.500 mm\n');
    const bad = cli(['batch', 'dc-bad.csv', '--decimal-comma']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^platewise: dc-bad\.csv:line 2, column 11: "1\.500 mm" has a decimal point; in semicolon CSV numbers take a decimal comma/);
    const hint = cli(['batch', 'dc.csv']);
    expect(hint.status).toBe(2);
    expect(hint.stderr).toMatch(/separated by semicolons.*or add --decimal-comma to read semicolons and decimal commas\n$/);
    const other = cli(['batch', 'dc-point.csv', '--decimal-comma']);
    expect(other.status).toBe(2);
    expect(other.stderr).toMatch(/separated by commas, but semicolons with decimal commas were asked for; --decimal-comma applies to the manifest and the rates file alike/);
    expect(cli(['batch', 'dc.csv', '--decimal-comma', '--jsonl']).status).toBe(2);
    const rates = cli(['batch', 'dc.csv', '--decimal-comma', '--rates', 'rates.csv']); // rates.csv has commas (below)
    expect(rates.status).toBe(2);
    expect(rates.stderr).toBe('platewise: rates.csv:line 1: the columns are separated by commas, but semicolons with decimal commas were asked for; --decimal-comma applies to the manifest and the rates file alike; leave it out for comma-separated CSV\n');
  });
});

describe('shop rates', () => {
  // r1: 200 × 100 mm, one Ø20 hole, 10 mm steel, 5 pieces; r2: 8 mm steel (no rate in the file)
  plate('r1.json', 200, 100, 1, 20);
  plate('r2.json', 100, 50, 0, 0);
  writeFileSync(join(dir, 'quote.csv'), 'file,quantity,material,thickness [mm]\nr1.json,5,steel,10\nr2.json,2,steel,8\n');
  const RATES = 'material,thickness [mm],cuttingSpeed [m/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min],note\n' +
    'S235,10,2,3,60,2,6,invented\naluminium,6,4,1,80,5,5,invented\n';
  writeFileSync(join(dir, 'rates.csv'), RATES);

  it('cost per part and per line against a hand calculation; the part without a rate says so and stays out of the total', () => {
    const r = cli(['batch', 'quote.csv', '--rates', 'rates.csv', '-o', 'quote-out.csv']);
    expect(r.status, r.stderr).toBe(0);
    const recs = parseCsvRecords(readFileSync(join(dir, 'quote-out.csv'), 'utf8'), 'out').records;
    // by hand: cut length 600 + 20π = 662.8318531 mm at 2 m/min = 2000 mm/min → 0.3314159265 min;
    // 2 pierces × 3 s = 6 s = 0.1 min; one part 0.4314159265 min.
    // machine 0.4314159265/60 h × 60 EUR/h = 0.4314159265 EUR; blank 0.2 × 0.1 × 0.01 m³ × 7850 = 1.57 kg × 2 EUR/kg = 3.14 EUR;
    // part 3.5714159265 EUR; line: 5 × 3.5714159265 + 6 min/60 × 60 EUR/h = 17.8570796327 + 6 = 23.8570796327 EUR;
    // line time 5 × 0.4314159265 + 6 = 8.1570796327 min
    expect(recs[0].rate).toBe('rates.csv:line 2');
    expect(Number(recs[0]['cutTime [min]'])).toBeCloseTo(0.4314159265, 9);
    expect(Number(recs[0]['partCost [EUR]'])).toBeCloseTo(3.5714159265, 9);
    expect(Number(recs[0]['lineTime [min]'])).toBeCloseTo(8.1570796327, 9);
    expect(Number(recs[0]['lineCost [EUR]'])).toBeCloseTo(23.8570796327, 9);
    expect(recs[1]['lineCost [EUR]']).toBe('');
    expect(recs[1].warnings).toBe('no cost: the rates file has no row for steel 8 mm');
    const s = JSON.parse(readFileSync(join(dir, 'quote-out.summary.json'), 'utf8')).summary;
    expect(s.rates.currency).toBe('EUR');
    expect(s.rates.totalCost).toBeCloseTo(23.8570796327, 9);
    expect(s.rates.partsNotPriced).toBe(1);
    expect(s.rates.assumptions.join(' ')).toMatch(/kerf/);
    expect(r.stderr).toMatch(/cost under the shop rates of rates\.csv \(EUR; the tool computes, the shop decides\):/);
    expect(r.stderr).toMatch(/\n {2}all +1 +2\.2 +6\.0 +2\.16 +15\.70 +6\.00 +23\.86\n/);
    expect(r.stderr).toMatch(/1 measured part not priced/);
    for (const l of r.stderr.split('\n')) expect(l.length, l).toBeLessThanOrEqual(100);
  });

  it('bad rates files: one line naming the file, line and column, exit 2, nothing written', () => {
    const cases: [string, RegExp][] = [
      ['material,thickness,cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nsteel,10,1,1,1,1,1\n', /r\.csv:line 1, column 10: column "thickness" needs its unit in brackets, such as "thickness \[mm\]"/],
      ['material,thickness [mm],cuttingSped [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\n', /column 25: unknown column "cuttingSped \[mm\/min\]"; did you mean "cuttingSpeed"\?/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [USD/kg],setupTime [min]\nsteel,10,1,1,1,1,1\n', /column "materialPrice \[USD\/kg\]" is in USD, but column "machineRate \[EUR\/h\]" is in EUR/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nsteel,10,0,1,1,1,1\n', /r\.csv:line 2, column 10: expected cuttingSpeed more than zero, got 0/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nsteel,10,1e-300,1,1,1,1\n', /line 2, column 10: a cutting speed of 1e-300 mm\/min is below 0.001 mm\/min/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nsteel,10,1 m/min,1,1,1,1\n', /line 2, column 10: expected a plain number for cuttingSpeed \(the unit is in the heading/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nunobtainium,10,1,1,1,1,1\n', /r\.csv:line 2, column 1: .*unobtainium/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min]\nsteel,10,1,1,1,1,1\ns355,10,2,2,2,2,2\n', /r\.csv:line 3: a second rate for steel 10 mm \(the first is at r\.csv:line 2\)/],
      ['material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],setupTime [min]\n', /expected a column "materialPrice"/],
    ];
    for (const [text, re] of cases) {
      writeFileSync(join(dir, 'r.csv'), text);
      const r = cli(['batch', 'quote.csv', '--rates', 'r.csv', '-o', 'never.csv']);
      expect(r.status, text).toBe(2);
      expect(r.stderr.split('\n')).toHaveLength(2);
      expect(r.stderr, text).toMatch(re);
      expect(() => readFileSync(join(dir, 'never.csv'))).toThrow();
    }
  });

  it('a rates file with decimal commas reads the same rates; inch thickness meets 3/8 in', () => {
    const a = parseRates('material;thickness [in];cuttingSpeed [in/min];pierceTime [s];machineRate [$/h];materialPrice [$/kg];setupTime [h]\nsteel;0,375;100;1,5;95,5;1,25;0,25\n', 'r.csv', { dialect: { separator: ';', decimalComma: true } });
    expect(a.currency).toBe('$');
    expect(a.rates[0].thicknessMm).toBeCloseTo(9.525, 12);
    expect(a.rates[0]).toMatchObject({ material: 'steel', cuttingSpeedMmPerMin: 2540, pierceTimeS: 1.5, machineRatePerH: 95.5, materialPricePerKg: 1.25, setupTimeMin: 15 });
  });

  it('batch --help describes the manifest, the outputs, the rates format and the defaults', () => {
    const h = cli(['batch', '--help']).stdout;
    for (const s of ['Manifest (CSV', 'quantity', 'note', 'Rates file (--rates', 'cuttingSpeed [mm/min]', 'setupTime [min]', 'Defaults:', '--decimal-comma', 'units in brackets'.slice(0, 5)]) expect(h).toContain(s);
  });
});
