// State shared while one arm is built: declared names, bodies, materials, the symbol table, and
// the reading of a declaration's properties against its schema entry.
import type { DeclarationNode, PropertyNode, ReferenceNode } from "../syntax/ast";
import type { Span } from "../syntax/span";
import { closestWord } from "../units/did-you-mean";
import type { Attachment, Body, Joint, Material, Origin, Parallelogram, Payload } from "./types";
import type { DeclarationSpec, PropertySpec } from "./schema";
import { pointValue, Reporter, Values, type Read } from "./read-values";
import type { SymbolKind, SymbolTable } from "./symbols";

export interface Declared {
  kind: SymbolKind;
  decl: DeclarationNode;
}

/** Keys that may be given more than once: each `point` names another point, each `tune` or
 * `adjust` line frees another thing; a requirement may be given once per payload. */
const REPEATABLE_KEYS = new Set(["point", "tune", "adjust"]);
const REPEATABLE_PER_PAYLOAD = new Set(["balance", "tilt", "deflection"]);

/** Names are identifiers: ASCII letters, digits and `_`, not starting with a digit. */
const NAME_PATTERN = /^[A-Za-z_][A-Za-z0-9_]*$/;

export class BuildContext {
  readonly names = new Map<string, Declared>();
  readonly bodies = new Map<string, Body>();
  readonly joints = new Map<string, Joint>();
  readonly parallelograms = new Map<string, Parallelogram>();
  readonly payloads = new Map<string, Payload>();
  materials: Record<string, Material> = {};
  readonly symbols: SymbolTable = { declarations: [], references: [] };
  /** Set when a joint or stage could not be built (its error stands): the joint graph is then
   * incomplete, so what it says about unheld joints and unconnected bodies would mislead. */
  jointGraphIncomplete = false;

  constructor(readonly r: Reporter) {}

  /** Reports a name that is not an identifier; true if it is fine. */
  checkName(text: string, at: Span): boolean {
    if (NAME_PATTERN.test(text)) return true;
    this.r.add(
      "value.invalid",
      at,
      `the name \`${text}\` may use only the letters A-Z and a-z, digits and _ (not starting with a digit)`,
    );
    return false;
  }

  kindOf(name: string): SymbolKind | undefined {
    return this.names.get(name)?.kind;
  }

  // ---- resolution ----

  /** `body`, `body.point`, `body(x, y)`: the longest dotted prefix naming a body is the body; at
   * most one part after it names a point; an inline point goes on the body alone. */
  resolvePoint(
    ref: ReferenceNode,
    key: string,
    opts: { keepBodyOnBadPoint?: boolean } = {},
  ): Attachment | undefined {
    const a = this.resolvePointStrict(ref, key);
    if (a || !opts.keepBodyOnBadPoint) return a;
    // The point was wrong (and reported) but the body is known: keep the body, at its origin, so
    // that the joint graph stays whole for the editor and the mobility count.
    for (let k = ref.parts.length; k >= 1; k--) {
      const body = this.bodies.get(
        ref.parts
          .slice(0, k)
          .map((p) => p.text)
          .join("."),
      );
      if (body) return { body: body.id, point: { x: 0, y: 0 }, span: ref.span };
    }
    return undefined;
  }

