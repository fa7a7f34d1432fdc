// A cumulative visibility table typed or pasted as text: one level per line, the visibility and
// the share of the time it is not reached, P(V < v). Read into link-core's climatology shape and
// checked with its schema, with each problem named by its line.
import { VisibilityClimatologySchema, formatZodIssues, type VisibilityDefinition } from '@beamwright/link-core';

export type ClimatologyVisibilityUnit = 'm' | 'km';
export type ClimatologyProbabilityFormat = 'percent' | 'fraction';

export interface ClimatologyTextOptions {
  visibilityUnit: ClimatologyVisibilityUnit;
  probabilityFormat: ClimatologyProbabilityFormat;
  visibilityDefinition: VisibilityDefinition;
}

export type ClimatologyReading =
  | { ok: true; climatology: { visibilityM: number[]; probabilityBelow: number[]; visibilityDefinition: VisibilityDefinition } }
  | { ok: false; message: string };

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Reads "visibility probability" lines (separated by a tab, comma, semicolon or spaces; a header
 * line of words is skipped). Visibility in the chosen unit, probability in percent or as a fraction.
 */
export function readClimatologyText(text: string, options: ClimatologyTextOptions): ClimatologyReading {
  const visibilityM: number[] = [];
  const probabilityBelow: number[] = [];
  const lineOf: number[] = [];
  const lines = text.split(/\r?\n/);
  for (let index = 0; index < lines.length; index++) {
    const line = lines[index]!.trim();
    if (line === '') continue;
    const cells = line.split(/[\t;,]\s*|\s+/).filter((cell) => cell !== '' && cell !== '%');
    if (cells.length !== 2 || !cells.every((cell) => NUMBER.test(cell.replace(/%$/, '')))) {
      // a header line before the first level
      if (visibilityM.length === 0 && cells.some((cell) => /[a-z]/i.test(cell))) continue;
      return { ok: false, message: `line ${index + 1}: write two numbers, the visibility and P(V < visibility) (found "${line.slice(0, 40)}")` };
    }
    const [visibility, probability] = cells.map((cell) => Number(cell.replace(/%$/, ''))) as [number, number];
    visibilityM.push(options.visibilityUnit === 'km' ? visibility * 1000 : visibility);
    probabilityBelow.push(options.probabilityFormat === 'percent' ? probability / 100 : probability);
    lineOf.push(index + 1);
  }
  if (visibilityM.length < 2) return { ok: false, message: 'needs at least two levels, one per line' };
  const parsed = VisibilityClimatologySchema.safeParse({ visibilityM, probabilityBelow, visibilityDefinition: options.visibilityDefinition });
  if (!parsed.success) {
    const issue = formatZodIssues(parsed.error)[0]!;
    const index = Number(issue.path.split('.')[1]);
    const quantity = issue.path.startsWith('visibilityM') ? 'the visibility' : 'the probability';
    return { ok: false, message: Number.isInteger(index) ? `line ${lineOf[index]}: ${quantity} ${issue.message}` : `${quantity} ${issue.message}` };
  }
  return { ok: true, climatology: { visibilityM, probabilityBelow, visibilityDefinition: options.visibilityDefinition } };
}
