import { z } from 'zod';
import { id } from './fields';
import { listQuery } from './list-query';

/** The stock ledger's query: newest entries first, optionally for one product or lot. */
export const ledgerListQuery = listQuery(['createdAt'], {
  productId: id.optional(),
  lotId: id.optional(),
}, 'createdAt', { defaultDir: 'desc' });
export type LedgerListQuery = z.output<typeof ledgerListQuery>;
