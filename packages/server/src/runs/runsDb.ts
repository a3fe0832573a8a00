import type { Database } from '@sigmatail/db';
import type { Kysely } from 'kysely';

/** The database handle the runs code works on. */
export type Db = Kysely<Database>;
