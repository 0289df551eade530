import { RFC_4180, SPREADSHEET_LOCALE } from '../../src/base/csv.js';
import { checkSectionOptions } from '../../src/analysis/options.js';
import { InputError, jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import type { PlateModel } from '../../src/model/plate.js';
import { comparePart, pickPart } from '../../src/output/comparePart.js';
import { comparisonCsv, comparisonJson, comparisonText } from '../../src/output/compareText.js';
import { readReference } from '../../src/qa/reference.js';
import { loadModels } from '../../src/read/load.js';
import { type DrawingFlags, plateSettings, readOptions } from './settings.js';

export interface CompareFlags extends DrawingFlags {
  reference: string; json?: boolean; csv?: boolean; digitsTolerance?: boolean; decimalComma?: boolean;
  thickness?: string; material?: string; density?: string; part?: string;
  degree?: number; levels?: number; format?: string; units?: string;
}

export async function compare(file: string, flags: CompareFlags): Promise<string> {
  if (flags.json && flags.csv) throw new InputError('--csv', 'choose one of --json and --csv');
  if (flags.decimalComma && !flags.csv) throw new InputError('--decimal-comma', 'applies to CSV; add --csv');
  const section = checkSectionOptions({ degree: flags.degree, levels: flags.levels });
  if (file === '-' && flags.reference === '-') throw new InputError('--reference', 'the part already comes from standard input; expected a reference file');
  const readOpts = readOptions(flags);
  const given = plateSettings(flags);
  const refText = readInputText(flags.reference);
  const reference = readReference(refText.text, refText.label);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOpts);
  const model: PlateModel = flags.part !== undefined
    ? pickPart(models, input.label, flags.part, '--part')
    : pickPart(models, input.label, reference.part, `${refText.label}:part`);
  const { comparison, meta } = comparePart(model, reference, { file: input.label, reference: refText.label }, { section, given }, { toleranceFromDigits: flags.digitsTolerance === true });
  // a fail or inconclusive verdict is a result, not an error: print it and say so in the exit status
  if (comparison.verdict !== 'pass') process.exitCode = 1;
  if (flags.json) return jsonTerminalText(JSON.stringify(comparisonJson(comparison, meta), null, 2) + '\n');
  if (flags.csv) return comparisonCsv(comparison, flags.decimalComma ? SPREADSHEET_LOCALE : RFC_4180);
  return terminalText(comparisonText(comparison, meta));
}
