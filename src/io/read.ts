/**
 * From input text to parts, whatever the format. Format by `format` option, else by file extension,
 * else by content.
 */
import type { Part } from '../geometry/part.js';
import type { LengthUnit } from '../units.js';
import { readPartJson } from './partJson.js';

export type InputFormat = 'part-json';

export interface ReadOptions {
  format?: InputFormat;
  /** Length unit of drawing coordinates where the format has none of its own. */
  units?: LengthUnit;
}

export function readParts(text: string, label: string, options: ReadOptions = {}): Part[] {
  void options;
  return [readPartJson(text, label)];
}
