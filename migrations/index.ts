import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201174640_initial } from './Migration20261201174640_initial';

// Every migration, in order. `npm run migrate -- create <name>` writes a new file; add it here.
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261201174640_initial', class: Migration20261201174640_initial },
];
