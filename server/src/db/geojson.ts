// Sequelize reads PostGIS geometry as GeoJSON with a `crs` member naming EPSG:4326; the
// API speaks plain GeoJSON (RFC 7946 has no crs, and every place here is SRID 4326).
export function plainGeoJson<T extends object>(geometry: T): T;
export function plainGeoJson<T extends object>(geometry: T | null): T | null;
export function plainGeoJson<T extends object>(geometry: T | null): T | null {
  if (!geometry) return null;
  const { crs: _crs, ...plain } = geometry as T & { crs?: unknown };
  return plain as T;
}