  private resolvePointStrict(ref: ReferenceNode, key: string): Attachment | undefined {
    const parts = ref.parts;
    let body: Body | undefined;
    let k = parts.length;
    for (; k >= 1; k--) {
      body = this.bodies.get(
        parts
          .slice(0, k)
          .map((p) => p.text)
          .join("."),
      );
      if (body) break;
    }
    if (!body) {
      this.reportUnknownBody(ref);
      return undefined;
    }
    this.referBody(body, ref, k);
    const rest = parts.slice(k);
    if (rest.length === 0) {
      if (ref.point) {
        const p = pointValue(ref.point, key, "length", this.r);
        return p ? { body: body.id, point: p, span: ref.span } : undefined;
      }
      return { body: body.id, point: { x: 0, y: 0 }, span: ref.span };
    }
    if (rest.length > 1) {
      this.r.add(
        "value.invalid",
        rest[1]!.span,
        `\`${this.r.quote(ref.span)}\` has too many parts: write \`body.point\` or \`body(x, y)\``,
      );
      return undefined;
    }
    const pointPart = rest[0]!;
    if (ref.point) {
      this.r.add(
        "value.invalid",
        ref.point.span,
        `an inline point goes on the body alone: \`${body.id}(x, y)\`, not after \`${body.id}.${pointPart.text}\``,
      );
      return undefined;
    }
    const p = body.points[pointPart.text];
    if (!p) {
      const names = Object.keys(body.points);
      const best = closestWord(pointPart.text, names);
      const list = names.length === 0 ? "it has no named points" : `its points are ${listWords(names)}`;
      this.r.add(
        "name.unknown-point",
        pointPart.span,
        `${body.id} has no point \`${pointPart.text}\`${best ? `; did you mean \`${best}\`?` : ""} (${list})`,
        best ? { data: { suggestion: best } } : {},
      );
      return undefined;
    }
    this.symbols.references.push({
      span: pointPart.span,
      target: { kind: "point", id: `${body.id}.${pointPart.text}` },
    });
    return { body: body.id, point: { ...p }, pointName: pointPart.text, span: ref.span };
  }

  private referBody(body: Body, ref: ReferenceNode, partsUsed: number): void {
    const generatedBy = body.origin.generatedBy;
    if (generatedBy && partsUsed >= 2) {
      this.symbols.references.push({
        span: ref.parts[0]!.span,
        target: { kind: "parallelogram", id: generatedBy },
      });
      this.symbols.references.push({ span: ref.parts[1]!.span, target: { kind: "body", id: body.id } });
      return;
    }
    const kind: SymbolKind = body.kind === "base" ? "base" : "link";
    this.symbols.references.push({ span: ref.parts[0]!.span, target: { kind, id: body.id } });
  }

  private reportUnknownBody(ref: ReferenceNode): void {
    const first = ref.parts[0]!;
    const kind = this.kindOf(first.text);
    if (kind === "parallelogram") {
      this.symbols.references.push({ span: first.span, target: { kind: "parallelogram", id: first.text } });
      const bodies = ["lower", "upper", "head"].map((b) => `${first.text}.${b}`);
      const second = ref.parts[1];
      if (second) {
        const best = closestWord(second.text, ["lower", "upper", "head"]);
        this.r.add(
          "name.unknown",
          second.span,
          `${first.text} has no body \`${second.text}\`${best ? `; did you mean \`${best}\`?` : ""} (a parallelogram makes ${listWords(bodies)})`,
          best ? { data: { suggestion: best } } : {},
        );
      } else {
        this.r.add(
          "value.invalid",
          first.span,
          `\`${first.text}\` is a parallelogram: refer to one of its bodies, ${listWords(bodies)}`,
        );
      }
      return;
    }
    if (kind) {
      this.r.add("value.invalid", first.span, `\`${first.text}\` is a ${kind}, not a body`);
      return;
    }
    const best = closestWord(
      first.text,
      [...this.bodies.keys()].filter((id) => !id.includes(".")).concat([...this.parallelograms.keys()]),
    );
    this.r.add(
      "name.unknown",
      first.span,
      `unknown body \`${first.text}\`${best ? `; did you mean \`${best}\`?` : ""}`,
      best ? { data: { suggestion: best } } : {},
    );
  }

  /** A material by name: declared in the arm or built in. */
  resolveMaterial(word: Read<string>): string | undefined {
    if (this.materials[word.value]) {
      this.symbols.references.push({ span: word.span, target: { kind: "material", id: word.value } });
      return word.value;
    }
    const kind = this.kindOf(word.value);
    if (kind) {
      this.r.add("value.invalid", word.span, `\`${word.value}\` is a ${kind}, not a material`);
      return undefined;
    }
    const best = closestWord(word.value, Object.keys(this.materials));
    this.r.add(
      "name.unknown",
      word.span,
      `unknown material \`${word.value}\`${best ? `; did you mean \`${best}\`?` : ""}`,
      best ? { data: { suggestion: best } } : {},
    );
    return undefined;
  }

  /** A name of one of the given kinds; returns the name and its kind. */
  resolveName(
    word: Read<string>,
    kinds: readonly SymbolKind[],
    what: string,
  ): { id: string; kind: SymbolKind } | undefined {
    const kind = this.kindOf(word.value);
    if (kind && kinds.includes(kind)) {
      this.symbols.references.push({ span: word.span, target: { kind, id: word.value } });
      return { id: word.value, kind };
    }
    if (kind) {
      this.r.add("value.invalid", word.span, `\`${word.value}\` is a ${kind}, not ${what}`);
      return undefined;
    }
    const candidates = [...this.names].filter(([, d]) => kinds.includes(d.kind)).map(([n]) => n);
    const best = closestWord(word.value, candidates);
    this.r.add(
      "name.unknown",
      word.span,
      `unknown ${kinds.join(" or ")} \`${word.value}\`${best ? `; did you mean \`${best}\`?` : ""}`,
      best ? { data: { suggestion: best } } : {},
    );
    return undefined;
  }
}

export function listWords(words: readonly string[], joiner: "and" | "or" = "and"): string {
  if (words.length <= 1) return words.join("");
  return `${words.slice(0, -1).join(", ")} ${joiner} ${words[words.length - 1]}`;
}

/** A declaration's properties grouped by key and checked against its schema entry. */
export class Props {
  private readonly byKey = new Map<string, PropertyNode[]>();
  readonly what: string;

  constructor(
    readonly decl: DeclarationNode,
    readonly spec: DeclarationSpec,
    readonly r: Reporter,
  ) {
    this.what = decl.name ? `${decl.keyword.text} ${decl.name.text}` : decl.keyword.text;
    const keys = spec.properties.map((p) => p.key);
    for (const prop of decl.properties) {
      const key = prop.key.text;
      if (!keys.includes(key)) {
        const best = closestWord(key, keys);
        this.r.add(
          "property.unknown",
          prop.key.span,
          `${decl.keyword.text} has no property \`${key}\`${best ? `; did you mean \`${best}\`?` : ""}`,
          best ? { data: { suggestion: best } } : {},
        );
        continue;
      }
      const list = this.byKey.get(key) ?? [];
      if (
        list.length > 0 &&
        !REPEATABLE_KEYS.has(key) &&
        !(REPEATABLE_PER_PAYLOAD.has(key) && decl.keyword.text === "require")
      ) {
        this.r.add(
          "property.repeated",
          prop.key.span,
          `\`${key}\` is given twice in ${this.what}; this one counts`,
          {
            related: [{ span: list[list.length - 1]!.span, message: "the earlier one" }],
          },
        );
      }
      list.push(prop);
      this.byKey.set(key, list);
    }
  }

  specOf(key: string): PropertySpec {
    return this.spec.properties.find((p) => p.key === key)!;
  }

  has(key: string): boolean {
    return this.byKey.has(key);
  }

  /** The occurrence that counts (the last). */
  get(key: string): PropertyNode | undefined {
    const list = this.byKey.get(key);
    return list?.[list.length - 1];
  }

  all(key: string): PropertyNode[] {
    return this.byKey.get(key) ?? [];
  }

  keys(): string[] {
    return [...this.byKey.keys()];
  }

  /** A cursor over the values of the property that counts, if given. */
  values(key: string): Values | undefined {
    const prop = this.get(key);
    return prop ? new Values(prop, this.r, this.specOf(key).example) : undefined;
  }

  cursor(prop: PropertyNode): Values {
    return new Values(prop, this.r, this.specOf(prop.key.text).example);
  }

  /** Where a finding about the whole declaration goes: its name, else its keyword. */
  get nameSpan(): Span {
    return this.decl.name?.span ?? this.decl.keyword.span;
  }

  private readonly missingKeys: { key: string; note: string }[] = [];

  /** Notes a missing required property; `flushMissing` reports them all in one finding at the
   * declaration's name (one declaration, one finding for what it lacks). */
  missing(key: string, note = ""): void {
    if (!this.missingKeys.some((m) => m.key === key)) this.missingKeys.push({ key, note });
  }

  flushMissing(): void {
    if (this.missingKeys.length === 0) return;
    const keys = this.missingKeys.map((m) => `\`${m.key}\``);
    const note = [...new Set(this.missingKeys.map((m) => m.note).filter((n) => n))].join("");
    const examples = this.missingKeys.map((m) => this.specOf(m.key).example);
    this.r.add(
      "property.missing",
      this.nameSpan,
      `${this.what} needs ${listWords(keys)}${note}, e.g. \`${examples[0]}\``,
      {
        data: { keys: this.missingKeys.map((m) => m.key), lines: examples },
      },
    );
    this.missingKeys.length = 0;
  }

  /** The span of a property by key, for model origins and for findings on `rate` etc. */
  origin(generatedBy?: string): Origin {
    const properties: Record<string, Span> = {};
    for (const [key, list] of this.byKey) properties[key] = list[list.length - 1]!.span;
    for (const p of this.all("point")) {
      const name = p.values[0];
      if (name?.kind === "reference" && name.parts.length === 1)
        properties[`point.${name.parts[0]!.text}`] = p.span;
    }
    return {
      declaration: this.decl.span,
      ...(this.decl.name ? { name: this.decl.name.span } : {}),
      properties,
      ...(generatedBy ? { generatedBy } : {}),
    };
  }
}
