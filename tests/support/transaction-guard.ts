// Records every query that runs while a managed transaction's callback is running but is
// not given that transaction: such a query takes another pool connection, does not see the
// transaction's own writes and can wait on the transaction's own row locks. The callback
// runs in an AsyncLocalStorage context, so a query is "inside" when it is started from it.
import { AsyncLocalStorage } from 'node:async_hooks';
import { Sequelize, type Transaction } from 'sequelize';

export interface StrayQuery { sql: string; from: string[] }

type TransactionMethod = (this: Sequelize, ...args: unknown[]) => Promise<unknown>;
type QueryMethod = (this: Sequelize, sql: unknown, options?: { transaction?: Transaction | null }) => Promise<unknown>;

/** Starts recording; `stop()` puts Sequelize back as it was and gives what was recorded. */
export function guardTransactions(): { strays: StrayQuery[]; stop(): StrayQuery[] } {
  const inside = new AsyncLocalStorage<Transaction>();
  const strays: StrayQuery[] = [];
  const proto = Sequelize.prototype as unknown as { transaction: TransactionMethod; query: QueryMethod };
  const { transaction, query } = proto;
  proto.transaction = function (this: Sequelize, ...args: unknown[]) {
    const work = args.find((a) => typeof a === 'function') as ((t: Transaction) => Promise<unknown>) | undefined;
    if (!work) return transaction.apply(this, args);
    const options = args.find((a) => typeof a === 'object' && a !== null) ?? {};
    return transaction.call(this, options, (t: unknown) => inside.run(t as Transaction, () => work(t as Transaction)));
  };
  proto.query = function (this: Sequelize, sql, options) {
    if (inside.getStore() && !options?.transaction) {
      const text = typeof sql === 'string' ? sql : String((sql as { query?: string })?.query ?? sql);
      const from = (new Error().stack ?? '').split('\n').filter((l) => l.includes('/server/src/')).map((l) => l.trim()).slice(0, 4);
      strays.push({ sql: text.replace(/\s+/g, ' ').slice(0, 160), from });
    }
    return query.call(this, sql, options);
  };
  return {
    strays,
    stop() {
      proto.transaction = transaction;
      proto.query = query;
      return strays;
    },
  };
}
