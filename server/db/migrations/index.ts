import { Initial1767225600000 } from './1767225600000-Initial';

/** Every migration, oldest first. Add new ones at the end; never edit one that has shipped. */
export const migrations = [Initial1767225600000];
