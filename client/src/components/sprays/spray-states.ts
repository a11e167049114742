// Words for a spray plan's states.
import type { SprayState } from '@shared/schemas/sprays';

export const sprayStateLabels: Record<SprayState, string> = { planned: 'Planned', applied: 'Applied', cancelled: 'Cancelled' };
