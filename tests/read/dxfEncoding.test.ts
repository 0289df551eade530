/**
 * DXF files as they arrive: a binary DXF is refused by name in one line; a DXF written before AutoCAD 2007 in
 * its Windows code page (text such as "Ø20 ±0.1" as single bytes) is read, its text ignored. Reference: a
 * circle of radius 10 has area π·10² (closed form). The drawing is invented for the test.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'pw-dxfenc-'));

describe('DXF encodings', () => {
  it('a binary DXF is refused by name, one line, exit 2', () => {
    const f = join(dir, 'bin.dxf');
    writeFileSync(f, Buffer.concat([Buffer.from('AutoCAD Binary DXF\r\n\x1a\x00', 'latin1'), Buffer.from([0xff, 0xfe, 0x00, 0x80, 0x90])]));
    const r = runCli(['measure', f]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bin\.dxf: is a binary DXF, which is not read; save the drawing as ASCII DXF\n$/);
  });
  it('a Windows-1252 DXF with non-ASCII text is read; the text is ignored and counted', () => {
    const lines = ['0', 'SECTION', '2', 'HEADER', '9', '$DWGCODEPAGE', '3', 'ANSI_1252', '9', '$INSUNITS', '70', '4', '0', 'ENDSEC',
      '0', 'SECTION', '2', 'ENTITIES',
      '0', 'CIRCLE', '5', '2A', '8', 'CUT', '10', '50', '20', '50', '30', '0', '40', '10',
      '0', 'TEXT', '5', '2B', '8', 'NOTES', '10', '40', '20', '70', '30', '0', '40', '3', '1', '\u00d820 \u00b10.1',
      '0', 'ENDSEC', '0', 'EOF', ''];
    const f = join(dir, 'ansi.dxf');
    writeFileSync(f, Buffer.from(lines.join('\r\n'), 'latin1'));
    const r = runCli(['measure', f, '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(Math.abs(doc.quantities.area.value - Math.PI * 100) / (Math.PI * 100)).toBeLessThan(1e-13);
    expect(doc.interpretation.ignored.text).toBe(1);
  });
  it('the same bytes under another name are still refused as not UTF-8 (only DXF has a code page)', () => {
    const f = join(dir, 'ansi.svg');
    writeFileSync(f, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><title>\u00d820</title></svg>', 'latin1'));
    const r = runCli(['measure', f]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/is not UTF-8 text/);
  });
});
