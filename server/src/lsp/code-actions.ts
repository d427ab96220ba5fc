// Quick fixes, found by the finding code riding in a diagnostic's data: write the best-fit spring
// rate (and initial tension), add a missing unit, take the suggested name, widen a pin to the
// smallest standard size that meets `require safety`.
import {
  CodeActionKind,
  type CodeAction,
  type CodeActionParams,
  type Diagnostic,
  type TextEdit,
} from "vscode-languageserver";
import type { FeatureContext, ServerFeature } from "./context";
import type { DiagnosticData } from "./convert";
import { DIAGNOSTIC_SOURCE } from "./convert";
import { guarded } from "./safe";
import { analyse, type Analysis } from "../analysis";
import { parse } from "../syntax/parser";
import type { DeclarationNode, PropertyNode, QuantityNode, SyntaxTree, ValueNode } from "../syntax/ast";
import { LineIndex, type Span } from "../syntax/span";
import { ARM_PROPERTIES, declarationSpec, type PropertySpec, type ValueShape } from "../model/schema";
import type { DimensionName } from "../units/dimension";
import { fromSI, parseUnit, sameDimension, USUAL_UNIT } from "../units/quantity";
import { DIMENSIONS } from "../units/dimension";
import { formatNumber } from "../units/format";
import { CODES, type Code } from "../findings/codes";
import type { FindingData } from "../findings/finding";
import type { OverstressData, TextData, UnbalancedData } from "../findings/data";

/** A fix as offsets into the text: the protocol layer below turns it into a workspace edit. */
export interface TextFix {
  title: string;
  edits: { span: Span; newText: string }[];
  preferred?: boolean;
}

/** Standard metric pin diameters, m: ISO 2338-style preferred sizes as commonly stocked (common
 * practice, no source). */
export const STANDARD_PIN_DIAMETERS_M = [2, 2.5, 3, 4, 5, 6, 8, 10, 12, 16, 20].map((mm) => mm / 1000);
/** Sizes tried beyond the first candidate before giving up: each try is a whole analysis. */
const PIN_TRIES = 4;
/** All the tries of one pin fix together may take this long: they run on the server's request
 * path, and a lightbulb that keeps the server busy longer than a pause in typing is worse than no
 * fix (common practice, no source). */
const PIN_FIX_BUDGET_MS = 3000;

// ---- syntax helpers -------------------------------------------------------------------------

function declarations(tree: SyntaxTree): readonly DeclarationNode[] {
  return tree.arms[0]?.declarations ?? [];
}

function declarationNamed(tree: SyntaxTree, keyword: string, name: string): DeclarationNode | undefined {
  return declarations(tree).find((d) => d.keyword.text === keyword && d.name?.text === name);
}

/** The declaration whose words make a part: its own, or for a part a parallelogram generates
 * (`reach.lower`, `reach.upper_root`) the parallelogram's. */
function declarationOf(tree: SyntaxTree, id: string): DeclarationNode | undefined {
  const name = id.split(".")[0]!;
  return declarations(tree).find((d) => d.name?.text === name);
}

function propertyOf(decl: DeclarationNode, key: string): PropertyNode | undefined {
  return decl.properties.find((p) => p.key.text === key);
}

function quantitiesIn(v: ValueNode): QuantityNode[] {
  switch (v.kind) {
    case "quantity":
      return [v];
    case "range":
      return [v.low, v.high];
    case "point":
      return [v.x, v.y];
    case "dims":
      return [v.first, v.second];
    case "reference":
      return v.point ? [v.point.x, v.point.y] : [];
    default:
      return [];
  }
}

/** The first dimension a property's shape expects (a sequence: its first quantity). */
function dimensionOfShape(shape: ValueShape): DimensionName | undefined {
  switch (shape.type) {
    case "quantity":
    case "range":
    case "vector":
    case "dims":
      return shape.dimension;
    case "quantity-or":
      return shape.dimensions[0];
    case "point":
    case "named-point":
      return "length";
    case "sequence":
      for (const item of shape.items)
        if (item.type !== "keyword") {
          const d = dimensionOfShape(item);
          if (d) return d;
        }
      return undefined;
    default:
      return undefined;
  }
}

