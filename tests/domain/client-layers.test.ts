// The client's layers as DEVELOPERS.md describes them: only client/src/api/ calls the
// server; components reach it through stores, composables or their page, and leave save
// state and the server's error messages to the composables (useSubmit, useAsync, useAction).
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

function vueFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return vueFiles(path);
    return entry.name.endsWith('.vue') ? [path] : [];
  });
}

/** Lines importing a runtime value (not `import type`) from the api layer. */
function apiValueImports(source: string): string[] {
  return source.split('\n').filter((line) => /^import (?!type\b).*from '@\/api\//.test(line));
}

function offendingFiles(): Map<string, string[]> {
  const found = new Map<string, string[]>();
  const add = (file: string, what: string) => found.set(file, [...(found.get(file) ?? []), what]);
  for (const file of vueFiles('client/src/components')) {
    for (const line of apiValueImports(readFileSync(file, 'utf8'))) add(file, line);
  }
  for (const file of [...vueFiles('client/src/components'), ...vueFiles('client/src/pages')]) {
    const source = readFileSync(file, 'utf8');
    if (/const (saving|busy|submitting) = ref\b/.test(source)) add(file, 'own saving flag');
    if (/\bfieldErrorsOf\(/.test(source)) add(file, 'fieldErrorsOf called directly');
  }
  return found;
}

function clientSources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return clientSources(path);
    return /\.(vue|ts)$/.test(entry.name) ? [path] : [];
  });
}

/** Lines that decide by a role themselves (a role key, or comparing or listing `.role`) instead of asking useCan(). */
function roleRules(source: string): string[] {
  return source.split('\n').filter((line) =>
    /['"](farm|apiary):(owner|manager|applicator|viewer|crew)['"]/.test(line) || /\.role\s*[!=]==|\.includes\([^)]*\.role\b/.test(line));
}

describe('client layers', () => {
  it('pages, components, layouts and composables take who may do what from the shared policies (useCan), not from role lists of their own', () => {
    // The session store alone turns the signed-in user's role into a role key and a side.
    const files = clientSources('client/src').filter((f) => !f.endsWith('stores/session.ts'));
    const strays = files.flatMap((file) => roleRules(readFileSync(file, 'utf8')).map((line) => `${file}: ${line.trim()}`));
    expect(strays).toEqual([]);
    // the check itself
    expect(roleRules("const canEdit = computed(() => ['farm:owner', 'farm:manager'].includes(session.roleKey));")).toHaveLength(1);
    expect(roleRules("const isOwner = computed(() => user.value?.role === 'owner');")).toHaveLength(1);
    expect(roleRules("const canEdit = useCan('blocks.update');")).toEqual([]);
  });

  it('components import nothing but types from the api layer; no page or component keeps its own saving flag or reads field errors by hand', () => {
    const strays = [...offendingFiles()].map(([file, what]) => `${file}: ${what.join('; ')}`);
    expect(strays).toEqual([]);
  });

  it('finds a stray when there is one (the check reads what it should)', () => {
    expect(apiValueImports("import { blocksApi } from '@/api/blocks';\nimport type { BlockDto } from '@/api/blocks';")).toEqual(["import { blocksApi } from '@/api/blocks';"]);
  });
});
