/**
 * Safe YAML loading with positions, shared by the rule base, answers files, plan files and audit
 * records. Every problem of a file is collected (not only the first); alias expansion is bounded;
 * keys that could reach an object's prototype are refused.
 */
import { isMap, isPair, isScalar, isSeq, LineCounter, parseDocument, type Document, type Node } from 'yaml';
import type { Problem } from '../problems.js';

export interface LoadedYaml {
  file: string;
  source: string;
  value: unknown;
  problems: Problem[];
  doc: Document;
  lines: LineCounter;
}

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
/** Bound on alias expansion ("billion laughs"): more than this many alias nodes is an error. */
export const MAX_ALIASES = 100;

export function loadYaml(source: string, file: string): LoadedYaml {
  const lines = new LineCounter();
  const doc = parseDocument(source, { lineCounter: lines, uniqueKeys: true, prettyErrors: false, strict: true });
  const problems: Problem[] = [];
  for (const e of [...doc.errors, ...doc.warnings]) {
    const pos = lines.linePos(e.pos[0]);
    problems.push({ code: 'yaml-syntax', file, line: pos.line, col: pos.col, message: e.message.split('\n')[0] });
  }
  let value: unknown = undefined;
  if (doc.errors.length === 0) {
    walkKeys(doc.contents as Node | null, (keyNode, key) => {
      if (FORBIDDEN_KEYS.has(key)) {
        const pos = keyNode.range ? lines.linePos(keyNode.range[0]) : undefined;
        problems.push({ code: 'unknown-key', file, line: pos?.line, col: pos?.col, message: `the key '${key}' is not allowed` });
      }
    });
    if (problems.length === 0) {
      try {
        value = doc.toJS({ maxAliasCount: MAX_ALIASES });
      } catch (err) {
        problems.push({ code: 'yaml-syntax', file, line: 1, col: 1, message: err instanceof Error ? err.message : String(err) });
      }
    }
  }
  return { file, source, value, problems, doc, lines };
}

function walkKeys(node: Node | null | undefined, visit: (keyNode: Node, key: string) => void): void {
  if (!node) return;
  if (isMap(node)) {
    for (const item of node.items) {
      if (isPair(item)) {
        if (isScalar(item.key)) visit(item.key, String(item.key.value));
        walkKeys(item.value as Node, visit);
      }
    }
  } else if (isSeq(node)) {
    for (const item of node.items) walkKeys(item as Node, visit);
  }
}

/**
 * The 1-based line and column of the value at `path`, or of its nearest existing ancestor.
 * With `key: true`, the position of the key naming the last path element (for unknown keys).
 */
export function positionOf(loaded: LoadedYaml, path: readonly (string | number)[], opts: { key?: boolean } = {}): { line: number; col: number } {
  let node: unknown = loaded.doc.contents;
  let best: Node | undefined = node as Node | undefined;
  for (let i = 0; i < path.length; i++) {
    const seg = path[i];
    let next: unknown = undefined;
    if (isMap(node)) {
      const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(seg));
      if (pair) {
        if (opts.key && i === path.length - 1) next = pair.key;
        else next = pair.value ?? pair.key;
      }
    } else if (isSeq(node) && typeof seg === 'number') {
      next = node.items[seg];
    } else if (isSeq(node) && /^\d+$/.test(String(seg))) {
      next = node.items[Number(seg)];
    }
    if (next === undefined || next === null) break;
    node = next;
    best = next as Node;
  }
  const offset = best?.range?.[0] ?? 0;
  const p = loaded.lines.linePos(offset);
  return { line: p.line, col: p.col };
}
