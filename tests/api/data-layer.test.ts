// The data layer as DEVELOPERS.md describes it, counted over the source: every table the
// migrations create (except the libraries' own) has a model with that tableName, every
// model is used by a feature module, and SQL text stands in server/src/modules/ only in
// `*.queries.ts` files. Reads files only; no database needed.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import ts from 'typescript';
import { Sequelize } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { defineModels } from '../../server/src/db/models/index.js';

const root = join(import.meta.dirname, '../..');
const migrationsDir = join(root, 'server/src/db/migrations');
const modulesDir = join(root, 'server/src/modules');

/** Tables owned by libraries: express-session's store, the socket.io adapter, umzug's log. */
const LIBRARY_TABLES = ['user_sessions', 'socket_io_attachments', 'schema_migrations'];

// Still to convert. Each list only shrinks: an entry that is no longer true fails the test
// (soft assertions, so one run reports every list's changes).
/** App-owned tables that have no model yet. */
const TABLES_WITHOUT_MODEL_YET: string[] = [];
/** Models no feature module uses yet. */
const MODELS_NOT_USED_YET: string[] = [];
/** Modules with a routes file but no controller yet. */
const MODULES_WITHOUT_CONTROLLER_YET: string[] = [];
/** Module files (relative to server/src/modules) that still hold SQL text outside a `.queries.ts`. */
const FILES_WITH_SQL_YET: string[] = [
];

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => join(e.parentPath, e.name))
    .sort();
}

function migrationTables(): string[] {
  const tables = new Set<string>();
  for (const file of filesUnder(migrationsDir)) {
    for (const m of readFileSync(file, 'utf8').matchAll(/\bCREATE\s+TABLE\s+(?:IF\s+NOT\s+EXISTS\s+)?"?([a-z_][a-z0-9_]*)"?/gi)) tables.add(m[1].toLowerCase());
  }
  return [...tables].sort();
}

/** Every foreign key column the migrations declare (`column … REFERENCES table`), with the table it points at. */
function migrationForeignKeys(): Array<{ table: string; column: string; references: string }> {
  const keys: Array<{ table: string; column: string; references: string }> = [];
  for (const file of filesUnder(migrationsDir)) {
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(/\bCREATE\s+TABLE\s+(?:IF\s+NOT\s+EXISTS\s+)?"?([a-z_][a-z0-9_]*)"?\s*\(([\s\S]*?)\n\s*\);/gi)) {
      for (const r of m[2].matchAll(/^\s*([a-z_][a-z0-9_]*)\s[^\n]*?\bREFERENCES\s+([a-z_][a-z0-9_]*)/gim)) keys.push({ table: m[1], column: r[1], references: r[2] });
    }
    for (const m of text.matchAll(/\bALTER\s+TABLE\s+([a-z_][a-z0-9_]*)([^;]*);/gi)) {
      for (const r of m[2].matchAll(/\bADD\s+COLUMN\s+([a-z_][a-z0-9_]*)[^,;]*?\bREFERENCES\s+([a-z_][a-z0-9_]*)/gi)) keys.push({ table: m[1], column: r[1], references: r[2] });
    }
  }
  return keys;
}

const camelCase = (column: string) => column.replace(/_([a-z0-9])/g, (_, c: string) => c.toUpperCase());

// Defining models does not connect; the URL is never dialled.
const models = defineModels(new Sequelize('postgres://nobody@127.0.0.1:9/none', { dialect: 'postgres', logging: false }));
const modelTables = new Map(Object.entries(models).map(([name, model]) => [String(model.getTableName()), name]));

