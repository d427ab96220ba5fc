// The per-folder "may import" table of docs/architecture.md, read from the page and checked
// against an import graph (test/architecture.test.ts runs it on the sources and on a made-up
// graph with an upward import, to show that it fails).
import { posix } from "node:path";

/** One row: the folders or files it covers (paths under server/src) and what they may import. */
export interface LayerRow {
  covers: string[];
  mayImport: string[];
}

/** One import of a file: a path under server/src (`model/types.ts`), a package (`chevrotain`),
 * or a file outside server/src by its path from the repository root (`package.json`). */
export interface ImportEdge {
  from: string;
  to: string;
}

/** The rows of the table whose first cell names paths under server/src; every backticked name
 * of the last cell is an entry (the rest is comment). */
export function readLayerTable(markdown: string): LayerRow[] {
  const rows: LayerRow[] = [];
  for (const line of markdown.split("\n")) {
    if (!line.startsWith("| `server/src/")) continue;
    const cells = line.split("|").slice(1, -1);
    const names = (cell: string) => [...cell.matchAll(/`([^`]+)`/g)].map((m) => m[1]!);
    const covers = names(cells[0]!).map((n) => n.replace(/^server\/src\//, ""));
    rows.push({ covers, mayImport: names(cells[cells.length - 1]!) });
  }
  return rows;
}

/** Whether `path` is `entry` or lies under the folder `entry`. */
function within(path: string, entry: string): boolean {
  return path === entry || path.startsWith(`${entry}/`);
}

/** The most specific row that covers a path under server/src, and the entry that covers it. */
export function rowOf(rows: readonly LayerRow[], path: string): { row: LayerRow; cover: string } | undefined {
  let best: { row: LayerRow; cover: string } | undefined;
  for (const row of rows)
    for (const cover of row.covers)
      if (within(path, cover) && (!best || cover.length > best.cover.length)) best = { row, cover };
  return best;
}

/** Every import the table does not allow, as "from -> to" lines. An import inside one row is
 * allowed; one of a path under server/src is allowed when the row lists that file, or a folder
 * whose own row covers it (a folder entry does not reach into sub-folders that have rows of
 * their own); a package or outside file must be listed as it is imported. */
export function layerViolations(
  rows: readonly LayerRow[],
  edges: readonly ImportEdge[],
  isSource: (path: string) => boolean,
): string[] {
  const out: string[] = [];
  for (const { from, to } of edges) {
    const own = rowOf(rows, from);
    if (!own) {
      out.push(`${from}: no row of the table covers it`);
      continue;
    }
    if (!isSource(to)) {
      if (!own.row.mayImport.includes(to)) out.push(`${from} -> ${to}`);
      continue;
    }
    const target = rowOf(rows, to);
    if (!target) {
      out.push(`${from} -> ${to}: no row of the table covers it`);
      continue;
    }
    if (target.row === own.row) continue;
    const allowed = own.row.mayImport.some(
      (entry) => to === entry || (within(to, entry) && entry === target.cover),
    );
    if (!allowed) out.push(`${from} -> ${to}`);
  }
  return out;
}

/** The file a relative import of `from` names, both as paths from the repository root. */
export function resolveImport(from: string, spec: string, exists: (path: string) => boolean): string {
  const base = posix.normalize(posix.join(posix.dirname(from), spec));
  for (const candidate of [`${base}.ts`, base, `${base}/index.ts`]) if (exists(candidate)) return candidate;
  return base;
}
