import type { Db } from '../db/client';

/** A transaction of the shared pool. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Either the pool or a transaction: read helpers work inside and outside one. */
export type Q = Db | Tx;
