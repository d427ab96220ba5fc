// Completion that fits the position: declaration keywords inside the arm, the declaration's own
// property names (a spring's by its kind), names of the right kind after `connects`, `between`,
// `on`, `at` and in material positions, point names after `body.`, units that fit after a number.
import {
  CompletionItemKind,
  InsertTextFormat,
  type CompletionItem,
  type CompletionList,
} from "vscode-languageserver";
import {
  ARM_PROPERTIES,
  DECLARATIONS,
  SPRING_KINDS,
  declarationSpec,
  type PropertySpec,
  type ValueShape,
} from "../../model/schema";
import type { DimensionName } from "../../units/dimension";
import type { ServerFeature } from "../context";
import { blockText, cursorContext, type CursorContext } from "../../services/cursor-context";
import {
  bodyPrefixLength,
  isBodyKind,
  pointsOf,
  symbolsOfKind,
  PARALLELOGRAM_PARTS,
  SECTION_SHAPES,
  type NameKind,
  type NameSymbol,
} from "../../services/names";
import { guarded } from "../safe";
import type { SyntaxView } from "../session/syntax-view";
import { UNITS_BY_DIMENSION } from "../../services/unit-words";
import { isSpringKind, SPRING_KIND_TABLE } from "../../model/spring-kinds";
import { tuningWant } from "../../services/tuning-words";

const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const NUMBER_THEN_UNIT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)([A-Za-z].*)$/;

interface Want {
  kind: "place" | "names" | "words" | "units";
  names?: NameKind[];
  words?: string[];
  dimensions?: DimensionName[];
  /** A joint's child: never the base, which is the fixed ground. */
  child?: boolean;
}

/** Every dimension a property's quantities may have (for units after a number). */
function dimensionsOf(shape: ValueShape): DimensionName[] {
  switch (shape.type) {
    case "quantity":
    case "range":
    case "vector":
    case "dims":
      return [shape.dimension];
    case "quantity-or":
      return shape.dimensions;
    case "point":
    case "named-point":
    case "section":
      return ["length"];
    case "sequence":
      return shape.items.flatMap((i) => (i.type === "keyword" ? [] : dimensionsOf(i)));
    default:
      return [];
  }
}

/** A spring's `rate` is angular only for a kind that acts at a joint (a torsion spring). */
function dimensionsFor(spec: PropertySpec, springKind: string | undefined): DimensionName[] {
  if (spec.key === "rate" && springKind)
    return [
      isSpringKind(springKind) && SPRING_KIND_TABLE[springKind].actsAt === "joint"
        ? "angular_stiffness"
        : "stiffness",
    ];
  return dimensionsOf(spec.shape);
}

const isUnitWord = (w: string) => /^[A-Za-z][A-Za-z0-9*/^]*$/.test(w) && !SECTION_SHAPES.has(w);

/** What may come next in a property, given the complete words after its key. */
function wantAfter(
  keyword: string,
  spec: PropertySpec,
  done: string[],
  springKind: string | undefined,
): Want | undefined {
  if (spec.shape.type === "tuning") return tuningWant(done, springKind);
  const last = done[done.length - 1];
  const prevIsNumber = last !== undefined && NUMBER.test(last);
  if (prevIsNumber) return { kind: "units", dimensions: dimensionsFor(spec, springKind) };
  const quantities = done.filter((w) => NUMBER.test(w)).length;
  const afterUnit = last !== undefined && prevIsUnitAfterNumber(done);
  switch (spec.key) {
    case "connects":
      if (done.length === 1) return { kind: "words", words: ["to"] };
      return done.length === 0
        ? { kind: "place" }
        : last === "to"
          ? { kind: "place", child: true }
          : undefined;
    case "between":
      return done.length === 1
        ? { kind: "words", words: ["and"] }
        : done.length === 0 || last === "and"
          ? { kind: "place" }
          : undefined;
    case "on":
      return done.length === 0 ? { kind: "place" } : undefined;
    case "at":
      if (done.length > 0) return undefined;
      return keyword === "spring" ? { kind: "names", names: ["joint", "parallelogram"] } : { kind: "place" };
    case "material":
      return done.length === 0 ? { kind: "names", names: ["material"] } : undefined;
    case "pin":
    case "pins":
      return afterUnit && quantities === 1 ? { kind: "names", names: ["material"] } : undefined;
    case "balance":
    case "tilt":
    case "deflection":
      if (afterUnit && quantities === 1) return { kind: "words", words: ["at"] };
      return last === "at" ? { kind: "names", names: ["payload"] } : undefined;
    case "section":
    case "bars": {
      const shape = done.find((w) => SECTION_SHAPES.has(w));
      if (!shape) return done.length === 0 ? { kind: "words", words: [...SECTION_SHAPES] } : undefined;
      const needed = shape === "rod" ? 1 : 2;
      if (afterUnit && quantities < needed) return { kind: "words", words: ["x"] };
      if (afterUnit && quantities >= needed && spec.key === "bars")
        return { kind: "names", names: ["material"] };
      return undefined;
    }
  }
  const shape = spec.shape;
  if (shape.type === "word" && done.length === 0) return { kind: "words", words: shape.words };
  if (shape.type === "range" && afterUnit && quantities === 1) return { kind: "words", words: [".."] };
  if (shape.type === "dims" && afterUnit && quantities === 1) return { kind: "words", words: ["x"] };
  if (shape.type === "material" && done.length === 0) return { kind: "names", names: ["material"] };
  return undefined;
}

