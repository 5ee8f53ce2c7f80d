import { EntitySchema } from 'typeorm';

export interface ProjectRow {
  id: string;
  name: string;
  /** Bumped by one on every accepted change; pull asks for documents above a revision. */
  revision: number;
  createdBy: string;
  createdAt: string;
  updatedAt: string;
}

export const ProjectSchema = new EntitySchema<ProjectRow>({
  name: 'Project',
  tableName: 'projects',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    name: { type: 'varchar', length: 200 },
    revision: { type: 'integer', default: 0 },
    createdBy: { type: 'varchar', length: 36 },
    createdAt: { type: 'varchar', length: 32 },
    updatedAt: { type: 'varchar', length: 32 },
  },
});
