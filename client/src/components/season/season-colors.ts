// One meaning per colour across the timeline, the map and their legends, taken from the
// theme's ramps (canvas and Leaflet paths need real colours, not CSS variables).
import { ember, heather, moss, petal, river, rust, straw } from '@/plugins/theme-preset';

export interface LegendEntry {
  key: string;
  label: string;
  fill: string;
  stroke: string;
  /** Dashed outline, for what is planned rather than happening. */
  dashed?: boolean;
  shape: 'band' | 'area' | 'point' | 'mark';
}

export const timelineLegend: LegendEntry[] = [
  { key: 'bloom', label: 'Bloom window', fill: petal[200], stroke: petal[600], shape: 'band' },
  { key: 'placement-scheduled', label: 'Colonies expected', fill: river[100], stroke: river[600], dashed: true, shape: 'band' },
  { key: 'placement-delivered', label: 'Colonies on site', fill: moss[500], stroke: moss[800], shape: 'band' },
  { key: 'placement-picked-up', label: 'Colonies picked up', fill: straw[300], stroke: straw[600], shape: 'band' },
  { key: 'spray', label: 'Spray window', fill: ember[500], stroke: ember[800], shape: 'band' },
  { key: 'spray-residual', label: 'Residual time after spraying', fill: ember[200], stroke: ember[500], dashed: true, shape: 'band' },
  { key: 'alert', label: 'Alert raised', fill: rust[600], stroke: rust[900], shape: 'mark' },
];

export const mapLegend: LegendEntry[] = [
  { key: 'block:in-bloom', label: 'Block in bloom', fill: petal[300], stroke: petal[700], shape: 'area' },
  { key: 'block:before-bloom', label: 'Block before bloom', fill: moss[100], stroke: moss[700], shape: 'area' },
  { key: 'block:after-bloom', label: 'Block past petal fall', fill: straw[300], stroke: straw[700], shape: 'area' },
  { key: 'block:no-forecast', label: 'Block without a bloom forecast', fill: straw[100], stroke: straw[600], dashed: true, shape: 'area' },
  { key: 'spray-buffer:spray-active', label: 'Spray buffer, under way', fill: rust[200], stroke: rust[600], shape: 'area' },
  { key: 'spray-buffer:spray-planned', label: 'Spray buffer, planned', fill: ember[100], stroke: ember[600], dashed: true, shape: 'area' },
  { key: 'drop-site:colonies-on-site', label: 'Drop site with colonies', fill: moss[600], stroke: moss[900], shape: 'point' },
  { key: 'drop-site:scheduled', label: 'Drop site, colonies expected', fill: river[300], stroke: river[800], shape: 'point' },
  { key: 'drop-site:no-colonies', label: 'Drop site, none planned', fill: straw[0], stroke: straw[700], shape: 'point' },
  { key: 'yard:yard', label: 'Bee yard', fill: heather[500], stroke: heather[800], shape: 'point' },
];

const byKey = new Map([...timelineLegend, ...mapLegend].map((e) => [e.key, e]));

export function legendEntry(key: string): LegendEntry {
  return byKey.get(key) ?? { key, label: 'Other', fill: straw[300], stroke: straw[700], shape: 'area' };
}
