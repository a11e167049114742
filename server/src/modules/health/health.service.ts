// Whether the app can serve: the database answers.
import type { AppContext } from '../../context.js';

export function createHealthService(ctx: AppContext) {
  return {
    async databaseAnswers(): Promise<boolean> {
      try {
        await ctx.sequelize.authenticate();
        return true;
      } catch {
        return false;
      }
    },
  };
}

export type HealthService = ReturnType<typeof createHealthService>;
