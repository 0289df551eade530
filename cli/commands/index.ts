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

export const COMMANDS: ((program: Command) => void)[] = [
  defineMeasure,
  defineRules,
  defineCompare,
  defineBatch,
  defineIntegrate,
  defineMaterials,
  defineDraw,
  defineReport,
  defineMember,
  definePage,
];
