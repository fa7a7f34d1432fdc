import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { DistanceUnit, VisibilityDefinitionName } from '@beamwright/link-core/contracts';

/** A customer of Beamwright: every row of data belongs to exactly one organisation. */
@Entity({ name: 'organisation' })
export class Organisation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  /** stable handle used by the seed to find its own organisation again */
  @Column({ type: 'varchar', length: 80, unique: true })
  slug: string;

  /** the margin a link is expected to keep [dB]; a new link's explorer and sizing aim for it */
  @Column({ name: 'required_margin_db', type: 'double precision', default: 3 })
  requiredMarginDb: number;

  /** the scintillation fade probability a new link's design starts with */
  @Column({ name: 'fade_probability', type: 'double precision', default: 0.001 })
  fadeProbability: number;

  /** the visibility definition a new link's design starts with */
  @Column({ name: 'visibility_definition', type: 'varchar', length: 40, default: 'contrast-2-percent' })
  visibilityDefinition: VisibilityDefinitionName;

  /** the unit path lengths are typed in when no unit is given */
  @Column({ name: 'distance_unit', type: 'varchar', length: 8, default: 'km' })
  distanceUnit: DistanceUnit;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
