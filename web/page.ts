/**
 * The page's main thread: files in (drop or picker), one card per file, the worker's results shown with
 * textContent only (names and texts from drawings never become markup), downloads out. Every figure comes
 * from the worker (web/worker.ts), which runs the library; nothing is computed here.
 */
import { NO_SETTINGS } from './protocol.js';
import type { BatchView, CompareView, FileSettings, FileView, MaterialView, MemberView, PartView, ToWorker } from './protocol.js';

declare const PLATEWISE_VERSION: string;

// ------------------------------------------------------------------ worker calls

type Distribute<T> = T extends unknown ? Omit<T, 'id'> : never;
// started by a small script at the top of the page (web/build.mjs) as soon as the page begins to load
const started = (self as unknown as { platewiseWorker: Promise<Worker> }).platewiseWorker;
let nextId = 1;
const waiting = new Map<number, { resolve: (v: unknown) => void; reject: (e: Error) => void }>();
const worker = started.then((w) => {
  w.onmessage = (ev: MessageEvent<{ id: number; ok: boolean; value?: unknown; message?: string }>) => {
    const h = waiting.get(ev.data.id);
    if (!h) return;
    waiting.delete(ev.data.id);
    if (ev.data.ok) h.resolve(ev.data.value); else h.reject(new Error(ev.data.message));
  };
  return w;
});
function call<T>(m: Distribute<ToWorker>, transfer: Transferable[] = []): Promise<T> {
  const id = nextId++;
  return new Promise<T>((resolve, reject) => {
    waiting.set(id, { resolve: resolve as (v: unknown) => void, reject });
    worker.then((w) => w.postMessage({ ...m, id }, transfer), reject);
  });
}

// ------------------------------------------------------------------ small DOM helpers (text only)

function el<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Record<string, string> = {}, ...children: (Node | string)[]): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  for (const c of children) e.append(typeof c === 'string' ? document.createTextNode(c) : c);
  return e;
}

