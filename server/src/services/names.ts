// The names of a spec and every place they occur: declarations, named points, the bodies a
// parallelogram creates, and each reference. Taken from the model builder's symbol table when the
// analysis is of the current text; read from the syntax tree alone while the text is being typed
// (resolved the way the model builder does: longest dotted prefix naming a body, then at most one
// point). Serves definition, references, rename, completion, hover and highlighting.
import type {
  DeclarationKeyword,
  DeclarationNode,
  PropertyNode,
  ReferenceNode,
  SyntaxTree,
  ValueNode,
} from "../syntax/ast";
import type { Span } from "../syntax/span";
import { DECLARATION_KEYWORDS } from "../syntax/keywords";
import type { SymbolTable } from "../model/symbols";
import { HEAD_POINTS } from "../model/build-parts";

/** What a name names: a declaration (the named keywords), a parallelogram's bar or head, a point. */
export type NameKind = Exclude<DeclarationKeyword, "require" | "sweep" | "aged"> | "bar" | "head" | "point";

export interface NameSymbol {
  /** Model id: a declaration's name, `reach.lower` for generated bodies, `body.point` for points. */
  id: string;
  kind: NameKind;
  /** The name as written in a reference's last part. */
  name: string;
  /** Span of the declaring name, when the text declares it (not for built-ins and `start`/`end`). */
  nameSpan?: Span;
  /** The declaration that makes it (a point: the `point` property; generated: the parallelogram). */
  declarationSpan?: Span;
  /** Built into the language (library materials, a link's `start` and `end`). */
  builtin: boolean;
  /** Bodies made by a parallelogram (its id), points (their body's id). */
  parent?: string;
  /** Only names the text declares may be renamed; generated and built-in names are fixed. */
  renameable: boolean;
}

export interface Occurrence {
  symbolId: string;
  span: Span;
  declaration: boolean;
}

export interface NameIndex {
  symbols: Map<string, NameSymbol>;
  /** In text order. */
  occurrences: Occurrence[];
  /** Body ids (base, links, parallelogram bars and heads). */
  bodies: Set<string>;
}

const BODY_KINDS: ReadonlySet<NameKind> = new Set<NameKind>(["base", "link", "bar", "head"]);
/** The declarations that name a part (the rest — require, sweep, aged — name nothing). */
const DECLARED_KINDS: ReadonlySet<string> = new Set(
  DECLARATION_KEYWORDS.filter((k) => k !== "require" && k !== "sweep" && k !== "aged"),
);
export const PARALLELOGRAM_PARTS = ["lower", "upper", "head"] as const;
export const SECTION_SHAPES: ReadonlySet<string> = new Set(["rect", "tube", "rod"]);
/** Words that join the parts of a property (`connects A to B`, `between A and B`, `... at P`). */
export const CONNECTIVES: ReadonlySet<string> = new Set(["to", "and", "at"]);

export function isBodyKind(kind: NameKind): boolean {
  return BODY_KINDS.has(kind);
}

/** What a reference in a given property points to. */
type Role = "place" | "material" | "joint" | "payload" | "name" | "point-declaration" | "none";

function referenceRole(keyword: string, key: string): (ref: ReferenceNode, position: number) => Role {
  switch (key) {
    case "connects":
    case "between":
    case "on":
      return (r) => (isConnective(r) ? "none" : "place");
    case "at":
      if (keyword === "spring") return () => "joint";
      if (keyword === "payload") return () => "place";
      return () => "none";
    case "balance":
    case "tilt":
    case "deflection":
      return (r) => (isConnective(r) ? "none" : "payload");
    case "material":
    case "pin":
    case "pins":
    case "races":
    case "into":
    case "adhesive":
    case "balls":
    case "screws":
    case "bolts":
      return () => "material";
    case "bearing":
    case "fastening":
    case "anchor_fastening":
    case "hook_fastening":
      return () => "name";
    case "bars":
      return (r) => (r.parts.length === 1 && SECTION_SHAPES.has(r.parts[0]!.text) ? "none" : "material");
    case "point":
      return (_r, position) =>
        position === 0 && (keyword === "base" || keyword === "link") ? "point-declaration" : "none";
    default:
      return () => "none";
  }
}

function isConnective(r: ReferenceNode): boolean {
  return r.parts.length === 1 && CONNECTIVES.has(r.parts[0]!.text);
}

function forEachReference(
  property: PropertyNode,
  visit: (ref: ReferenceNode, position: number) => void,
): void {
  property.values.forEach((v: ValueNode, i) => {
    if (v.kind === "reference") visit(v, i);
  });
}

