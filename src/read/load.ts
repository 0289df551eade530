/**
 * Reading for one-shot runs of the command line: a part file is read without loading the drawing readers
 * (SVG with its XML and CSS layers, DXF with joining, GeoJSON, WKT and the shared interpretation: about
 * 130 kB of the bundle), which load only when the input is a drawing. The library's `readModels` reads
 * the same way, synchronously, with every reader loaded.
 */
import { detectFormat } from './detect.js';
import type { ReadModel } from './models.js';
import { partFileModels } from './partJson.js';
import type { ReadOptions } from './read.js';

export async function loadModels(text: string, label: string, options: ReadOptions = {}): Promise<ReadModel[]> {
  const format = options.format ?? detectFormat(label === 'stdin' ? undefined : label, text);
  if (format === 'part-json') return partFileModels(text, label, options.units);
  const { readModels } = await import('./models.js');
  return readModels(text, label, { ...options, format });
}
