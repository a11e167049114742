// Gapless invoice and credit-note numbers per apiary business: the counter row is locked
// FOR UPDATE inside the caller's transaction, so concurrent issues queue on it and a
// rolled-back issue gives its number back.
import type { Transaction } from 'sequelize';
import type { Models } from '../../db/models/index.js';

export async function takeNextNumber(models: Models, transaction: Transaction, apiaryId: string, series: 'invoice' | 'credit-note'): Promise<number> {
  const { InvoiceNumberCounter } = models;
  await InvoiceNumberCounter.bulkCreate([{ apiaryId, series }], { ignoreDuplicates: true, transaction });
  const counter = await InvoiceNumberCounter.findOne({ where: { apiaryId, series }, lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  await counter.update({ lastNumber: counter.lastNumber + 1 }, { transaction });
  return counter.lastNumber;
}