/** Builds the index. `builtinMaterials` are the library's names (from the last model). */
export function buildNameIndex(tree: SyntaxTree, builtinMaterials: readonly string[] = []): NameIndex {
  const symbols = new Map<string, NameSymbol>();
  const occurrences: Occurrence[] = [];
  const bodies = new Set<string>();
  const arm = tree.arms[0];
  const declarations: readonly DeclarationNode[] = arm ? arm.declarations : [];

  const addSymbol = (s: NameSymbol): NameSymbol => {
    const existing = symbols.get(s.id);
    if (existing) return existing; // a duplicate name: the first declaration stands (the model says so)
    symbols.set(s.id, s);
    if (BODY_KINDS.has(s.kind)) bodies.add(s.id);
    return s;
  };

  for (const name of builtinMaterials)
    addSymbol({ id: name, kind: "material", name, builtin: true, renameable: false });

  // Declarations first, so that references may point forward.
  for (const decl of declarations) {
    const keyword = decl.keyword.text;
    if (!decl.name || !DECLARED_KINDS.has(keyword)) continue;
    const id = decl.name.text;
    const declared = {
      nameSpan: decl.name.span,
      declarationSpan: decl.span,
      builtin: false,
      renameable: true,
    };
    if (symbols.get(id)?.builtin) symbols.delete(id); // the arm's own material shadows the library's
    addSymbol({ id, kind: keyword as NameKind, name: id, ...declared });
    occurrences.push({ symbolId: id, span: decl.name.span, declaration: true });
    if (keyword === "parallelogram") {
      for (const part of PARALLELOGRAM_PARTS) {
        addSymbol({
          id: `${id}.${part}`,
          kind: part === "head" ? "head" : "bar",
          name: part,
          nameSpan: decl.name.span,
          declarationSpan: decl.span,
          builtin: false,
          parent: id,
          renameable: false,
        });
      }
      for (const bar of ["lower", "upper"]) addEndPoints(addSymbol, `${id}.${bar}`);
      addEndPoints(addSymbol, `${id}.head`, HEAD_POINT_NAMES);
    }
    if (keyword === "link") addEndPoints(addSymbol, id);
  }
  // Named points.
  for (const decl of declarations) {
    const keyword = decl.keyword.text;
    if (!decl.name || (keyword !== "base" && keyword !== "link")) continue;
    for (const p of decl.properties) {
      if (p.key.text !== "point") continue;
      const first = p.values[0];
      if (first?.kind !== "reference" || first.parts.length !== 1) continue;
      const name = first.parts[0]!;
      const id = `${decl.name.text}.${name.text}`;
      const existing = symbols.get(id);
      if (existing?.builtin) symbols.delete(id); // `point end (...)` redefines the built-in end
      addSymbol({
        id,
        kind: "point",
        name: name.text,
        nameSpan: name.span,
        declarationSpan: p.span,
        builtin: false,
        parent: decl.name.text,
        renameable: true,
      });
      occurrences.push({ symbolId: id, span: name.span, declaration: true });
    }
  }

  const index: NameIndex = { symbols, occurrences, bodies };
  for (const decl of declarations) {
    const keyword = decl.keyword.text;
    for (const p of decl.properties) {
      const role = referenceRole(keyword, p.key.text);
      forEachReference(p, (ref, position) => {
        const r = role(ref, position);
        if (r !== "none" && r !== "point-declaration") occurrences.push(...resolveReference(index, ref, r));
      });
    }
  }
  occurrences.sort((a, b) => a.span.start - b.span.start);
  return index;
}

/** The index from the model builder's own symbol table (the authority when it is of this text). */
export function nameIndexFromSymbols(
  table: SymbolTable,
  builtinMaterials: readonly string[] = [],
): NameIndex {
  const symbols = new Map<string, NameSymbol>();
  const occurrences: Occurrence[] = [];
  const bodies = new Set<string>();
  for (const d of table.declarations) {
    if (d.kind === "require" || d.kind === "sweep" || d.kind === "aged" || symbols.has(d.id)) continue;
    const kind: NameKind = d.kind === "body" ? (d.id.endsWith(".head") ? "head" : "bar") : d.kind;
    const implicit = d.implicit === true;
    const name = d.kind === "body" ? d.id.slice(d.id.lastIndexOf(".") + 1) : d.name;
    symbols.set(d.id, {
      id: d.id,
      kind,
      name,
      nameSpan: d.nameSpan,
      declarationSpan: d.span,
      // Implicit points (a link's start and end) are the language's; generated bodies are the
      // parallelogram's.
      builtin: implicit && kind === "point",
      ...(d.container ? { parent: d.container } : {}),
      renameable: !implicit,
    });
    if (BODY_KINDS.has(kind)) bodies.add(d.id);
    if (!implicit) occurrences.push({ symbolId: d.id, span: d.nameSpan, declaration: true });
  }
  for (const name of builtinMaterials)
    if (!symbols.has(name))
      symbols.set(name, { id: name, kind: "material", name, builtin: true, renameable: false });
  for (const r of table.references)
    if (symbols.has(r.target.id))
      occurrences.push({ symbolId: r.target.id, span: r.span, declaration: false });
  occurrences.sort((a, b) => a.span.start - b.span.start);
  return { symbols, occurrences, bodies };
}

