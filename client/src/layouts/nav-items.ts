// The navigation, by side and role. A user sees only what their role may open; the
// router guard enforces the same rule. Features add their entries.
import type { RoleKey } from '@shared/roles';
import { can, type PolicyAction } from '@shared/policies/index';
import type { RouteName, Side } from '@/router/routes';

export interface NavItem {
  label: string;
  icon: string;
  to: RouteName;
  sides: Side[];
  can?: PolicyAction;
}

export const navItems: NavItem[] = [
  { label: 'Season overview', icon: 'pi pi-compass', to: 'home', sides: ['farm', 'apiary', 'admin'] },
  { label: 'Blocks', icon: 'pi pi-th-large', to: 'blocks', sides: ['farm'] },
  { label: 'Weather', icon: 'pi pi-cloud', to: 'weather-stations', sides: ['farm'] },
  { label: 'Stage thresholds', icon: 'pi pi-sliders-h', to: 'stage-thresholds', sides: ['farm', 'admin'] },
  { label: 'Sprays', icon: 'pi pi-filter', to: 'sprays', sides: ['farm'] },
  { label: 'Hive requests', icon: 'pi pi-send', to: 'requests', sides: ['farm', 'apiary'] },
  { label: 'Agreements', icon: 'pi pi-file-check', to: 'agreements', sides: ['farm', 'apiary'] },
  { label: 'Placements', icon: 'pi pi-map-marker', to: 'placements', sides: ['farm', 'apiary'] },
  { label: 'Yards', icon: 'pi pi-home', to: 'yards', sides: ['apiary'] },
  { label: 'Spray alerts', icon: 'pi pi-bell', to: 'alerts', sides: ['farm', 'apiary'] },
  { label: 'Invoices', icon: 'pi pi-receipt', to: 'invoices', sides: ['farm', 'apiary'], can: 'invoices.read' },
  { label: 'Season timeline', icon: 'pi pi-chart-bar', to: 'season-timeline', sides: ['farm', 'apiary'] },
  { label: 'Season map', icon: 'pi pi-map', to: 'season-map', sides: ['farm', 'apiary'] },
  { label: 'Members', icon: 'pi pi-users', to: 'members', sides: ['farm', 'apiary'], can: 'organization.invite' },
];

export function navFor(side: Side | null, role: RoleKey | null): NavItem[] {
  if (!side || !role) return [];
  return navItems.filter((item) => item.sides.includes(side) && (!item.can || can(role, item.can)));
}
