// Every code a person could meet (states, kinds, answers, history entries) has words of its
// own in shared/labels, and the words never read like a code.
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { labelSets, labelOf } from '../../shared/labels/index.js';
import { requestEventSet } from '../../shared/labels/requests.js';
import { amendmentStateSet } from '../../shared/labels/agreements.js';
import { queueSet } from '../../shared/labels/jobs.js';
import { queueNames } from '../../server/src/jobs/queue-names.js';

const kebabCode = /\b[a-z]+(?:-[a-z]+)+\b/;
const camelKey = /\b[a-z]+[A-Z][A-Za-z]*\b/;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : path.endsWith('.ts') ? [path] : [];
  });
}

describe('label sets', () => {
  for (const set of labelSets) {
    describe(set.title, () => {
      it('has words for every code, and no words for codes that do not exist', () => {
        for (const code of set.codes) expect(set.labels[code], `${set.title}: no label for "${code}"`).toBeTruthy();
        expect(Object.keys(set.labels).sort()).toEqual([...set.codes].sort());
      });
      it('words read as words: no kebab-case code, camelCase key or the word "cents"', () => {
        for (const code of set.codes) {
          const words = set.labels[code];
          // "LD50" and "µg/bee" are the trade's own terms; a hyphen inside a sentence word is fine when it is not a code of any set.
          expect(words, `${set.title}: "${code}"`).not.toMatch(camelKey);
          expect(words.toLowerCase(), `${set.title}: "${code}"`).not.toContain('cents');
          const hyphenated = words.match(kebabCode)?.[0];
          if (hyphenated) expect(labelSets.some((s) => (s.codes as readonly string[]).includes(hyphenated)), `${set.title}: "${words}" contains the code "${hyphenated}"`).toBe(false);
        }
      });
    });
  }

  it('an unknown code reads as "Unknown", never as the code itself', () => {
    expect(labelOf(amendmentStateSet, 'not-a-state')).toBe('Unknown');
    expect(labelOf(amendmentStateSet, 'proposed')).toBe('Waiting for the other side');
  });

  it('the request history has words for every action the server records', () => {
    const recorded = new Set<string>();
    for (const file of sourceFiles('server/src/modules')) {
      // The fifth argument is the action: a literal, a choice of literals, or `amendment-${state}`.
      for (const call of readFileSync(file, 'utf8').matchAll(/recordRequestEvent\(ctx, t, [^,]+, [^,]+, (.+?), \{/g)) {
        for (const literal of call[1].matchAll(/'([a-z-]+)'/g)) if (!call[1].includes(`=== '${literal[1]}'`)) recorded.add(literal[1]);
        if (call[1].includes('`amendment-${')) for (const state of amendmentStateSet.codes.filter((c) => c !== 'proposed')) recorded.add(`amendment-${state}`);
      }
    }
    expect(recorded.size).toBeGreaterThan(10);
    for (const action of recorded) expect(requestEventSet.codes, `history action "${action}" has no words`).toContain(action);
  });

  it('names every background queue the server has', () => {
    expect([...queueSet.codes].sort()).toEqual(Object.values(queueNames).sort());
  });
});