/** Text of a new property line after `after`, indented like it. */
function lineAfter(text: string, after: PropertyNode, line: string): { span: Span; newText: string } {
  const lineStart = text.lastIndexOf("\n", after.span.start - 1) + 1;
  const indent = /^[ \t]*/.exec(text.slice(lineStart))![0];
  let end = text.indexOf("\n", after.span.end);
  if (end < 0) end = text.length;
  return { span: { start: end, end }, newText: `\n${indent}${line}` };
}

/** The value written in the same unit as an existing quantity (or the usual unit). */
function writeIn(valueSI: number, written: QuantityNode | undefined, dimension: DimensionName): string {
  const unit = written?.unit?.text ?? USUAL_UNIT[dimension];
  const v = fromSI(valueSI, unit);
  return v === undefined ? "" : `${formatNumber(v)} ${unit}`;
}

// ---- balance: best-fit rate and initial tension ---------------------------------------------

/** What the balance fix reads of a `balance.unbalanced` finding. */
export type BalanceFixData = Pick<
  UnbalancedData,
  "spring" | "best" | "worstHandForceBefore" | "worstHandForceAfter"
>;

function num(x: unknown): number | undefined {
  return typeof x === "number" && Number.isFinite(x) ? x : undefined;
}

/** Hand forces in a title to the hundredth of a newton: finer than anyone feels at the hand, and
 * a near-perfect fit then reads 0.00 N rather than 4.56e-10 N. */
function handForceText(n: number): string {
  return Math.abs(n) < 1000 ? `${n.toFixed(2)} N` : `${formatNumber(n)} N`;
}

/** What the balance fit may write, by spring kind: property (the key of the finding's `best`),
 * dimension, and whether the property must already be written (else the fix adds it). */
const FIT_SETTINGS: Record<
  string,
  { key: string; dimension: DimensionName; words: string; mustExist: boolean }[]
> = {
  extension: [
    { key: "rate", dimension: "stiffness", words: "rate", mustExist: true },
    { key: "initial_tension", dimension: "force", words: "initial tension", mustExist: false },
  ],
  zero_length: [
    { key: "rate", dimension: "stiffness", words: "rate", mustExist: true },
    { key: "initial_tension", dimension: "force", words: "initial tension", mustExist: false },
  ],
  torsion: [
    { key: "rate", dimension: "angular_stiffness", words: "rate", mustExist: true },
    { key: "preload", dimension: "torque", words: "preload", mustExist: false },
  ],
  gas: [{ key: "force", dimension: "force", words: "force", mustExist: true }],
  elastic: [{ key: "area", dimension: "area", words: "cross-section", mustExist: true }],
};
/** An initial tension below this is not worth writing into a zero-length spring: hundredths of a
 * newton are below what a spring maker can set (common practice, no source). */
const NEGLIGIBLE_TENSION_N = 0.01;

function springKindOf(decl: DeclarationNode): string | undefined {
  return ["extension", "zero_length", "elastic", "gas", "torsion"].find((k) => propertyOf(decl, k));
}

/** The value in the unit of `written` when that unit has the right dimension (a preload written
 * as an angle gets a torque in the usual unit instead). */
function writeInDimension(valueSI: number, written: ValueNode | undefined, dimension: DimensionName): string {
  const q = written?.kind === "quantity" ? written : undefined;
  const parsed = q?.unit ? parseUnit(q.unit.text) : undefined;
  const fits = parsed?.ok && sameDimension(parsed.unit.dimension, DIMENSIONS[dimension]);
  return writeIn(valueSI, fits ? q : undefined, dimension);
}

