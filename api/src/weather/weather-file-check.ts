import { gunzipSync, constants as zlib } from 'node:zlib';
import { UnsupportedMediaTypeException } from '@nestjs/common';
import { fileTypeFromBuffer } from 'file-type';
import { parse } from 'csv-parse/sync';
import { detectDelimiter, normaliseHeader, type WeatherDelimiter } from '@beamwright/link-core/contracts';

/** How many bytes of a file the content check reads (and, for gzip, how many it inflates at most). */
export const SNIFF_BYTES = 64 * 1024;

/** What the first bytes of an upload say about it. */
export interface WeatherFileFacts {
  gzip: boolean;
  encoding: 'utf8' | 'latin1';
  delimiter: WeatherDelimiter;
  /** the header row, as the mapping names its columns */
  header: string[];
}

const refuse = (reason: string) =>
  new UnsupportedMediaTypeException(`The file is not CSV text: ${reason}. Upload a CSV file (comma, semicolon or tab separated, UTF-8), or one compressed with gzip.`);

/** The start of a text, as far as it is whole lines (the last line may be cut by the sniff window). */
function wholeLines(text: string, complete: boolean): string {
  if (complete) return text;
  const end = Math.max(text.lastIndexOf('\n'), 0);
  return end > 0 ? text.slice(0, end) : text;
}

/**
 * Decides from the content, never the file name, whether an upload is CSV text or gzip-compressed
 * CSV text: no binary format file-type recognises (other than gzip), no NUL bytes, valid UTF-8
 * (else Latin-1 is assumed), not markup or JSON, and a header row of at least two columns.
 *
 * @param start the first bytes of the file (up to SNIFF_BYTES)
 * @param complete whether `start` is the whole file
 * @throws UnsupportedMediaTypeException (415) with the reason
 */
export async function checkWeatherFile(start: Buffer, complete: boolean): Promise<WeatherFileFacts> {
  if (start.length === 0) throw refuse('it is empty');
  const type = await fileTypeFromBuffer(start);
  let gzip = false;
  let text = start;
  let textComplete = complete;
  if (type?.ext === 'gz') {
    gzip = true;
    try {
      // a sync flush inflates what the window holds without asking for the end of the stream
      text = gunzipSync(start, { finishFlush: zlib.Z_SYNC_FLUSH, maxOutputLength: SNIFF_BYTES * 16 });
    } catch (error) {
      // a window of more than 1 MiB inflated is enough to judge, the rest is the job's
      if ((error as { code?: string }).code !== 'ERR_BUFFER_TOO_LARGE') throw refuse('its gzip stream is damaged');
      text = gunzipSync(start.subarray(0, 4096), { finishFlush: zlib.Z_SYNC_FLUSH });
    }
    textComplete = complete && text.length < SNIFF_BYTES * 16;
    const inner = await fileTypeFromBuffer(text);
    if (inner) throw refuse(`it is gzip-compressed ${inner.mime} (${inner.ext})`);
    text = text.subarray(0, SNIFF_BYTES * 4);
  } else if (type) {
    throw refuse(`its content is ${type.mime} (${type.ext})`);
  }
  if (text.includes(0)) throw refuse('it holds binary data (NUL bytes)');
  const encoding = isValidUtf8(text, textComplete) ? 'utf8' : 'latin1';
  const decoded = wholeLines(text.toString(encoding).replace(/^\uFEFF/, ''), textComplete);
  const firstVisible = decoded.trimStart()[0];
  if (firstVisible === '<' || firstVisible === '{' || firstVisible === '[') throw refuse('it looks like markup or JSON');
  const headerLine = decoded.split(/\r?\n/, 1)[0] ?? '';
  const delimiter = detectDelimiter(headerLine);
  let header: string[];
  try {
    header = normaliseHeader((parse(headerLine, { delimiter, relax_quotes: true }) as string[][])[0] ?? []);
  } catch {
    throw refuse('its first line is not a row of column names');
  }
  if (header.length < 2) throw refuse('its first line has fewer than two columns (it needs a timestamp and a visibility column at least)');
  if (header.some((name) => name === '')) throw refuse('its first line has an empty column name');
  return { gzip, encoding, delimiter, header };
}

/** UTF-8 validity of a byte window; a character cut at the end of an incomplete window is allowed. */
function isValidUtf8(bytes: Buffer, complete: boolean): boolean {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  try {
    decoder.decode(bytes, { stream: !complete });
    return true;
  } catch {
    return false;
  }
}
