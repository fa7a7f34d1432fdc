import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

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

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