function prevIsUnitAfterNumber(done: string[]): boolean {
  const n = done.length;
  return n >= 2 && isUnitWord(done[n - 1]!) && NUMBER.test(done[n - 2]!);
}

function springKindOf(text: string): string | undefined {
  const m = /(?:^|[\n;{])\s*(extension|zero_length|elastic|gas|torsion)\b/.exec(text);
  return m?.[1];
}

function propertyItems(ctx: CursorContext, text: string): CompletionItem[] {
  const spec = declarationSpec(ctx.keyword ?? "");
  if (!spec) return [];
  const body = blockText(text, ctx.blockStart);
  const present = new Set([...body.matchAll(/(?:^|[\n;{])\s*([A-Za-z_][A-Za-z0-9_]*)/g)].map((m) => m[1]!));
  const kind = spec.keyword === "spring" ? springKindOf(body) : undefined;
  const items: CompletionItem[] = [];
  for (const p of spec.properties) {
    const isKindWord = (SPRING_KINDS as readonly string[]).includes(p.key);
    if (spec.keyword === "spring") {
      if (isKindWord && kind) continue;
      if (kind && p.springKinds && !p.springKinds.includes(kind)) continue;
    }
    if (present.has(p.key) && p.key !== "point") continue;
    items.push({
      label: p.key,
      kind: p.shape.type === "flag" ? CompletionItemKind.Keyword : CompletionItemKind.Property,
      detail: p.required ? `required · ${p.doc}` : p.doc,
      documentation: { kind: "markdown", value: `${p.doc}\n\n\`${p.example}\`` },
      insertText: p.shape.type === "flag" ? p.key : `${p.key} `,
      sortText: `${isKindWord && !kind ? "0" : p.required ? "1" : "2"}${p.key}`,
    });
  }
  return items;
}

function declarationItems(snippets: boolean): CompletionItem[] {
  const items: CompletionItem[] = DECLARATIONS.map((d) => ({
    label: d.keyword,
    kind: CompletionItemKind.Keyword,
    detail: d.doc,
    insertTextFormat: snippets ? InsertTextFormat.Snippet : InsertTextFormat.PlainText,
    insertText: snippets ? `${d.keyword}${d.named ? " ${1:name}" : ""} {\n\t$0\n}` : `${d.keyword} `,
  }));
  for (const p of ARM_PROPERTIES)
    items.push({ label: p.key, kind: CompletionItemKind.Property, detail: p.doc, insertText: `${p.key} ` });
  return items;
}

function nameItem(s: NameSymbol, label = s.id): CompletionItem {
  const kind =
    s.kind === "material"
      ? CompletionItemKind.Constant
      : s.kind === "point"
        ? CompletionItemKind.Field
        : isBodyKind(s.kind)
          ? CompletionItemKind.Class
          : CompletionItemKind.Variable;
  return { label, kind, detail: s.builtin ? `${s.kind} (built in)` : s.kind };
}

/** Names for a place reference: bodies, or after `body.` that body's points. */
function placeItems(
  view: SyntaxView,
  partial: string,
  child = false,
): { items: CompletionItem[]; replaceFrom: number } {
  const dot = partial.lastIndexOf(".");
  if (dot < 0) {
    const bodies = [...view.names.bodies].filter(
      (id) => !(child && view.names.symbols.get(id)?.kind === "base"),
    );
    const items = bodies.map((id) => nameItem(view.names.symbols.get(id)!));
    // A parallelogram's name alone reads as its head in no position; offer `NAME.` to go on.
    for (const p of symbolsOfKind(view.names, ["parallelogram"]))
      items.push({
        ...nameItem(p),
        label: `${p.id}.`,
        insertText: `${p.id}.`,
        command: { title: "more", command: "editor.action.triggerSuggest" },
      });
    return { items, replaceFrom: partial.length };
  }
  const prefix = partial.slice(0, dot).split(".");
  const k = bodyPrefixLength(view.names, prefix);
  const items: CompletionItem[] = [];
  if (k === prefix.length) {
    for (const p of pointsOf(view.names, prefix.join("."))) items.push(nameItem(p, p.name));
  } else if (prefix.length === 1 && view.names.symbols.get(prefix[0]!)?.kind === "parallelogram") {
    for (const part of PARALLELOGRAM_PARTS)
      items.push(nameItem(view.names.symbols.get(`${prefix[0]}.${part}`)!, part));
  }
  return { items, replaceFrom: partial.length - dot - 1 };
}

export function completionsAt(view: SyntaxView, offset: number, snippets: boolean): CompletionItem[] {
  const ctx = cursorContext(view.text, offset);
  if (ctx.quiet) return [];
  const words = ctx.words;
  const partial = words[words.length - 1] ?? "";
  const done = words.slice(0, -1);
  let items: CompletionItem[] = [];
  let replaceLength = partial.length;
  if (ctx.depth === 0) {
    if (done.length === 0)
      items = [
        {
          label: "arm",
          kind: CompletionItemKind.Keyword,
          insertTextFormat: snippets ? InsertTextFormat.Snippet : InsertTextFormat.PlainText,
          insertText: snippets ? 'arm "${1:title}" {\n\t$0\n}' : "arm ",
        },
      ];
  } else if (ctx.depth === 1) {
    if (done.length === 0) items = declarationItems(snippets);
  } else if (done.length === 0) {
    items = propertyItems(ctx, view.text);
  } else {
    const spec = declarationSpec(ctx.keyword ?? "")?.properties.find((p) => p.key === done[0]);
    const springKind =
      ctx.keyword === "spring" ? springKindOf(blockText(view.text, ctx.blockStart)) : undefined;
    const inPoint = done.includes("(") || done.some((w) => w.endsWith("("));
    const glued = NUMBER_THEN_UNIT.exec(partial);
    let want: Want | undefined;
    if (glued) {
      want = { kind: "units", dimensions: spec ? dimensionsFor(spec, springKind) : [] };
      replaceLength = glued[2]!.length;
    } else if (inPoint) {
      const last = done[done.length - 1];
      if (last && NUMBER.test(last))
        want = { kind: "units", dimensions: spec?.key === "force" ? ["force"] : ["length"] };
    } else if (spec) want = wantAfter(ctx.keyword ?? "", spec, done.slice(1), springKind);
    if (want?.kind === "units") {
      const units = [...new Set((want.dimensions ?? []).flatMap((d) => UNITS_BY_DIMENSION[d]))];
      items = units.map((u, i) => ({
        label: u,
        kind: CompletionItemKind.Unit,
        sortText: String(i).padStart(3, "0"),
      }));
    } else if (want?.kind === "words") {
      items = (want.words ?? []).map((w) => ({ label: w, kind: CompletionItemKind.Keyword }));
    } else if (want?.kind === "names") {
      items = symbolsOfKind(view.names, want.names ?? []).map((s) => nameItem(s));
    } else if (want?.kind === "place") {
      const place = placeItems(view, partial, want.child === true);
      items = place.items;
      replaceLength = place.replaceFrom;
    }
  }
  // Replace exactly the word being typed (units such as N/mm hold characters editors split at).
  const start = view.lines.position(offset - replaceLength);
  const end = view.lines.position(offset);
  return items.map((item) => ({
    ...item,
    textEdit: { range: { start, end }, newText: item.insertText ?? item.label },
    insertText: undefined,
  }));
}

export const completionFeature: ServerFeature = {
  name: "completion",
  capabilities: () => ({ completionProvider: { triggerCharacters: [".", " "], resolveProvider: false } }),
  register(ctx) {
    ctx.connection.onCompletion(
      guarded("completion", { isIncomplete: false, items: [] } as CompletionList, (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return { isIncomplete: false, items: [] };
        const snippets = ctx.client().textDocument?.completion?.completionItem?.snippetSupport === true;
        return {
          isIncomplete: false,
          items: completionsAt(view, view.lines.offset(params.position), snippets),
        };
      }),
    );
  },
};
