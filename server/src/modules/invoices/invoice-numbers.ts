// Gapless invoice and credit-note numbers per apiary business: the counter row is locked
// FOR UPDATE inside the caller's transaction, so concurrent issues queue on it and a
// rolled-back issue gives its number back.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export async function takeNextNumber(sequelize: Sequelize, transaction: Transaction, apiaryId: string, series: 'invoice' | 'credit-note'): Promise<number> {
  await sequelize.query(
    'INSERT INTO invoice_number_counters (apiary_id, series) VALUES (:apiaryId, :series) ON CONFLICT DO NOTHING',
    { replacements: { apiaryId, series }, transaction },
  );
  const [row] = await sequelize.query<{ last_number: number }>(
    'SELECT last_number FROM invoice_number_counters WHERE apiary_id = :apiaryId AND series = :series FOR UPDATE',
    { replacements: { apiaryId, series }, type: QueryTypes.SELECT, transaction },
  );
  const next = row.last_number + 1;
  await sequelize.query('UPDATE invoice_number_counters SET last_number = :next WHERE apiary_id = :apiaryId AND series = :series', {
    replacements: { apiaryId, series, next }, transaction,
  });
  return next;
}
