/** The command list: one definition module per command (options only; bodies load lazily). */
import type { Command } from 'commander';
import { defineMeasure } from './measure.def.js';
import { defineRules } from './rules.def.js';
import { defineCompare } from './compare.def.js';
import { defineBatch } from './batch.def.js';
import { defineIntegrate } from './integrate.def.js';
import { defineMaterials } from './materials.def.js';
import { defineDraw } from './draw.def.js';
import { defineReport } from './report.def.js';
import { defineMember } from './member.def.js';
import { definePage } from './page.def.js';

/** Each command's definition under its name (the order is the order of the help listing). */
export const COMMANDS: Readonly<Record<string, (program: Command) => void>> = {
  measure: defineMeasure,
  rules: defineRules,
  compare: defineCompare,
  batch: defineBatch,
  integrate: defineIntegrate,
  materials: defineMaterials,
  draw: defineDraw,
  report: defineReport,
  member: defineMember,
  page: definePage,
};
