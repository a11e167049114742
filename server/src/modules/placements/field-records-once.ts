// The Idempotency-Key header on field-step routes: a phone's outbox may send one record
// several times (a lost answer, a retry on reconnect, two tabs). The first request with a
// key claims it (a unique row per user and key); its answer is stored before it is sent,
// and every repeat gets that same answer back and changes nothing. A repeat that arrives
// while the first is still running waits for its answer. A key reused for a different
// request is refused. Server errors (5xx) release the key so the record can be sent again.
import type { RequestHandler, Response } from 'express';
import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import { currentUser } from '../../middleware/authenticate.js';
import { keyUsedElsewhere, readIdempotencyKey, requestHash } from '../../middleware/idempotency-key.js';
import { createError } from '../../errors/create-error.js';
import type { IdempotencyKey } from '../../db/models/idempotency-key.model.js';

/** How long a claimed key without an answer is waited for before it is taken as abandoned. */
const abandonedAfterMs = 2 * 60_000;
const waitForFirstMs = 20_000;
const pollMs = 100;

function replay(res: Response, row: IdempotencyKey) {
  res.status(row.responseStatus!).set('Idempotent-Replayed', 'true').json(row.responseBody);
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Mount after the body (and file) is parsed and validated, before the handler. */
export function idempotent(ctx: AppContext): RequestHandler {
  const { IdempotencyKey } = ctx.models;

  async function claim(userId: string, key: string, method: string, path: string, hash: string): Promise<IdempotencyKey | 'claimed'> {
    try {
      await IdempotencyKey.create({ userId, key, method, path, requestHash: hash });
      return 'claimed';
    } catch (err) {
      if (!(err instanceof UniqueConstraintError)) throw err;
    }
    const deadline = Date.now() + waitForFirstMs;
    for (;;) {
      const row = await IdempotencyKey.findOne({ where: { userId, key } });
      if (!row) return claim(userId, key, method, path, hash); // released after a server error
      if (row.requestHash !== hash) {
        throw keyUsedElsewhere();
      }
      if (row.completedAt) return row;
      if (Date.now() - row.startedAt.getTime() > abandonedAfterMs) {
        const [taken] = await IdempotencyKey.update({ startedAt: new Date() }, { where: { id: row.id, completedAt: null, startedAt: row.startedAt } });
        if (taken === 1) return 'claimed';
      }
      if (Date.now() > deadline) throw createError('conflict', 'This record is still being saved; try again in a moment.', 409);
      await sleep(pollMs);
    }
  }

  return async (req, res, next) => {
    const key = readIdempotencyKey(req);
    if (key === undefined) return next();
    const userId = currentUser(req).id;
    const path = req.originalUrl.split('?')[0];
    const hash = requestHash(req.method, path, req.body, req.file);
    const outcome = await claim(userId, key, req.method, path, hash);
    if (outcome !== 'claimed') return replay(res, outcome);

    // Keep the answer before it leaves, so a repeat right after it finds it.
    const send = res.json.bind(res);
    res.json = ((body: unknown) => {
      const done = res.statusCode >= 500
        ? IdempotencyKey.destroy({ where: { userId, key } })
        : IdempotencyKey.update({ responseStatus: res.statusCode, responseBody: (body ?? null) as object | null, completedAt: new Date() }, { where: { userId, key } });
      done.then(() => send(body), (err: unknown) => { ctx.logger.error({ err }, 'idempotency key not stored'); send(body); });
      return res;
    }) as Response['json'];
    next();
  };
}