/** Points every bar and link has; a head's two far pivots are named by the model builder. */
const END_POINTS = ["start", "end"] as const;
const HEAD_POINT_NAMES: readonly string[] = Object.values(HEAD_POINTS);

/** The model builder's index, completed by what the tree alone resolves and the builder left out
 * (e.g. the body in `boom.tip` when `tip` is unknown, so that renaming `boom` still reaches it). */
export function mergeNameIndexes(primary: NameIndex, secondary: NameIndex): NameIndex {
  const symbols = new Map(primary.symbols);
  for (const [id, sym] of secondary.symbols) if (!symbols.has(id)) symbols.set(id, sym);
  const taken = new Set(primary.occurrences.map((o) => o.span.start));
  const occurrences = [
    ...primary.occurrences,
    ...secondary.occurrences.filter((o) => !taken.has(o.span.start)),
  ];
  occurrences.sort((a, b) => a.span.start - b.span.start);
  return { symbols, occurrences, bodies: new Set([...primary.bodies, ...secondary.bodies]) };
}

function addEndPoints(
  addSymbol: (s: NameSymbol) => NameSymbol,
  bodyId: string,
  names: readonly string[] = END_POINTS,
): void {
  for (const name of names)
    addSymbol({
      id: `${bodyId}.${name}`,
      kind: "point",
      name,
      builtin: true,
      parent: bodyId,
      renameable: false,
    });
}

/** Where the body part of a dotted reference ends: the longest prefix naming a body. */
export function bodyPrefixLength(index: NameIndex, parts: readonly string[]): number {
  for (let k = Math.min(parts.length, 2); k >= 1; k--) {
    if (index.bodies.has(parts.slice(0, k).join("."))) return k;
  }
  return 0;
}

function resolveReference(index: NameIndex, ref: ReferenceNode, role: Role): Occurrence[] {
  const parts = ref.parts.map((p) => p.text);
  const out: Occurrence[] = [];
  const hit = (id: string, span: Span) => {
    if (index.symbols.has(id)) out.push({ symbolId: id, span, declaration: false });
  };
  if (role === "place") {
    const k = bodyPrefixLength(index, parts);
    if (k === 0) {
      hit(parts[0]!, ref.parts[0]!.span);
      return out;
    }
    const bodyId = parts.slice(0, k).join(".");
    if (k === 2) hit(parts[0]!, ref.parts[0]!.span);
    hit(bodyId, ref.parts[k - 1]!.span);
    if (parts.length === k + 1) hit(`${bodyId}.${parts[k]}`, ref.parts[k]!.span);
    return out;
  }
  // material, joint, payload, a bearing or fastening: a single name.
  hit(parts[0]!, ref.parts[0]!.span);
  return out;
}

/** The occurrence under an offset (its span contains it, end inclusive so a cursor just after a
 * name still finds it). */
export function occurrenceAt(index: NameIndex, offset: number): Occurrence | undefined {
  let found: Occurrence | undefined;
  for (const o of index.occurrences) {
    if (o.span.start > offset) break;
    if (offset <= o.span.end) found = o;
  }
  return found;
}

export function occurrencesOf(index: NameIndex, symbolId: string): Occurrence[] {
  return index.occurrences.filter((o) => o.symbolId === symbolId);
}

export function symbolsOfKind(index: NameIndex, kinds: readonly NameKind[]): NameSymbol[] {
  return [...index.symbols.values()].filter((s) => kinds.includes(s.kind));
}

/** Named points of a body (declared and built-in). */
export function pointsOf(index: NameIndex, bodyId: string): NameSymbol[] {
  return [...index.symbols.values()].filter((s) => s.kind === "point" && s.parent === bodyId);
}

export const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;