function save(name: string, text: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = el('a', { href: url, download: name });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

const stem = (name: string) => name.replace(/\.[^.]*$/, '') || 'part';

// ------------------------------------------------------------------ drawing viewer: zoom and pan

function viewer(svg: string, label: string): HTMLElement {
  const box = el('div', { class: 'viewer', tabindex: '0', role: 'img', 'aria-label': `${label}. Plus and minus zoom, arrow keys pan, 0 fits.`, 'data-role': 'viewer' });
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  // an <img> shows the drawing as a picture: nothing in it can run or reach the page
  const img = el('img', { src: url, alt: '', draggable: 'false' });
  box.append(img);
  const size = /<svg[^>]*\bwidth="([\d.]+)"[^>]*\bheight="([\d.]+)"/.exec(svg) ?? /<svg[^>]*\bheight="([\d.]+)"[^>]*\bwidth="([\d.]+)"/.exec(svg);
  const natural = { w: size ? Number(size[1]) : 800, h: size ? Number(size[2]) : 600 };
  let scale = 1, x = 0, y = 0;
  const apply = () => { img.style.transform = `translate(${x}px, ${y}px) scale(${scale})`; };
  const fit = () => {
    const r = box.getBoundingClientRect();
    const w = r.width || 600, h = r.height || 380;
    scale = Math.min(w / natural.w, h / natural.h);
    x = (w - natural.w * scale) / 2; y = (h - natural.h * scale) / 2;
    apply();
  };
  img.width = natural.w; img.height = natural.h;
  const zoomAt = (f: number, cx: number, cy: number) => {
    const s = Math.min(200, Math.max(0.05, scale * f));
    x = cx - (cx - x) * (s / scale); y = cy - (cy - y) * (s / scale); scale = s;
    apply();
  };
  const centre = () => { const r = box.getBoundingClientRect(); return [r.width / 2, r.height / 2] as const; };
  box.addEventListener('wheel', (e) => {
    e.preventDefault();
    const r = box.getBoundingClientRect();
    zoomAt(e.deltaY < 0 ? 1.2 : 1 / 1.2, e.clientX - r.left, e.clientY - r.top);
  }, { passive: false });
  let drag: { px: number; py: number; x: number; y: number } | null = null;
  box.addEventListener('pointerdown', (e) => { drag = { px: e.clientX, py: e.clientY, x, y }; box.setPointerCapture(e.pointerId); box.classList.add('dragging'); });
  box.addEventListener('pointermove', (e) => { if (drag) { x = drag.x + e.clientX - drag.px; y = drag.y + e.clientY - drag.py; apply(); } });
  const end = () => { drag = null; box.classList.remove('dragging'); };
  box.addEventListener('pointerup', end);
  box.addEventListener('pointercancel', end);
  box.addEventListener('keydown', (e) => {
    const step = 40;
    const keys: Record<string, () => void> = {
      '+': () => zoomAt(1.25, ...centre()), '=': () => zoomAt(1.25, ...centre()), '-': () => zoomAt(0.8, ...centre()), '0': fit,
      ArrowLeft: () => { x += step; apply(); }, ArrowRight: () => { x -= step; apply(); }, ArrowUp: () => { y += step; apply(); }, ArrowDown: () => { y -= step; apply(); },
    };
    const k = keys[e.key];
    if (k) { e.preventDefault(); k(); }
  });
  const tools = el('div', { class: 'viewer-tools' });
  const b = (text: string, aria: string, f: () => void) => { const x = el('button', { type: 'button', class: 'quiet', 'aria-label': aria }, text); x.addEventListener('click', f); return x; };
  tools.append(b('+', 'zoom in', () => zoomAt(1.25, ...centre())), b('−', 'zoom out', () => zoomAt(0.8, ...centre())), b('Fit', 'fit the drawing in view', fit),
    el('span', {}, 'drag or use the arrow keys to move; wheel or + − to zoom'));
  const wrap = el('div', {}, box, tools);
  img.addEventListener('load', fit);
  new ResizeObserver(() => fit()).observe(box);
  return wrap;
}

/** What the drawing's line styles mean (the library's drawing palette, src/output/draw.ts). */
function drawingKey(palette: Record<string, string>): HTMLElement {
  const item = (text: string, stroke: string, dash: string, fill = 'none') => {
    const ns = 'http://www.w3.org/2000/svg';
    const s = document.createElementNS(ns, 'svg');
    s.setAttribute('width', '28'); s.setAttribute('height', '12'); s.setAttribute('aria-hidden', 'true');
    const r = document.createElementNS(ns, 'rect');
    for (const [k, v] of Object.entries({ x: '1', y: '1', width: '26', height: '10', fill, stroke, 'stroke-width': '2', 'stroke-dasharray': dash })) r.setAttribute(k, v);
    s.append(r);
    return el('li', {}, s, text);
  };
  return el('ul', { class: 'key', 'aria-label': 'what the lines in the drawing mean' },
    item('cut (material filled)', palette.ink, '', palette.material),
    item('marking, not cut', palette.marking, '5 3'),
    item('ignored', palette.ignored, '2 2'),
    item('principal axes, centroid', palette.axis, ''));
}

// ------------------------------------------------------------------ one card per file

interface Card { key: number; name: string; root: HTMLElement; settings: FileSettings; view?: FileView; busy: boolean; again: boolean }
const cards: Card[] = [];
let palette: Record<string, string> = {};
let nextKey = 1;
const filesBox = document.getElementById('files')!;

function quantityTable(g: PartView['groups'][number], idPrefix: string, role = 'quantities', notBound = '(not a bound)'): HTMLElement {
  const t = el('table', { 'data-role': role, 'data-group': g.group, id: `${idPrefix}-${g.group}` });
  t.append(el('caption', {}, g.title));
  t.append(el('thead', {}, el('tr', {}, el('th', { scope: 'col' }, 'quantity'), el('th', { scope: 'col' }, 'value'), el('th', { scope: 'col' }, '± estimate'), el('th', { scope: 'col' }, 'unit'))));
  const body = el('tbody');
  for (const r of g.rows) {
    body.append(el('tr', { 'data-key': r.key, 'data-value': String(r.value), 'data-error': String(r.error), 'data-group': g.group },
      el('th', { scope: 'row' }, r.key, el('small', {}, r.description)),
      el('td', { class: 'num' }, r.text),
      el('td', { class: 'num' }, `± ${r.errorText}${r.bound ? '' : ` ${notBound}`}`),
      el('td', {}, r.unit)));
  }
  t.append(body);
  return el('div', { class: 'scroll' }, t);
}

function partBlock(c: Card, p: PartView, i: number): HTMLElement {
  const id = `f${c.key}-p${i}`;
  const words = (cls: string, label: string, lines: string[]) => lines.length === 0 ? '' : el('div', {}, el('h4', {}, label), el('ul', { class: `words ${cls}` }, ...lines.map((l) => el('li', {}, l))));
  const left = el('div', {}, el('div', { 'data-role': 'drawing-slot', class: 'viewer-slot' }, el('p', { class: 'state' }, 'drawing…')), drawingKey(palette),
    words('', 'How the file was read', p.reading), words('warn', 'Warnings', p.warnings));
  const right = el('div', {}, ...p.groups.map((g) => quantityTable(g, id)));
  if (p.plate) right.prepend(el('p', { class: 'state' }, `plate: ${p.plate}`));
  else right.append(el('p', { class: 'state' }, 'No mass or cutting masses: enter a thickness and a material or density above.'));
  for (const x of p.cautions) right.append(el('p', { class: 'caution' }, x));
  return el('article', { class: 'part', 'data-role': 'part', 'data-part': p.name, 'aria-labelledby': `${id}-h` },
    el('h3', { id: `${id}-h`, class: 'visually-hidden' }, p.name), left, right);
}

function render(c: Card): void {
  const body = c.root.querySelector('[data-role="result"]')!;
  const msg = c.root.querySelector('[data-role="message"]')!;
  const state = c.root.querySelector('[data-role="state"]')!;
  body.replaceChildren();
  if (c.busy && !c.view) { state.textContent = 'measuring…'; return; }
  const v = c.view!;
  c.root.dataset.state = c.busy ? 'busy' : v.ok ? 'done' : 'failed';
  if (!v.ok) {
    msg.textContent = v.message;
    state.textContent = 'not measured';
    setButtons(c, false);
    return;
  }
  msg.textContent = v.refused ?? '';
  state.textContent = `${v.parts.length} part${v.parts.length === 1 ? '' : 's'}: ${v.parts.map((p) => p.name).join(', ')} — measured in ${Math.round(v.millis)} ms${v.refused ? ' without the settings below (see the line above)' : ''}${c.busy ? ' (measuring again…)' : ''}`;
  v.parts.forEach((p, i) => body.append(partBlock(c, p, i)));
  setButtons(c, true);
  if (!c.busy) performance.mark('platewise:figures-shown'); // read by the bench (tests/bench/page.ts)
}

function setButtons(c: Card, ok: boolean): void {
  for (const b of c.root.querySelectorAll<HTMLButtonElement>('button[data-needs="figures"]')) b.disabled = !ok;
  for (const b of c.root.querySelectorAll<HTMLInputElement>('input[data-needs="figures"]')) b.disabled = !ok;
}

async function measure(c: Card): Promise<void> {
  if (c.busy) { c.again = true; return; }
  c.busy = true;
  const asked = JSON.stringify(c.settings);
  render(c);
  try {
    c.view = await call<FileView>({ op: 'measure', key: c.key });
  } catch (e) {
    c.view = { ok: false, message: (e as Error).message, millis: 0 };
  }
  c.busy = false;
  // the settings these figures were made with (tests wait for them)
  c.root.dataset.settings = asked;
  render(c);
  if (!c.again && c.view.ok) void drawInto(c, c.view);
  if (c.again) { c.again = false; void measure(c); return; }
  scheduleBatch();
}

/** Drawings follow the figures (they take longer on large parts); a newer result makes them stale. */
async function drawInto(c: Card, view: FileView): Promise<void> {
  delete c.root.dataset.drawn;
  let svgs: string[];
  try {
    svgs = await call<string[]>({ op: 'draw', key: c.key });
  } catch (e) {
    for (const slot of c.root.querySelectorAll('[data-role="drawing-slot"]')) slot.replaceChildren(el('p', { class: 'message' }, (e as Error).message));
    return;
  }
  if (c.view !== view || c.busy) return;
  const slots = c.root.querySelectorAll('[data-role="drawing-slot"]');
  svgs.forEach((svg, i) => slots[i]?.replaceChildren(viewer(svg, `drawing of ${view.ok ? view.parts[i].name : ''}`)));
  c.root.dataset.drawn = 'true';
}

function input(label: string, name: keyof FileSettings, c: Card, attrs: Record<string, string>): HTMLElement {
  const id = `f${c.key}-${name}`;
  const field = el('input', { id, name, ...attrs, value: String(c.settings[name]) });
  let timer = 0;
  field.addEventListener('input', () => {
    clearTimeout(timer);
    timer = window.setTimeout(() => {
      if (name === 'quantity') {
        const n = Number(field.value);
        c.settings.quantity = Number.isSafeInteger(n) && n >= 1 ? n : 1;
      } else c.settings[name] = field.value;
      void call({ op: 'settings', key: c.key, settings: c.settings }).then(() => measure(c));
    }, 350);
  });
  return el('label', { for: id }, label, field);
}

/** The drawing's length unit, as `--units` gives it: what the drawing says (the default), or one chosen here. */
function unitChoice(c: Card): HTMLElement {
  const id = `f${c.key}-units`;
  const field = el('select', { id, name: 'units', 'data-role': 'units' },
    el('option', { value: '' }, 'as the drawing says'),
    ...['mm', 'cm', 'm', 'in', 'ft'].map((u) => el('option', { value: u }, u)));
  field.addEventListener('change', () => {
    c.settings.units = (field as HTMLSelectElement).value;
    void call({ op: 'settings', key: c.key, settings: c.settings }).then(() => measure(c));
  });
  return el('label', { for: id }, 'drawing unit', field);
}

/** The mass units, as `--mass-unit` with `--inertia-unit` give them (web/worker.ts MASS_CHOICES). */
function massUnitChoice(c: Card): HTMLElement {
  const id = `f${c.key}-mass-units`;
  const field = el('select', { id, name: 'massUnits', 'data-role': 'mass-units' },
    el('option', { value: '' }, 'kg, kg·m²'),
    el('option', { value: 'lb' }, 'lb, lb·in²'),
    el('option', { value: 'lb-ft' }, 'lb, lb·ft²'),
    el('option', { value: 'g' }, 'g, g·cm²'));
  field.addEventListener('change', () => {
    c.settings.massUnits = (field as HTMLSelectElement).value;
    void call({ op: 'settings', key: c.key, settings: c.settings }).then(() => measure(c));
  });
  return el('label', { for: id }, 'mass units', field);
}

/** The command line's drawing options for this file (layers, joining, uniting), folded away until wanted. */
function drawingOptions(c: Card): HTMLElement {
  const id = `f${c.key}-unite`;
  const unite = el('input', { type: 'checkbox', id, name: 'unite', 'data-role': 'unite' });
  unite.addEventListener('change', () => {
    c.settings.unite = (unite as HTMLInputElement).checked ? 'yes' : '';
    void call({ op: 'settings', key: c.key, settings: c.settings }).then(() => measure(c));
  });
  return el('details', { class: 'drawing-options', 'data-role': 'drawing-options' },
    el('summary', {}, 'drawing options (layers, joining, overlapping outlines)'),
    el('div', { class: 'inputs' },
      input('cut layers', 'cutLayers', c, { type: 'text', autocomplete: 'off', placeholder: 'comma-separated', 'data-role': 'cut-layers' }),
      input('marking layers', 'markLayers', c, { type: 'text', autocomplete: 'off', placeholder: 'comma-separated', 'data-role': 'mark-layers' }),
      input('layers to skip', 'skipLayers', c, { type: 'text', autocomplete: 'off', placeholder: 'comma-separated', 'data-role': 'skip-layers' }),
      input('join tolerance', 'joinTolerance', c, { type: 'text', inputmode: 'decimal', autocomplete: 'off', placeholder: 'in drawing units', 'data-role': 'join-tolerance' }),
      el('label', { for: id, class: 'check' }, unite, ' unite overlapping outlines')),
    el('p', { class: 'state' }, 'The same as --cut-layers, --mark-layers, --skip-layers, --join-tolerance and --unite on the command line.'));
}

function addCard(file: File, bytes: ArrayBuffer): Card {
  const key = nextKey++;
  const c: Card = { key, name: file.name, root: el('section', { class: 'file', 'data-file': file.name, 'aria-labelledby': `f${key}-title` }), settings: { ...NO_SETTINGS }, busy: false, again: false };
  const form = el('form', { class: 'inputs', 'aria-label': `settings for ${file.name}` });
  form.addEventListener('submit', (e) => e.preventDefault());
  form.append(
    input('thickness (e.g. 10 mm)', 'thickness', c, { type: 'text', inputmode: 'decimal', autocomplete: 'off', 'data-role': 'thickness' }),
    input('material (name or alias)', 'material', c, { type: 'text', list: 'materials', autocomplete: 'off', 'data-role': 'material' }),
    input('density instead (kg/m³)', 'density', c, { type: 'text', inputmode: 'decimal', autocomplete: 'off', 'data-role': 'density' }),
    input('how many pieces', 'quantity', c, { type: 'number', min: '1', step: '1', 'data-role': 'quantity' }),
    unitChoice(c),
    massUnitChoice(c),
  );
  const drawingBox = drawingOptions(c);
  const toAll = el('button', { type: 'button', class: 'quiet' }, 'Use these settings for every file');
  toAll.addEventListener('click', () => {
    for (const o of cards) {
      if (o === c) continue;
      o.settings = { ...c.settings };
      // every control named after its setting shows the copied value
      for (const k of Object.keys(o.settings) as (keyof FileSettings)[]) {
        const f = o.root.querySelector<HTMLInputElement | HTMLSelectElement>(`[name="${k}"]`)!;
        if (f instanceof HTMLInputElement && f.type === 'checkbox') f.checked = o.settings[k] === 'yes'; else f.value = String(o.settings[k]);
      }
      void call({ op: 'settings', key: o.key, settings: o.settings }).then(() => measure(o));
    }
  });
  const json = el('button', { type: 'button', 'data-needs': 'figures', 'data-role': 'save-json' }, 'Save figures (JSON)');
  json.addEventListener('click', () => { if (c.view?.ok) save(`${stem(c.name)}.figures.json`, c.view.json, 'application/json'); });
  const report = el('button', { type: 'button', 'data-needs': 'figures', 'data-role': 'save-report' }, 'Save report (HTML)');
  report.addEventListener('click', async () => {
    report.disabled = true;
    try { save(`${stem(c.name)}.report.html`, await call<string>({ op: 'report', key: c.key }), 'text/html'); } catch (e) { c.root.querySelector('[data-role="message"]')!.textContent = (e as Error).message; }
    report.disabled = false;
  });
  const refId = `f${key}-ref`;
  const ref = el('input', { id: refId, type: 'file', accept: '.json,.csv', class: 'visually-hidden', 'data-needs': 'figures', 'data-role': 'reference' });
  const refLabel = el('label', { for: refId, class: 'button' }, 'Check against stated values…');
  ref.addEventListener('change', () => { const f = ref.files?.[0]; if (f) void compareWith(c, f); ref.value = ''; });
  const remove = el('button', { type: 'button', class: 'quiet' }, 'Remove');
  remove.addEventListener('click', () => {
    cards.splice(cards.indexOf(c), 1);
    c.root.remove();
    void call({ op: 'drop', key: c.key });
    scheduleBatch();
  });
  const memberBox = memberControls(c);
  c.root.append(
    el('h2', { id: `f${key}-title` }, file.name),
    el('p', { class: 'message', 'data-role': 'message', role: 'status' }),
    el('p', { class: 'state', 'data-role': 'state' }),
    form,
    drawingBox,
    el('div', { class: 'toolbar' }, json, report, refLabel, ref, toAll, remove),
    el('div', { 'data-role': 'comparison' }),
    el('div', { 'data-role': 'result' }),
    memberBox,
  );
  filesBox.append(c.root);
  cards.push(c);
  void call({ op: 'hold', key, name: file.name, bytes, settings: c.settings }, [bytes]).then(() => measure(c));
  return c;
}

/**
 * The file as the cross-section of a long member (`platewise member`): asked for on demand, since torsion takes
 * a second or two on the worker; the figures stay until asked for again (they do not depend on the plate settings).
 */
function memberControls(c: Card): HTMLElement {
  const id = `f${c.key}-member`;
  const torsion = el('input', { type: 'checkbox', id: `${id}-torsion`, checked: '', 'data-role': 'member-torsion' });
  const bolts = el('input', { type: 'checkbox', id: `${id}-bolts`, 'data-role': 'member-bolts' });
  const lines = el('textarea', { id: `${id}-lines`, rows: '2', spellcheck: 'false', 'data-role': 'member-net-lines', placeholder: 'x,y x,y …' });
  const unit = el('select', { id: `${id}-unit`, 'data-role': 'member-print-unit' },
    el('option', { value: '' }, 'as the drawing'), ...['mm', 'cm', 'm', 'in'].map((u) => el('option', { value: u }, u)));
  const go = el('button', { type: 'button', 'data-needs': 'figures', 'data-role': 'member' }, 'Figures as a member cross-section');
  const out = el('div', { 'data-role': 'member-result', 'aria-live': 'polite' });
  go.addEventListener('click', () => {
    const netLines = (lines as HTMLTextAreaElement).value.split('\n').map((l) => l.trim()).filter((l) => l !== '');
    void memberFigures(c, out, go, torsion.checked, bolts.checked, netLines, (unit as HTMLSelectElement).value);
  });
  return el('div', { class: 'member' },
    el('div', { class: 'toolbar' }, go,
      el('label', { for: torsion.id }, torsion, ' with torsion constant, shear centre and warping (a second or two)'),
      el('label', { for: bolts.id }, bolts, ' with the bolt group of the circular holes')),
    el('div', { class: 'toolbar' },
      el('label', { for: lines.id, class: 'stacked' }, 'net sections along lines, one per line of text (x,y x,y …; the net area takes the thickness above)', lines),
      el('label', { for: unit.id }, 'figures in', unit)),
    out);
}

async function memberFigures(c: Card, out: HTMLElement, go: HTMLButtonElement, torsion: boolean, bolts: boolean, netLines: string[], printUnit: string): Promise<void> {
  go.disabled = true;
  out.dataset.state = 'busy';
  out.replaceChildren(el('p', { class: 'state' }, `working out the member figures${torsion ? ' with torsion' : ''}…`));
  let v: MemberView;
  try {
    v = await call<MemberView>({ op: 'member', key: c.key, torsion, bolts, netLines, printUnit });
  } catch (e) {
    out.replaceChildren(el('p', { class: 'message', 'data-role': 'member-message' }, (e as Error).message));
    out.dataset.state = 'failed';
    go.disabled = false;
    return;
  }
  go.disabled = false;
  const blocks = v.parts.map((p, i) => {
    const block = el('div', { class: 'member-part', 'data-role': 'member-part', 'data-part': p.name, 'data-index': String(i) },
      el('h4', {}, `${p.name} as a member cross-section (${p.unit})`));
    for (const g of p.groups) {
      block.append(quantityTable(g, `f${c.key}-m${i}`, 'member-quantities', v.notBound));
      if (g.group === 'torsion' && p.torsionMethod) block.append(el('p', { class: 'state' }, `torsion: ${p.torsionMethod}`));
    }
    if (p.bolts) {
      const t = el('table', { 'data-role': 'member-quantities', 'data-group': 'boltGroup' }, el('caption', {}, 'Bolt group'),
        el('thead', {}, el('tr', {}, el('th', { scope: 'col' }, 'figure'), el('th', { scope: 'col' }, 'value'), el('th', { scope: 'col' }, 'unit'))),
        el('tbody', {}, ...p.bolts.rows.map((r) => el('tr', { 'data-key': r.path, 'data-value': String(r.value), 'data-group': 'boltGroup' },
          el('th', { scope: 'row' }, r.label), el('td', { class: 'num' }, r.text), el('td', {}, r.unit)))));
      block.append(el('p', { class: 'state' }, `bolt group: ${p.bolts.heading}`), el('div', { class: 'scroll' }, t));
    }
    (p.netSections ?? []).forEach((n, j) => {
      if (!n) { block.append(el('p', { class: 'state', 'data-role': 'net-section', 'data-index': String(j) }, `net line ${j + 1}: misses this part`)); return; }
      const t = el('table', { 'data-role': 'net-section', 'data-index': String(j) }, el('caption', {}, n.heading),
        el('thead', {}, el('tr', {}, ...['figure', 'value', '± estimate', 'unit', 'meaning'].map((h) => el('th', { scope: 'col' }, h)))),
        el('tbody', {}, ...n.rows.map((r) => el('tr', { 'data-key': r.key, 'data-value': String(r.value), 'data-error': String(r.error) },
          el('th', { scope: 'row' }, r.key), el('td', { class: 'num' }, r.text), el('td', { class: 'num' }, `± ${r.errorText}`), el('td', {}, r.unit), el('td', {}, r.what)))));
      block.append(el('div', { class: 'scroll' }, t), ...(n.noArea ? [el('p', { class: 'state' }, n.noArea)] : []),
        el('p', { class: 'state' }, n.runsHeading), el('ul', { class: 'words' }, ...n.runs.map((x) => el('li', {}, x))),
        ...(n.note ? [el('p', { class: 'state' }, n.note)] : []));
    });
    if (p.notes.length) block.append(el('ul', { class: 'words' }, ...p.notes.map((n) => el('li', {}, n))));
    return block;
  });
  const saveJson = el('button', { type: 'button', class: 'quiet', 'data-role': 'save-member-json' }, 'Save member figures (JSON)');
  saveJson.addEventListener('click', () => save(`${stem(c.name)}.member.json`, v.json, 'application/json'));
  out.replaceChildren(
    el('p', { class: 'state' }, `member figures worked out in ${Math.round(v.millis)} ms; the same as platewise member${torsion ? '' : ' --no-torsion'}${bolts ? ' --bolts' : ''}${netLines.map((l) => ` --net-line "${l}"`).join('')}${netLines.length && c.settings.thickness.trim() ? ` --thickness "${c.settings.thickness.trim()}"` : ''}${printUnit ? ` --print-unit ${printUnit}` : ''}`),
    el('div', { class: 'member-parts' }, ...blocks),
    ...v.cautions.map((x) => el('p', { class: 'caution' }, x)),
    el('div', { class: 'toolbar' }, saveJson));
  out.dataset.state = 'done';
  out.dataset.asked = JSON.stringify({ torsion, bolts, netLines, printUnit });
}

async function compareWith(c: Card, f: File): Promise<void> {
  const box = c.root.querySelector('[data-role="comparison"]')!;
  box.replaceChildren(el('p', { class: 'state' }, `checking against ${f.name}…`));
  let v: CompareView;
  try {
    v = await call<CompareView>({ op: 'compare', key: c.key, name: f.name, bytes: await f.arrayBuffer() });
  } catch (e) {
    box.replaceChildren(el('p', { class: 'message', 'data-role': 'compare-message' }, (e as Error).message));
    return;
  }
  const t = el('table', { 'data-role': 'verdicts' });
  t.append(el('caption', {}, `Against ${f.name}: `, el('span', { class: `verdict ${v.verdict}`, 'data-verdict': v.verdict }, v.verdict),
    ` — ${v.counts.pass} pass, ${v.counts.fail} fail, ${v.counts.inconclusive} inconclusive`));
  t.append(el('thead', {}, el('tr', {}, ...['quantity', 'stated', 'computed ± estimate', 'difference', 'tolerance', 'verdict', 'what it may mean'].map((h) => el('th', { scope: 'col' }, h)))));
  const tb = el('tbody');
  for (const r of v.rows) {
    tb.append(el('tr', { 'data-key': r.quantity, 'data-verdict': r.verdict },
      el('th', { scope: 'row' }, r.quantity), el('td', { class: 'num' }, r.stated), el('td', { class: 'num' }, r.computed),
      el('td', { class: 'num' }, r.difference), el('td', { class: 'num' }, r.tolerance),
      el('td', {}, el('span', { class: `verdict ${r.verdict}` }, r.verdict)), el('td', {}, r.advice.join(' '))));
  }
  t.append(tb);
  const rule = el('p', { class: 'state' }, 'rule: pass when |difference| + estimate ≤ tolerance; fail when |difference| − estimate > tolerance; otherwise inconclusive.');
  const sj = el('button', { type: 'button', class: 'quiet' }, 'Save check (JSON)');
  sj.addEventListener('click', () => save(`${stem(c.name)}.check.json`, v.json, 'application/json'));
  const sc = el('button', { type: 'button', class: 'quiet' }, 'Save check (CSV)');
  sc.addEventListener('click', () => save(`${stem(c.name)}.check.csv`, v.csv, 'text/csv'));
  const full = el('details', {}, el('summary', {}, 'As the command line prints it'), el('pre', { class: 'scroll' }, v.text));
  box.replaceChildren(el('div', { class: 'scroll' }, t), rule, el('div', { class: 'toolbar' }, sj, sc), full);
}

// ------------------------------------------------------------------ all files: the batch table and totals

let batchTimer = 0;
let lastBatch: BatchView | undefined;
function scheduleBatch(): void {
  document.getElementById('all')!.dataset.state = 'stale';
  clearTimeout(batchTimer);
  batchTimer = window.setTimeout(() => void refreshBatch(), 150);
}

const BATCH_COLUMNS: [string, string][] = [['area', 'area'], ['netMass', 'net mass (kg)'], ['cutLength', 'cut length'], ['pierces', 'pierces']];

async function refreshBatch(): Promise<void> {
  const all = document.getElementById('all')!;
  (document.getElementById('clear') as HTMLButtonElement).disabled = cards.length === 0;
  if (cards.length === 0 || cards.some((c) => c.busy)) { all.hidden = cards.length === 0; return; }
  const v = await call<BatchView>({ op: 'batch', keys: cards.map((c) => c.key) });
  if (cards.some((c) => c.busy)) return; // a newer run will follow
  lastBatch = v;
  all.hidden = false;
  const s = v.summary;
  const total = (label: string, value: number, text: string, key: string) => el('li', { 'data-total': key, 'data-value': String(value) }, `${label}: `, el('strong', {}, text));
  document.getElementById('totals')!.replaceChildren(
    total('pieces', s.pieces, String(s.pieces), 'pieces'),
    ...(s.partsMeasured > s.partsWithoutMass ? [
      total('net mass', s.netMassKg, `${fmt(s.netMassKg)} kg ± ${s.netMassErrorKg.toExponential(1)}`, 'netMassKg'),
      total('blank mass', s.blankMassKg, `${fmt(s.blankMassKg)} kg`, 'blankMassKg')] : []),
    total('cut length', s.cutLengthM, `${fmt(s.cutLengthM)} m`, 'cutLengthM'),
    total('pierces', s.pierces, String(s.pierces), 'pierces'),
    el('li', { class: 'state' }, ...v.summaryLines.slice(0, 3).flatMap((l, i) => (i ? [el('br'), l] : [l]))),
  );
  const table = document.getElementById('batch-table')!;
  table.querySelector('thead')!.replaceChildren(el('tr', {}, ...['row', 'file', 'part', 'pieces', ...BATCH_COLUMNS.map((c) => c[1]), 'units', 'verdict', 'status'].map((h) => el('th', { scope: 'col' }, h))));
  table.querySelector('tbody')!.replaceChildren(...v.rows.map((r) => el('tr', { 'data-row': String(r.row), 'data-status': r.status },
    el('td', { class: 'num' }, String(r.row)), el('td', {}, r.file), el('td', {}, r.part ?? ''), el('td', { class: 'num' }, String(r.quantity)),
    ...BATCH_COLUMNS.map(([k]) => el('td', { class: 'num', 'data-key': k, 'data-value': r.quantities[k] ? String(r.quantities[k].value) : '' }, r.quantities[k] ? fmt(r.quantities[k].value) : '—')),
    el('td', {}, r.units ?? ''), el('td', {}, r.verdict ?? '—'), el('td', {}, r.status === 'ok' ? 'measured' : `failed: ${r.error ?? ''}`))));
  document.getElementById('batch-caution')!.textContent = v.summaryLines.at(-1) ?? '';
  all.dataset.state = 'current';
}

/** Short figures in the overview table only (the per-file tables carry the command line's own rounding). */
const fmt = (v: number) => (Number.isInteger(v) ? String(v) : v.toPrecision(6));

document.getElementById('batch-csv')!.addEventListener('click', () => { if (lastBatch) save('batch.csv', lastBatch.csv, 'text/csv'); });

// ------------------------------------------------------------------ intake

async function take(list: FileList | File[]): Promise<void> {
  performance.mark('platewise:files-taken');
  for (const f of Array.from(list)) addCard(f, await f.arrayBuffer());
  (document.getElementById('clear') as HTMLButtonElement).disabled = cards.length === 0;
}

const pick = document.getElementById('pick') as HTMLInputElement;
pick.addEventListener('change', () => { if (pick.files) void take(pick.files); pick.value = ''; });
const intake = document.getElementById('intake')!;
for (const t of ['dragenter', 'dragover']) intake.addEventListener(t, (e) => { e.preventDefault(); intake.classList.add('over'); });
for (const t of ['dragleave', 'drop']) intake.addEventListener(t, () => intake.classList.remove('over'));
intake.addEventListener('drop', (e) => { e.preventDefault(); e.stopPropagation(); intake.classList.remove('over'); if (e.dataTransfer?.files) void take(e.dataTransfer.files); });
// a file dropped beside the drop area must not replace the page
window.addEventListener('dragover', (e) => e.preventDefault());
window.addEventListener('drop', (e) => { e.preventDefault(); if (e.dataTransfer?.files) void take(e.dataTransfer.files); });
document.getElementById('clear')!.addEventListener('click', () => {
  for (const c of cards.splice(0)) { c.root.remove(); void call({ op: 'drop', key: c.key }); }
  scheduleBatch();
});

// the user's materials file (the command line's --materials-file): for every file; the figures are made again
const materialsPick = document.getElementById('materials-pick') as HTMLInputElement;
const materialsState = document.getElementById('materials-state')!;
const materialsForget = document.getElementById('materials-forget') as HTMLButtonElement;
const materialsMessage = document.getElementById('materials-message')!;
function fillMaterials(materials: MaterialView[]): void {
  const list = document.getElementById('materials')!;
  list.replaceChildren();
  for (const m of materials) {
    list.append(el('option', { value: m.id }, `${m.name}, ${m.density} kg/m³${m.fromFile ? ' (your file)' : ''}`));
    for (const a of m.aliases) list.append(el('option', { value: a }, `${m.name} (${m.id})`));
  }
}
async function useMaterialsFile(file: File | null): Promise<void> {
  try {
    const r = await call<{ materials: MaterialView[]; count: number }>({ op: 'materials-file', name: file?.name ?? '', bytes: file ? await file.arrayBuffer() : null });
    fillMaterials(r.materials);
    materialsState.textContent = file ? `${file.name}: ${r.count} material${r.count === 1 ? '' : 's'} (they come first and may replace built-in ones)` : 'built-in materials only';
    materialsMessage.textContent = '';
    document.body.dataset.materialsFile = file ? file.name : '';
    materialsForget.hidden = file === null;
    for (const c of cards) void measure(c);
  } catch (e) {
    // the command line's one line; the table in use stays as it was (the line above says which)
    materialsMessage.textContent = (e as Error).message;
    document.body.dataset.materialsFile = 'refused';
  }
}
materialsPick.addEventListener('change', () => { const f = materialsPick.files?.[0]; materialsPick.value = ''; if (f) void useMaterialsFile(f); });
materialsForget.addEventListener('click', () => void useMaterialsFile(null));

for (const v of document.querySelectorAll('[data-role="version"]')) v.textContent = PLATEWISE_VERSION;
// the page takes files as soon as this script has run (data-ready): calls made before the worker is up wait for
// it, and the worker answers in order, so the drawing palette below arrives before any file's figures
document.body.dataset.ready = 'true';
void call<{ materials: MaterialView[]; palette: Record<string, string> }>({ op: 'materials' }).then(({ materials, palette: p }) => {
  palette = p;
  fillMaterials(materials);
  document.body.dataset.worker = 'ready';
  performance.mark('platewise:worker-ready'); // the page's own clock, read by the bench (tests/bench/page.ts)
}, (e: Error) => {
  document.body.dataset.worker = 'failed';
  document.getElementById('intake')!.append(el('p', { class: 'caution', role: 'alert' }, `The page could not start its worker, so it cannot measure anything: ${e.message}. It needs a browser from 2023 or later (Chrome 110, Firefox 115, Safari 16.4).`));
});
