// A plausible value for a zod schema, read through its JSON Schema (zod's own
// toJSONSchema), and the paths of its fields, so a fuzz test can start from a body that
// passes validation and spoil one field at a time.
import { z, type ZodType } from 'zod';
import { randomUUID } from 'node:crypto';

export type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema | false;
  prefixItems?: JsonSchema[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  const?: unknown;
  enum?: unknown[];
  default?: unknown;
  format?: string;
  pattern?: string;
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
};

export interface SampleContext {
  /** A real id for a field such as blockId (undefined: a random one). */
  idFor(field: string): string | undefined;
  site: { lon: number; lat: number };
  /** The day before the test's today (YYYY-MM-DD), for fields that record what already happened. */
  yesterday: string;
}

export const toJsonSchema = (schema: ZodType): JsonSchema => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as JsonSchema;

/** The first option of a union that is not null. */
export function mainOption(node: JsonSchema): JsonSchema {
  const options = node.anyOf ?? node.oneOf;
  if (!options) return node;
  return mainOption(options.find((o) => o.type !== 'null' && o.const !== '') ?? options[0]);
}

const patternCandidates = ['USD', 'petal-fall', '03-01', '123-45', 'a', 'A', '1', 'x'];
const laterField = /(end|to|until|depart|petalFall)/i;
/** Fields that record what already happened: a day before the test's today. */
const pastField = /(delivered|picked|checked|applied|received|recorded)/i;

function sampleString(node: JsonSchema, field: string, ctx: SampleContext): string {
  const later = laterField.test(field);
  const past = pastField.test(field);
  switch (node.format) {
    case 'uuid': return ctx.idFor(field) ?? randomUUID();
    case 'date': return past ? ctx.yesterday : later ? '2027-04-25' : '2027-04-12';
    case 'date-time': return past ? `${ctx.yesterday}T08:00:00Z` : later ? '2027-04-12T12:00:00Z' : '2027-04-12T08:00:00Z';
    case 'email': return 'fuzz-sample@example.test';
  }
  if (/email/i.test(field)) return 'fuzz-sample@example.test';
  if (node.pattern) {
    const re = new RegExp(node.pattern);
    const hit = patternCandidates.find((c) => re.test(c));
    if (hit) return hit;
  }
  if (/zone/i.test(field)) return 'America/Los_Angeles';
  const text = 'Fuzz sample text';
  const min = node.minLength ?? 0;
  const max = node.maxLength ?? 200;
  return (text.length < min ? text.padEnd(min, 'x') : text).slice(0, Math.max(max, min));
}

function sampleNumber(node: JsonSchema): number {
  const lo = node.minimum ?? (node.exclusiveMinimum !== undefined ? node.exclusiveMinimum + 1 : 0);
  const hi = node.maximum ?? node.exclusiveMaximum ?? lo + 10;
  const value = Math.min(Math.max(lo, 1), hi);
  return node.type === 'integer' ? Math.ceil(value) : value;
}

export function sample(node: JsonSchema, field: string, ctx: SampleContext): unknown {
  if (node.const !== undefined) return node.const;
  if (node.enum) return node.enum[0];
  if (node.anyOf || node.oneOf) return sample(mainOption(node), field, ctx);
  if (node.allOf) return sample(node.allOf[0], field, ctx);
  const type = Array.isArray(node.type) ? node.type.find((t) => t !== 'null') : node.type;
  if (node.properties?.type?.const === 'Point') return { type: 'Point', coordinates: [ctx.site.lon, ctx.site.lat] };
  if (node.properties?.type?.const === 'Polygon') return { type: 'Polygon', coordinates: [squareRing(ctx.site.lon, ctx.site.lat, 0.002)] };
  switch (type) {
    case 'object':
      return Object.fromEntries(Object.entries(node.properties ?? {}).map(([key, child]) => [key, sample(child, key, ctx)]));
    case 'array': {
      if (node.prefixItems) return node.prefixItems.map((child) => sample(child, field, ctx));
      const count = Math.max(node.minItems ?? 0, 1);
      return Array.from({ length: count }, () => (node.items ? sample(node.items, field.replace(/s$/, ''), ctx) : null));
    }
    case 'string': return sampleString(node, field, ctx);
    case 'number': case 'integer': return sampleNumber(node);
    case 'boolean': return true;
    case 'null': return null;
    default: return node.default ?? null;
  }
}

export function squareRing(lon: number, lat: number, d: number): [number, number][] {
  return [[lon, lat], [lon + d, lat], [lon + d, lat + d], [lon, lat + d], [lon, lat]];
}

export type FieldPath = Array<string | number>;

/** The fields of a schema down to `depth`, as paths into a sampled value, with the schema node of each. */
export function fieldPaths(node: JsonSchema, depth = 3, prefix: FieldPath = []): Array<{ path: FieldPath; node: JsonSchema }> {
  const out: Array<{ path: FieldPath; node: JsonSchema }> = [];
  const main = mainOption(node);
  if (prefix.length) out.push({ path: prefix, node: main });
  if (prefix.length >= depth) return out;
  if (main.properties?.type?.const === 'Point' || main.properties?.type?.const === 'Polygon') return out;
  if (main.properties) for (const [key, child] of Object.entries(main.properties)) out.push(...fieldPaths(child, depth, [...prefix, key]));
  else if (main.type === 'array' && main.items && typeof main.items === 'object' && !main.prefixItems) out.push(...fieldPaths(main.items, depth, [...prefix, 0]));
  return out;
}

/** A copy of `value` with the field at `path` replaced. */
export function withField(value: unknown, path: FieldPath, replacement: unknown): unknown {
  if (!path.length) return replacement;
  const [head, ...rest] = path;
  const base = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  base[head] = withField(base[head] ?? (typeof rest[0] === 'number' ? [] : {}), rest, replacement);
  return base;
}
