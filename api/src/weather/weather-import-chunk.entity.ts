import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { WeatherImport } from './weather-import.entity.js';

/** A piece of an uploaded file, in order; deleted with its import once the import has ended. */
@Entity({ name: 'weather_import_chunk' })
export class WeatherImportChunk {
  @PrimaryColumn({ name: 'import_id', type: 'uuid' })
  importId: string;

  @ManyToOne(() => WeatherImport, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'import_id' })
  import?: WeatherImport;

  @PrimaryColumn({ type: 'integer' })
  seq: number;

  @Column({ type: 'bytea' })
  data: Buffer;
}