// SQL as it is written in this codebase: upper-case keywords, and the statement shapes in any case.
const sqlPatterns = [
  /\bSELECT\b/, /\bINSERT\b/, /\bUPDATE\s+\w+\s+SET\b/, /\bDELETE\s+FROM\b/, /\bWITH\s+\w+\s+AS\s*\(/,
  /\binsert\s+into\s+\w/i, /\bdelete\s+from\s+\w/i, /\bupdate\s+\w+\s+set\s+\w+\s*=/i,
];

/** The string and template literal pieces of a TypeScript file, with their line numbers. */
function stringLiterals(file: string): Array<{ line: number; text: string }> {
  const source = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  const found: Array<{ line: number; text: string }> = [];
  const visit = (node: ts.Node) => {
    if (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node) || ts.isTemplateHead(node) || ts.isTemplateMiddle(node) || ts.isTemplateTail(node)) {
      found.push({ line: source.getLineAndCharacterOfPosition(node.getStart()).line + 1, text: node.text });
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

function sqlOutsideQueryFiles(): Map<string, string[]> {
  const byFile = new Map<string, string[]>();
  for (const file of filesUnder(modulesDir)) {
    if (file.endsWith('.queries.ts')) continue;
    for (const { line, text } of stringLiterals(file)) {
      if (!sqlPatterns.some((p) => p.test(text))) continue;
      const rel = relative(modulesDir, file);
      byFile.set(rel, [...(byFile.get(rel) ?? []), `${rel}:${line}: ${text.trim().split('\n')[0].slice(0, 80)}`]);
    }
  }
  return byFile;
}

/** Import lines that bring a model class in as a value (a static, process-wide class) rather than as a type. */
function modelValueImports(text: string): string[] {
  return [...text.matchAll(/^import\s+(?!type\b)([^;]*?)\s+from\s+'[^']*\.model\.js'/gm)]
    .filter((m) => /\{([^}]*)\}/.exec(m[1])?.[1].split(',').some((name) => name.trim() && !name.trim().startsWith('type ')) ?? true)
    .map((m) => m[0]);
}

function modelsUsedByModules(): Set<string> {
  const text = filesUnder(modulesDir).map((f) => readFileSync(f, 'utf8')).join('\n');
  const used = new Set<string>();
  for (const name of Object.keys(models)) {
    const direct = new RegExp(`\\bmodels\\.${name}\\b`);
    // const { Block, BloomWindow: Windows } = ctx.models;
    const destructured = new RegExp(`\\{[^}]*\\b${name}\\b[^}]*\\}\\s*=\\s*(?:\\w+\\.)*models\\b`);
    if (direct.test(text) || destructured.test(text)) used.add(name);
  }
  return used;
}

/** Which feature modules each module imports from (`../<other>/…` in server/src/modules/<module>/). */
function moduleImports(): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const file of filesUnder(modulesDir)) {
    const module = relative(modulesDir, file).split('/')[0];
    if (!module.includes('.')) {
      const uses = graph.get(module) ?? new Set<string>();
      for (const m of readFileSync(file, 'utf8').matchAll(/from '\.\.\/([a-z-]+)\//g)) if (m[1] !== module) uses.add(m[1]);
      graph.set(module, uses);
    }
  }
  return graph;
}

function importCycles(graph: Map<string, Set<string>>): string[] {
  const cycles = new Set<string>();
  const walk = (path: string[]) => {
    for (const next of graph.get(path.at(-1)!) ?? []) {
      if (path.includes(next)) cycles.add([...path.slice(path.indexOf(next)), next].join(' -> '));
      else walk([...path, next]);
    }
  };
  for (const module of graph.keys()) walk([module]);
  return [...cycles].sort();
}

describe('the data layer', () => {
  const appTables = migrationTables().filter((t) => !LIBRARY_TABLES.includes(t));

  it('reads the tables the migrations create', () => {
    // Tables every version of the schema has had since the first migrations.
    expect(appTables).toEqual(expect.arrayContaining(['organizations', 'users', 'blocks', 'bloom_windows', 'spray_plans', 'invoices']));
    expect(appTables).not.toContain('user_sessions');
  });

  it('has a model for every app-owned table, with a matching tableName', () => {
    const missing = appTables.filter((t) => !modelTables.has(t) && !TABLES_WITHOUT_MODEL_YET.includes(t));
    expect.soft(missing, 'tables with no model').toEqual([]);
    const stale = TABLES_WITHOUT_MODEL_YET.filter((t) => modelTables.has(t) || !appTables.includes(t));
    expect.soft(stale, 'TABLES_WITHOUT_MODEL_YET lists tables that have a model now (or are gone): remove them').toEqual([]);
  });

  it('has no model for a table the migrations do not create', () => {
    const orphans = [...modelTables.keys()].filter((t) => !appTables.includes(t));
    expect(orphans).toEqual([]);
  });

  it('declares every foreign key of the migrations as a belongsTo association to the table it references', () => {
    const keys = migrationForeignKeys().filter((k) => !LIBRARY_TABLES.includes(k.table));
    // The migrations have had dozens of foreign keys since the first ones (the check sees them at all).
    expect(keys.length).toBeGreaterThan(50);
    expect(keys).toContainEqual({ table: 'invoices', column: 'agreement_id', references: 'agreements' });
    const missing = keys.filter(({ table, column, references }) => {
      const name = modelTables.get(table);
      if (!name) return false; // reported by the tableName check above
      return !Object.values(models[name as keyof typeof models].associations).some((a) =>
        a.associationType === 'BelongsTo' && a.foreignKey === camelCase(column) && a.target.getTableName() === references);
    }).map((k) => `${k.table}.${k.column} -> ${k.references}`);
    expect(missing, 'foreign keys with no belongsTo in server/src/db/associations.ts').toEqual([]);
  });

  it('uses every model in at least one feature module (ctx.models.X, or taken from the registry)', () => {
    const used = modelsUsedByModules();
    const unused = Object.keys(models).filter((n) => !used.has(n) && !MODELS_NOT_USED_YET.includes(n));
    expect.soft(unused, 'models no feature module uses').toEqual([]);
    const stale = MODELS_NOT_USED_YET.filter((n) => used.has(n) || !(n in models));
    expect.soft(stale, 'MODELS_NOT_USED_YET lists models that are used now: remove them').toEqual([]);
  });

  it('keeps SQL text in server/src/modules/ to *.queries.ts files', () => {
    const found = sqlOutsideQueryFiles();
    const lines = [...found].filter(([file]) => !FILES_WITH_SQL_YET.includes(file)).flatMap(([, l]) => l);
    expect.soft(lines, 'SQL outside *.queries.ts').toEqual([]);
    const stale = FILES_WITH_SQL_YET.filter((f) => !found.has(f));
    expect.soft(stale, 'FILES_WITH_SQL_YET lists files without SQL now: remove them').toEqual([]);
  });

  it('runs raw SQL through the one helper (server/src/db/query-rows.ts); only migrations call sequelize.query themselves', () => {
    const serverDir = join(root, 'server/src');
    const callers = filesUnder(serverDir)
      .filter((f) => !f.endsWith('/db/query-rows.ts') && !f.includes('/db/migrations/'))
      .filter((f) => /\.query\s*[<(]/.test(readFileSync(f, 'utf8').replace(/req\.query/g, '')))
      .map((f) => relative(root, f));
    expect(callers).toEqual([]);
    // the check itself: the helper's own call is seen
    expect(/\.query\s*[<(]/.test(readFileSync(join(serverDir, 'db/query-rows.ts'), 'utf8'))).toBe(true);
  });

  it('has modules use each other in one direction only (no import cycle between feature modules)', () => {
    const graph = moduleImports();
    expect(graph.get('bloom')).toContain('blocks'); // the check sees imports at all
    expect(importCycles(graph)).toEqual([]);
  });

  it('finds a cycle where there is one (the check itself)', () => {
    expect(importCycles(new Map([['a', new Set(['b'])], ['b', new Set(['a'])]]))).toEqual(['a -> b -> a', 'b -> a -> b']);
  });

  it('gives every module with routes a controller (routes -> controller -> service -> model)', () => {
    const routed = readdirSync(modulesDir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name)
      .filter((m) => filesUnder(join(modulesDir, m)).some((f) => f.endsWith(`/${m}.routes.ts`)));
    const has = (m: string) => filesUnder(join(modulesDir, m)).some((f) => f.endsWith(`/${m}.controller.ts`));
    expect(routed.length).toBeGreaterThan(10);
    expect.soft(routed.filter((m) => !has(m) && !MODULES_WITHOUT_CONTROLLER_YET.includes(m)), 'modules without a controller').toEqual([]);
    expect.soft(MODULES_WITHOUT_CONTROLLER_YET.filter((m) => has(m) || !routed.includes(m)), 'MODULES_WITHOUT_CONTROLLER_YET lists modules that have one now: remove them').toEqual([]);
  });

  it('imports model classes only as types outside the models folder (code uses the app\'s registry, ctx.models)', () => {
    const dirs = ['server/src', 'seed', 'tests'].map((d) => join(root, d));
    const found = dirs.flatMap(filesUnder)
      .filter((f) => !f.includes('/server/src/db/models/'))
      .flatMap((f) => modelValueImports(readFileSync(f, 'utf8')).map((line) => `${relative(root, f)}: ${line}`));
    expect(found).toEqual([]);
    // the check itself
    expect(modelValueImports("import { Organization } from '../../db/models/organization.model.js';")).toHaveLength(1);
    expect(modelValueImports("import { type Block, User } from './user.model.js';")).toHaveLength(1);
    expect(modelValueImports("import type { Block } from './block.model.js';\nimport { type User } from './user.model.js';")).toEqual([]);
  });

  it('finds SQL text where it stands (the check itself)', () => {
    // A file we know holds SQL on purpose: the raw-query helper's own documentation does not count,
    // so check the scanner on a literal of this very file.
    const here = stringLiterals(join(import.meta.dirname, 'data-layer.test.ts'));
    expect(here.some((l) => sqlPatterns.some((p) => p.test(l.text)) && l.text.startsWith('SELECT id FROM blocks'))).toBe(true);
  });
});

// Scanned by the last check above: a sample of SQL text in a string literal.
export const sampleSql = 'SELECT id FROM blocks WHERE farm_id = $1';
