import { Column, Entity, PrimaryColumn } from 'typeorm';

/** One row per seed set applied to this database, so a second start adds nothing twice. */
@Entity({ name: 'seed_run' })
export class SeedRun {
  @PrimaryColumn({ name: 'name', type: 'varchar', length: 100 })
  name!: string;

  @Column({ name: 'version', type: 'integer' })
  version!: number;

  @Column({ name: 'applied_at', type: 'timestamptz', default: () => 'now()' })
  appliedAt!: Date;
}
