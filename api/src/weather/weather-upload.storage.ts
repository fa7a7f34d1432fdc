import type { Readable } from 'node:stream';
import { PayloadTooLargeException } from '@nestjs/common';
import type { Request } from 'express';
import type { DataSource } from 'typeorm';
import { WEATHER_UPLOAD_LIMITS } from '@beamwright/link-core/contracts';
import type { AuthUser } from '../common/auth-user.js';
import { SNIFF_BYTES, checkWeatherFile, type WeatherFileFacts } from './weather-file-check.js';

/** Size of the pieces the upload is kept in while it waits for its import [bytes]. */
const CHUNK_BYTES = 1024 * 1024;

/** The upload route's whole body may hold the 50 MB file and its multipart framing and fields (a declared length above is refused at once). */
export const WEATHER_UPLOAD_BODY_LIMIT = { method: 'POST', path: `/api/weather-datasets`, maxBytes: WEATHER_UPLOAD_LIMITS.maxBytes + 256 * 1024 } as const;

/** The part multer hands a storage engine (multer's own StorageEngine interface, typed here). */
export interface UploadedFilePart {
  fieldname: string;
  originalname: string;
  stream: Readable;
}

/** What the engine adds to `request.file` once the file is stored. */
export interface StoredWeatherUpload {
  importId: string;
  size: number;
  facts: WeatherFileFacts;
}

export const tooLarge = () =>
  new PayloadTooLargeException(
    `The file is larger than ${WEATHER_UPLOAD_LIMITS.maxBytes / (1024 * 1024)} MB (${WEATHER_UPLOAD_LIMITS.maxBytes.toLocaleString('en-GB')} bytes), the most one upload takes. Compress it with gzip, or split it into several data sets.`,
  );

/**
 * A multer storage engine that streams the `file` part into PostgreSQL (weather_import_chunk, 1 MiB
 * pieces) under a new import of the caller's organisation: never the whole file in memory, and the
 * bytes are where every API process can read them. The first 64 KiB are checked for CSV content
 * (415 otherwise) and the size is counted as it arrives (413 past 50 MB); a refused or abandoned
 * upload leaves nothing behind.
 */
export class WeatherUploadStorage {
  constructor(private readonly dataSource: DataSource) {}

  _handleFile(request: Request, file: UploadedFilePart, callback: (error: Error | null, info?: StoredWeatherUpload) => void): void {
    this.store(request, file).then(
      (info) => callback(null, info),
      (error: Error) => {
        // keep the multipart parser going to the end of the part it no longer wants
        file.stream.resume();
        callback(error);
      },
    );
  }

  _removeFile(_request: Request, file: Partial<StoredWeatherUpload>, callback: (error: Error | null) => void): void {
    if (!file.importId) return callback(null);
    this.discard(file.importId).then(
      () => callback(null),
      (error: Error) => callback(error),
    );
  }

  /** Deletes an upload that never became a queued import (its chunks go with it). */
  async discard(importId: string): Promise<void> {
    await this.dataSource.query(`DELETE FROM weather_import WHERE id = $1 AND state = 'uploading'`, [importId]);
  }

  private async store(request: Request, file: UploadedFilePart): Promise<StoredWeatherUpload> {
    const caller = request.user as AuthUser;
    const [created] = (await this.dataSource.query(
      `INSERT INTO weather_import (organisation_id, created_by_id, state, file_name) VALUES ($1, $2, 'uploading', $3) RETURNING id`,
      [caller.organisationId, caller.userId, toFileName(file.originalname)],
    )) as { id: string }[];
    const importId = created!.id;
    try {
      let size = 0;
      let seq = 0;
      let pending: Buffer[] = [];
      let pendingBytes = 0;
      let facts: WeatherFileFacts | undefined;
      const flush = async () => {
        if (pendingBytes === 0) return;
        await this.dataSource.query(`INSERT INTO weather_import_chunk (import_id, seq, data) VALUES ($1, $2, $3)`, [importId, seq, Buffer.concat(pending)]);
        seq += 1;
        pending = [];
        pendingBytes = 0;
      };
      // not destroyed on an early exit: a destroyed part would fail the request with its own error
      // before this engine's 413 or 415; the part is drained instead (see _handleFile)
      for await (const piece of file.stream.iterator({ destroyOnReturn: false }) as AsyncIterable<Buffer>) {
        size += piece.length;
        if (size > WEATHER_UPLOAD_LIMITS.maxBytes) throw tooLarge();
        pending.push(piece);
        pendingBytes += piece.length;
        if (!facts && pendingBytes >= SNIFF_BYTES) facts = await checkWeatherFile(Buffer.concat(pending).subarray(0, SNIFF_BYTES), false);
        if (pendingBytes >= CHUNK_BYTES) await flush();
      }
      facts ??= await checkWeatherFile(Buffer.concat(pending), true);
      await flush();
      await this.dataSource.query(
        `UPDATE weather_import SET byte_count = $2, gzip = $3, encoding = $4, delimiter = $5, header = $6, updated_at = now() WHERE id = $1`,
        [importId, size, facts.gzip, facts.encoding, facts.delimiter, JSON.stringify(facts.header)],
      );
      return { importId, size, facts };
    } catch (error) {
      await this.discard(importId).catch(() => undefined);
      throw error;
    }
  }
}

/** The client's file name as a label only: no path, no control characters, at most 255 characters. */
function toFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  let clean = '';
  for (const character of base.normalize('NFC')) {
    const code = character.codePointAt(0)!;
    if (code >= 0x20 && code !== 0x7f && !(code >= 0x80 && code <= 0x9f)) clean += character;
  }
  return clean.trim().slice(0, 255) || 'upload.csv';
}