export function balanceFix(
  text: string,
  tree: SyntaxTree,
  data: BalanceFixData | undefined,
): TextFix | undefined {
  const springId = data?.spring;
  const decl = springId ? declarationNamed(tree, "spring", springId) : undefined;
  const kind = decl && springKindOf(decl);
  const settings = kind ? FIT_SETTINGS[kind] : undefined;
  if (!decl || !settings) return undefined;
  const edits: TextFix["edits"] = [];
  const words: string[] = [];
  let anchor: PropertyNode | undefined;
  for (const setting of settings) {
    const value = num(data?.best?.[setting.key]);
    const prop = propertyOf(decl, setting.key);
    if (
      value === undefined ||
      (setting.dimension !== "torque" && setting.dimension !== "force" && value <= 0)
    ) {
      if (setting.mustExist) return undefined;
      continue;
    }
    if (setting.mustExist && !prop) return undefined;
    if (
      kind === "zero_length" &&
      setting.key === "initial_tension" &&
      !prop &&
      Math.abs(value) < NEGLIGIBLE_TENSION_N
    )
      continue;
    const written = writeInDimension(value, prop?.values[0], setting.dimension);
    if (!written) return undefined;
    const v = prop?.values[0];
    if (prop && v) edits.push({ span: v.span, newText: written });
    else if (anchor) edits.push(lineAfter(text, anchor, `${setting.key} ${written}`));
    else return undefined;
    anchor ??= prop;
    words.push(`${setting.words} to ${written}`);
  }
  if (edits.length === 0) return undefined;
  const before = num(data?.worstHandForceBefore);
  const after = num(data?.worstHandForceAfter);
  const forces =
    before !== undefined && after !== undefined
      ? ` (worst hand force ${handForceText(before)} → ${handForceText(after)} over every payload)`
      : "";
  return { title: `Set ${springId}'s ${words.join(" and ")}${forces}`, edits, preferred: true };
}

// ---- a missing unit ----------------------------------------------------------------------------

export function missingUnitFix(
  tree: SyntaxTree,
  span: Span,
  data: TextData | undefined,
): TextFix | undefined {
  for (const arm of tree.arms) {
    const scopes: { keyword?: string; properties: readonly PropertyNode[] }[] = [
      { properties: arm.properties },
      ...arm.declarations.map((d) => ({ keyword: d.keyword.text, properties: d.properties })),
    ];
    for (const scope of scopes) {
      for (const prop of scope.properties) {
        if (span.start < prop.span.start || span.start >= prop.span.end) continue;
        const quantities = prop.values.flatMap(quantitiesIn);
        const q = quantities.find(
          (n) => !n.unit && span.start >= n.span.start && span.start < Math.max(n.span.end, n.span.start + 1),
        );
        if (!q) continue;
        // A sibling that has a unit (the other end of a range, the other coordinate) says it best.
        let unit = quantities.find((n) => n.unit)?.unit?.text;
        const suggestion = data?.suggestion;
        if (!unit && suggestion?.startsWith(q.numberText + " "))
          unit = suggestion.slice(q.numberText.length + 1);
        if (!unit) {
          const specs: readonly PropertySpec[] = scope.keyword
            ? (declarationSpec(scope.keyword)?.properties ?? [])
            : ARM_PROPERTIES;
          const spec = specs.find((p) => p.key === prop.key.text);
          const dim = spec && dimensionOfShape(spec.shape);
          unit = dim ? USUAL_UNIT[dim] : undefined;
        }
        if (!unit) return undefined;
        return {
          title: `Add the unit: ${q.numberText} ${unit}`,
          edits: [{ span: { start: q.numberSpan.end, end: q.numberSpan.end }, newText: ` ${unit}` }],
          preferred: true,
        };
      }
    }
  }
  return undefined;
}

// ---- an unknown name ---------------------------------------------------------------------------

/** The suggestion of a name or unit finding, from its data (never from its message). */
export function suggestionOf(data: TextData | undefined): string | undefined {
  return data?.suggestion || undefined;
}

