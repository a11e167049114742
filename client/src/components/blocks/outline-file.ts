// Reads an uploaded GeoJSON file into one polygon outline: a Polygon geometry, a Feature
// holding one, or a FeatureCollection whose first polygon is taken.
import type { GeoPolygon } from '@shared/schemas/common';

export function outlineFromGeoJson(text: string): GeoPolygon {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    throw new Error('The file is not valid JSON.');
  }
  const find = (value: unknown): GeoPolygon | null => {
    const v = value as { type?: string; geometry?: unknown; features?: unknown[]; coordinates?: unknown };
    if (v?.type === 'Polygon') return v as GeoPolygon;
    if (v?.type === 'MultiPolygon' && Array.isArray(v.coordinates) && v.coordinates.length === 1) return { type: 'Polygon', coordinates: v.coordinates[0] as GeoPolygon['coordinates'] };
    if (v?.type === 'Feature') return find(v.geometry);
    if (v?.type === 'FeatureCollection') for (const f of v.features ?? []) { const p = find(f); if (p) return p; }
    return null;
  };
  const polygon = find(parsed);
  if (!polygon) throw new Error('The file holds no polygon (GeoJSON Polygon, or a Feature with one).');
  return polygon;
}
