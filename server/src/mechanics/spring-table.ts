// Reading a pose's figures per spring and degree of freedom (types.ts SpringDofTable): one typed
// array a pose with the spring and dof ids' positions shared by the whole sweep.
import type { SpringDofTable } from "./types";

/** A table of zeros for these springs and dofs (ids in row and column order). */
export function springDofTable(
  springIndex: ReadonlyMap<string, number>,
  dofIndex: ReadonlyMap<string, number>,
): SpringDofTable {
  return { springIndex, dofIndex, values: new Float64Array(springIndex.size * dofIndex.size) };
}

/** Positions of ids in a list, as a map (the first of a repeated id). */
export function indexOf(ids: readonly string[]): ReadonlyMap<string, number> {
  const out = new Map<string, number>();
  ids.forEach((id, k) => out.has(id) || out.set(id, k));
  return out;
}

/** The spring's figure at the dof; undefined when the table has no such spring or dof. */
export function springDofValue(
  table: SpringDofTable | undefined,
  springId: string,
  dofId: string,
): number | undefined {
  if (!table) return undefined;
  const row = table.springIndex.get(springId);
  const col = table.dofIndex.get(dofId);
  if (row === undefined || col === undefined) return undefined;
  return table.values[row * table.dofIndex.size + col];
}

/** The spring's figures at every dof, in dof order (a view into the table); undefined when the
 * table has no such spring. */
export function springRow(table: SpringDofTable | undefined, springId: string): Float64Array | undefined {
  const row = table?.springIndex.get(springId);
  if (table === undefined || row === undefined) return undefined;
  const width = table.dofIndex.size;
  return table.values.subarray(row * width, (row + 1) * width);
}

/** Sum over the springs (in row order) of their figures at the dof; 0 without the dof. */
export function sumOverSprings(table: SpringDofTable, dofId: string): number {
  const col = table.dofIndex.get(dofId);
  let sum = 0;
  if (col === undefined) return sum;
  const width = table.dofIndex.size;
  for (let row = 0; row < table.springIndex.size; row++) sum += table.values[row * width + col]!;
  return sum;
}
