import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { WeatherDataset } from './weather-dataset.entity.js';

/**
 * One observation of a data set. The key (data set, time) keeps one record per instant; the
 * visibility is in metres in the data set's definition, null when the file held no reading.
 */
@Entity({ name: 'weather_record' })
export class WeatherRecord {
  @PrimaryColumn({ name: 'dataset_id', type: 'uuid' })
  datasetId: string;

  @ManyToOne(() => WeatherDataset, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'dataset_id' })
  dataset?: WeatherDataset;

  @PrimaryColumn({ name: 'observed_at', type: 'timestamptz' })
  observedAt: Date;

  @Column({ name: 'visibility_m', type: 'double precision', nullable: true })
  visibilityM: number | null;

  @Column({ name: 'rain_rate_mm_per_h', type: 'double precision', nullable: true })
  rainRateMmPerH: number | null;

  @Column({ name: 'snow_rate_mm_per_h', type: 'double precision', nullable: true })
  snowRateMmPerH: number | null;

  @Column({ name: 'temperature_c', type: 'double precision', nullable: true })
  temperatureC: number | null;

  /** refractive-index structure parameter [m^-2/3] */
  @Column({ type: 'double precision', nullable: true })
  cn2: number | null;
}
