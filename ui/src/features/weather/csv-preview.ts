// The first rows of a chosen weather file, read in the browser before anything is uploaded, so the
// mapping step can show them and guess the columns. Gzip is inflated with the browser's own
// DecompressionStream; only the first few hundred kilobytes are ever read.
import { detectDelimiter, guessWeatherMapping, normaliseHeader, type GuessedWeatherMapping, type WeatherDelimiter } from '@beamwright/link-core/contracts';

/** How much of a file the preview reads (after inflating a gzip file). */
const PREVIEW_BYTES = 256 * 1024;
export const PREVIEW_ROWS = 8;

export interface CsvPreview {
  gzip: boolean;
  delimiter: WeatherDelimiter;
  header: string[];
  /** the first data rows, cells as text, with their line in the file */
  rows: { line: number; cells: string[] }[];
  guess: GuessedWeatherMapping;
}

/**
 * One CSV line split into cells: the delimiter outside quotes separates, a doubled quote inside
 * quotes is a quote (RFC 4180). A line break inside quotes is not expected in weather exports.
 */
export function splitCsvLine(line: string, delimiter: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const character = line[i]!;
    if (quoted) {
      if (character === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (character === '"') quoted = false;
      else cell += character;
    } else if (character === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (character === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += character;
  }
  cells.push(cell);
  return cells;
}

/** The preview of a text: header, first rows (empty lines skipped) and the column guess. */
export function previewCsvText(text: string, gzip = false): CsvPreview {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const headerLine = lines[0] ?? '';
  const delimiter = detectDelimiter(headerLine);
  const header = normaliseHeader(splitCsvLine(headerLine, delimiter));
  const rows: CsvPreview['rows'] = [];
  // the last line may be cut by the preview window: it is left out
  for (let index = 1; index < lines.length - 1 && rows.length < PREVIEW_ROWS; index++) {
    if (lines[index]!.trim() === '') continue;
    rows.push({ line: index + 1, cells: splitCsvLine(lines[index]!, delimiter) });
  }
  return { gzip, delimiter, header, rows, guess: guessWeatherMapping(header, rows.map((row) => row.cells)) };
}

async function firstBytes(stream: ReadableStream<Uint8Array>, limit: number): Promise<Uint8Array> {
  const reader = stream.getReader();
  const parts: Uint8Array[] = [];
  let size = 0;
  try {
    while (size < limit) {
      const { done, value } = await reader.read();
      if (done) break;
      parts.push(value);
      size += value.length;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const part of parts) {
    bytes.set(part, offset);
    offset += part.length;
  }
  return bytes.subarray(0, limit);
}

/** Reads the start of a chosen file; the last line of a large file is cut and left out. */
export async function readCsvPreview(file: Blob): Promise<CsvPreview> {
  const start = new Uint8Array(await file.slice(0, 2).arrayBuffer());
  const gzip = start[0] === 0x1f && start[1] === 0x8b;
  let bytes: Uint8Array;
  if (gzip) {
    if (typeof DecompressionStream === 'undefined') throw new Error('this browser cannot preview gzip files; upload the CSV itself');
    bytes = await firstBytes(file.stream().pipeThrough(new DecompressionStream('gzip')), PREVIEW_BYTES);
  } else {
    bytes = new Uint8Array(await file.slice(0, PREVIEW_BYTES).arrayBuffer());
  }
  if (bytes.includes(0)) throw new Error('the file holds binary data, not CSV text');
  let text = new TextDecoder('utf-8').decode(bytes);
  // not UTF-8: read as Windows-1252, as the import reads it as Latin-1
  if (text.includes('\uFFFD')) text = new TextDecoder('windows-1252').decode(bytes);
  const complete = !gzip && file.size <= PREVIEW_BYTES;
  return previewCsvText(complete && !text.endsWith('\n') ? `${text}\n` : text, gzip);
}
