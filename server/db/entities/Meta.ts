import { EntitySchema } from 'typeorm';

/** Small server-wide facts, such as whether the demo data was seeded. */
export interface MetaRow {
  key: string;
  value: string;
}

export const MetaSchema = new EntitySchema<MetaRow>({
  name: 'Meta',
  tableName: 'meta',
  columns: {
    key: { type: 'varchar', length: 64, primary: true },
    value: { type: 'text' },
  },
});
