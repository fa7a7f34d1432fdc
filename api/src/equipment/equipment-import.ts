import { parse } from 'csv-parse/sync';
import { formatZodIssues } from '@beamwright/link-core';
import {
  CreateEquipmentRequestSchema,
  EQUIPMENT_CSV_COLUMNS,
  MAX_EQUIPMENT_CSV_ROWS,
  equipmentCsvColumnOf,
  equipmentCsvRecordToRequest,
  type EquipmentCsvRowError,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';

export type EquipmentCreateInput = z.output<typeof CreateEquipmentRequestSchema>;

export interface ReadCatalogueCsv {
  totalRows: number;
  /** the rows that passed, in file order */
  valid: EquipmentCreateInput[];
  errors: EquipmentCsvRowError[];
}

const KNOWN_COLUMNS: ReadonlySet<string> = new Set(EQUIPMENT_CSV_COLUMNS);

/**
 * Reads a catalogue CSV: the header names the columns (any order, `EQUIPMENT_CSV_COLUMNS`), every
 * following record is one model checked with the create schema. Errors carry the file's line
 * number and the column. At most MAX_EQUIPMENT_CSV_ROWS data rows: csv-parse stops right after
 * (`to`), so a longer file costs no more than that.
 */
export function readCatalogueCsv(text: string): ReadCatalogueCsv {
  const errors: EquipmentCsvRowError[] = [];
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, {
      bom: true,
      info: true,
      skip_empty_lines: true,
      relax_column_count: true,
      trim: false,
      // the header, the limit and one record more (to know the file is too long), and no further
      to: MAX_EQUIPMENT_CSV_ROWS + 2,
      max_record_size: 16 * 1024,
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (error) {
    const line = typeof (error as { lines?: unknown }).lines === 'number' ? (error as { lines: number }).lines : 1;
    return { totalRows: 0, valid: [], errors: [{ line, column: '', reason: `the file is not valid CSV: ${(error as Error).message.replace(/^[^:]*:\s*/, '')}` }] };
  }
  const [header, ...rows] = records;
  if (!header) return { totalRows: 0, valid: [], errors: [{ line: 1, column: '', reason: 'the file has no header row' }] };
  const columns = header.record.map((name) => name.trim());
  const unknown = columns.filter((name) => !KNOWN_COLUMNS.has(name));
  const missing = ['kind', 'name'].filter((name) => !columns.includes(name));
  for (const name of unknown) errors.push({ line: header.info.lines, column: name, reason: `is not a column of the catalogue (expected: ${EQUIPMENT_CSV_COLUMNS.join(', ')})` });
  for (const name of missing) errors.push({ line: header.info.lines, column: name, reason: 'is a required column and is missing from the header' });
  if (new Set(columns).size !== columns.length) errors.push({ line: header.info.lines, column: '', reason: 'the header names a column twice' });
  if (errors.length > 0) return { totalRows: rows.length, valid: [], errors };
  if (rows.length > MAX_EQUIPMENT_CSV_ROWS) {
    return { totalRows: rows.length, valid: [], errors: [{ line: rows[MAX_EQUIPMENT_CSV_ROWS]!.info.lines, column: '', reason: `the file has more than ${MAX_EQUIPMENT_CSV_ROWS} models; split it into smaller files` }] };
  }

  const valid: EquipmentCreateInput[] = [];
  for (const { record, info } of rows) {
    const line = info.lines;
    if (record.length > columns.length) {
      errors.push({ line, column: '', reason: `has ${record.length} cells, the header ${columns.length}` });
      continue;
    }
    const cells = Object.fromEntries(columns.map((name, index) => [name, record[index]]));
    const converted = equipmentCsvRecordToRequest(cells);
    if (!converted.ok) {
      for (const cell of converted.errors) errors.push({ line, ...cell });
      continue;
    }
    const parsed = CreateEquipmentRequestSchema.safeParse(converted.request);
    if (!parsed.success) {
      for (const issue of formatZodIssues(parsed.error)) errors.push({ line, column: equipmentCsvColumnOf(issue.path), reason: issue.message });
      continue;
    }
    valid.push(parsed.data);
  }
  return { totalRows: rows.length, valid, errors };
}