export function unknownNameFix(text: string, span: Span, data: TextData | undefined): TextFix | undefined {
  const suggestion = suggestionOf(data);
  if (!suggestion || span.end <= span.start) return undefined;
  const written = text.slice(span.start, span.end);
  if (written === suggestion) return undefined;
  // A finding on a whole dotted reference whose suggestion is one part: replace the last part.
  if (written.includes(".") && !suggestion.includes(".")) {
    const dot = written.lastIndexOf(".");
    return {
      title: `Change ${written.slice(dot + 1)} to ${suggestion}`,
      edits: [{ span: { start: span.start + dot + 1, end: span.end }, newText: suggestion }],
      preferred: true,
    };
  }
  return {
    title: `Change ${written} to ${suggestion}`,
    edits: [{ span, newText: suggestion }],
    preferred: true,
  };
}

// ---- a pin too small ---------------------------------------------------------------------------

/** The joint's declaration and its pin property, when the strength finding is about a pin. */
function pinOf(
  tree: SyntaxTree,
  data: OverstressData | undefined,
): { decl: DeclarationNode; prop: PropertyNode; diameter: QuantityNode } | undefined {
  if (data?.check !== "pin") return undefined;
  const decl = declarationOf(tree, data.subject);
  if (!decl) return undefined;
  const prop = propertyOf(decl, "pin") ?? propertyOf(decl, "pins");
  const diameter = prop?.values[0];
  if (!prop || diameter?.kind !== "quantity" || !diameter.unit) return undefined;
  return { decl, prop, diameter };
}

function pinStillFails(analysis: Analysis, jointId: string): boolean {
  return analysis.findings.some(
    (f) => f.code === "strength.overstress" && f.data.check === "pin" && f.data.subject === jointId,
  );
}

/**
 * The smallest standard pin that meets `require safety`, confirmed by analysing the edited text.
 * Shear stress goes as 1/d^2 and bearing as 1/d (mechanics.md section 4), so the shear-governed
 * size d sqrt(S_req / S) is a lower bound and the search starts at the first standard size above it.
 */
export function widenPinFix(
  text: string,
  tree: SyntaxTree,
  data: OverstressData | undefined,
  budgetMs = PIN_FIX_BUDGET_MS,
): TextFix | undefined {
  const deadline = performance.now() + budgetMs;
  const pin = pinOf(tree, data);
  if (!pin || !data) return undefined;
  const unit = pin.diameter.unit!.text;
  const d = fromSI(1, unit);
  if (d === undefined) return undefined;
  const current = pin.diameter.value / d; // SI
  const safety = num(data.safety);
  const required = num(data.required);
  const lowest = safety && required && safety > 0 ? current * Math.sqrt(required / safety) : current;
  const candidates = STANDARD_PIN_DIAMETERS_M.filter(
    (c) => c > current * (1 + 1e-9) && c >= lowest * (1 - 1e-9),
  ).slice(0, PIN_TRIES);
  for (const c of candidates) {
    const newText = `${formatNumber(fromSI(c, unit)!)} ${unit}`;
    const edited = text.slice(0, pin.diameter.span.start) + newText + text.slice(pin.diameter.span.end);
    const left = deadline - performance.now();
    if (left <= 0) return undefined;
    const analysis = analyse(edited, { budgetMs: left });
    if (
      !analysis.sweep ||
      analysis.findings.some((f) => f.code === "analysis.budget" || f.code === "analysis.internal")
    )
      return undefined;
    if (!pinStillFails(analysis, data.subject)) {
      const name = pin.decl.name?.text ?? "the joint";
      return {
        title: `Widen ${name}'s pin to ${newText}, the smallest standard size that meets the required safety (checked)`,
        edits: [{ span: pin.diameter.span, newText }],
        preferred: true,
      };
    }
  }
  return undefined;
}

// ---- a value the model builder knows the right form of ------------------------------------------

/** A finding whose data carries the corrected text of exactly the words it points at (a reversed
 * range written the right way round). */
export function suggestedValueFix(text: string, span: Span, data: TextData | undefined): TextFix | undefined {
  const suggestion = data?.suggestion;
  if (!suggestion || span.end <= span.start || text.slice(span.start, span.end) === suggestion)
    return undefined;
  return { title: `Write ${suggestion}`, edits: [{ span, newText: suggestion }], preferred: true };
}

// ---- dispatch ------------------------------------------------------------------------------

/** What a fix reads of a finding: its code, the words it points at, and its typed data (a
 * finding itself fits). */
export type FixRequest = { [C in Code]: { code: C; span: Span; data: FindingData<C> } }[Code];

export function fixesFor(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  let fix: TextFix | undefined;
  switch (req.code) {
    case "balance.unbalanced":
      fix = balanceFix(text, tree, req.data);
      break;
    case "unit.missing":
      fix = missingUnitFix(tree, req.span, req.data);
      break;
    case "name.unknown":
    case "name.unknown-point":
    case "unit.unknown":
    case "property.unknown":
    case "declaration.unknown":
      fix = unknownNameFix(text, req.span, req.data);
      break;
    case "strength.overstress":
      fix = widenPinFix(text, tree, req.data);
      break;
    case "value.impossible":
      fix = suggestedValueFix(text, req.span, req.data);
      break;
  }
  return fix ? [fix] : [];
}

/** Pin fixes analyse the text again; remember the answer per text and diagnostic. */
const PIN_CACHE_SIZE = 32;
const pinCache = new Map<string, TextFix[]>();

function cachedFixes(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  if (req.code !== "strength.overstress") return fixesFor(text, tree, req);
  const key = `${text.length}:${hash(text)}:${req.span.start}:${JSON.stringify(req.data)}`;
  const hit = pinCache.get(key);
  if (hit) return hit;
  const fixes = fixesFor(text, tree, req);
  if (pinCache.size >= PIN_CACHE_SIZE) pinCache.delete(pinCache.keys().next().value!);
  pinCache.set(key, fixes);
  return fixes;
}

function hash(s: string): number {
  let h = 2166136261;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 16777619);
  return h >>> 0;
}

function toAction(uri: string, index: LineIndex, fix: TextFix, diagnostic: Diagnostic): CodeAction {
  const edits: TextEdit[] = fix.edits.map((e) => ({
    range: { start: index.position(e.span.start), end: index.position(e.span.end) },
    newText: e.newText,
  }));
  return {
    title: fix.title,
    kind: CodeActionKind.QuickFix,
    diagnostics: [diagnostic],
    isPreferred: fix.preferred ?? false,
    edit: { changes: { [uri]: edits } },
  };
}

export const codeActionsFeature: ServerFeature = {
  name: "quick fixes",
  capabilities: () => ({ codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] } }),
  register(ctx: FeatureContext) {
    ctx.connection.onCodeAction(
      guarded("code actions", [] as CodeAction[], (params: CodeActionParams) => {
        const doc = ctx.documents.get(params.textDocument.uri);
        if (!doc) return [];
        const text = doc.getText();
        const index = new LineIndex(text);
        const tree = ctx.syntax(doc.uri)?.tree ?? parse(text);
        const actions: CodeAction[] = [];
        for (const diagnostic of params.context.diagnostics) {
          if (diagnostic.source !== DIAGNOSTIC_SOURCE) continue;
          const data = diagnostic.data as DiagnosticData | undefined;
          // A diagnostic from this server carries its finding's code and typed data.
          const code = data?.code ?? (typeof diagnostic.code === "string" ? diagnostic.code : undefined);
          if (!code || !(code in CODES)) continue;
          // The editor keeps the diagnostic's range in step with edits; the data's span is of the
          // analysed text, which may be older.
          const span = {
            start: index.offset(diagnostic.range.start),
            end: index.offset(diagnostic.range.end),
          };
          const req = { code, span, data: data?.detail ?? {} } as FixRequest;
          for (const fix of cachedFixes(text, tree, req))
            actions.push(toAction(doc.uri, index, fix, diagnostic));
        }
        return actions;
      }),
    );
  },
};
