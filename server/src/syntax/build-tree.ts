// Turns the concrete syntax tree into the plain syntax tree of ast.ts, with exact spans, and says
// in plain words what is wrong where the text does not fit (one error per line at most).
import type { CstNode, IToken } from "chevrotain";
import type {
  ArmNode,
  DeclarationNode,
  PointNode,
  PropertyNode,
  RegionNode,
  QuantityNode,
  ReferenceNode,
  StringNode,
  SyntaxError,
  ValueNode,
  Identifier as IdentifierNode,
} from "./ast";
import { span, type Span } from "./span";
import { isDeclarationKeyword, UNNAMED_DECLARATIONS } from "./keywords";

type Children = Record<string, (CstNode | IToken)[] | undefined>;

const isToken = (x: CstNode | IToken): x is IToken => (x as IToken).image !== undefined;

/** Longest piece of text quoted in a message before it is cut short. */
const QUOTE_LIMIT = 40;

export function tokenSpan(token: IToken): Span {
  return span(token.startOffset, token.endOffset! + 1);
}

function tokens(children: Children, name: string): IToken[] {
  return (children[name] as IToken[] | undefined)?.filter((t) => !t.isInsertedInRecovery) ?? [];
}

function nodes(children: Children, name: string): CstNode[] {
  return (children[name] as CstNode[] | undefined) ?? [];
}

/** Every token under a node, in source order. */
function allTokens(node: CstNode): IToken[] {
  const out: IToken[] = [];
  const walk = (n: CstNode) => {
    for (const list of Object.values(n.children)) {
      for (const c of list ?? []) {
        if (isToken(c)) {
          if (!c.isInsertedInRecovery) out.push(c);
        } else walk(c);
      }
    }
  };
  walk(node);
  return out.sort((a, b) => a.startOffset - b.startOffset);
}

function nodeSpan(node: CstNode): Span {
  const loc = node.location;
  if (
    loc &&
    Number.isFinite(loc.startOffset) &&
    loc.endOffset !== undefined &&
    Number.isFinite(loc.endOffset)
  )
    return span(loc.startOffset, loc.endOffset + 1);
  const ts = allTokens(node);
  if (ts.length === 0) return span(0, 0);
  return span(ts[0]!.startOffset, ts[ts.length - 1]!.endOffset! + 1);
}

function quote(text: string): string {
  const oneLine = text.replace(/\s+/g, " ");
  return oneLine.length > QUOTE_LIMIT ? `${oneLine.slice(0, QUOTE_LIMIT)}...` : oneLine;
}

/** The direct parts of a node (tokens and sub-rules) in source order. */
function ordered(node: CstNode): (CstNode | IToken)[] {
  const parts: (CstNode | IToken)[] = [];
  for (const list of Object.values(node.children))
    for (const c of list ?? []) if (!isToken(c) || !c.isInsertedInRecovery) parts.push(c);
  const starts = new Map(parts.map((p) => [p, isToken(p) ? p.startOffset : nodeSpan(p).start]));
  return parts.sort((a, b) => starts.get(a)! - starts.get(b)!);
}

interface UnclosedAtEnd {
  brace: Span;
  what: string;
}

export class TreeBuilder {
  readonly errors: SyntaxError[] = [];
  private readonly erroredLines = new Set<number>();
  private readonly unclosedAtEnd: UnclosedAtEnd[] = [];
  private readonly lineStarts: number[] = [0];

  constructor(
    private readonly text: string,
    /** Offset just past the last token of the file: a block that runs to it was never closed. */
    private readonly lastTokenEnd: number,
  ) {
    for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) this.lineStarts.push(i + 1);
  }

  /** Records an error unless its line already has one (one typo, one diagnostic). */
  error(message: string, at: Span): void {
    const line = this.lineOf(at.start);
    if (this.erroredLines.has(line)) return;
    this.erroredLines.add(line);
    this.errors.push({ message, span: at });
  }

  private lineOf(offset: number): number {
    let lo = 0;
    let hi = this.lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.lineStarts[mid]! <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  private textOf(s: Span): string {
    return quote(this.text.slice(s.start, s.end));
  }

  // ---- document ----

  document(cst: CstNode): ArmNode[] {
    const arms: MutableArm[] = [];
    /** Set while a stray `}` has closed an arm too early: what follows goes back into it. */
    let reopened: MutableArm | undefined;
    const reported = new Set<MutableArm>();
    for (const part of ordered(cst)) {
      if (isToken(part)) {
        if (part.tokenType.name !== "RCurly") continue;
        if (reopened) {
          reopened.closeAt(tokenSpan(part));
          reopened = undefined;
        } else this.error("unexpected `}`: nothing is open here", tokenSpan(part));
        continue;
      }
      if (part.name === "item") {
        const head = tokens(part.children, "Identifier")[0]!;
        const block = nodes(part.children, "block")[0];
        const last = arms[arms.length - 1];
        const looksLikeArm =
          head.image === "arm" || (block !== undefined && !isDeclarationKeyword(head.image) && !last);
        if (looksLikeArm && block) {
          if (head.image !== "arm")
            this.error(
              `unknown word \`${head.image}\`: a file starts with \`arm "title" {\``,
              tokenSpan(head),
            );
          arms.push(this.arm(part, head, block));
          reopened = undefined;
          continue;
        }
        if (last && (last.closeBrace || reopened === last)) {
          // A declaration after the arm's closing brace: that brace was most likely one too many.
          if (!reported.has(last) && last.closeBrace) {
            this.error(
              "this `}` closes the arm, but declarations follow it: is it one `}` too many?",
              last.closeBrace,
            );
            reported.add(last);
          }
          reopened = last;
          last.reopen();
          this.armItem(part, last);
          continue;
        }
        if (head.image === "arm") this.error("expected `{` after the arm's title", nodeSpan(part));
        else
          this.error(
            `\`${head.image}\` is outside the arm: declarations go inside \`arm "title" { ... }\``,
            tokenSpan(head),
          );
        continue;
      }
      if (part.name === "block") {
        this.error(
          'a `{` with nothing before it: expected `arm "title" {`',
          tokenSpan(tokens(part.children, "LCurly")[0]!),
        );
        continue;
      }
      if (part.name === "strayLine") this.strayLine(part);
    }
    this.reportUnclosedAtEnd();
    return arms.map((a) => a.node);
  }

  private reportUnclosedAtEnd(): void {
    if (this.unclosedAtEnd.length === 0) return;
    // Report only the innermost: the outer ones are unclosed for the same reason.
    const innermost = this.unclosedAtEnd.reduce((a, b) => (b.brace.start > a.brace.start ? b : a));
    const others = this.unclosedAtEnd.filter((u) => u !== innermost).map((u) => u.what);
    const also = others.length > 0 ? ` (and so is the \`{\` of ${others.join(", ")})` : "";
    this.errors.push({ message: `unclosed \`{\` of ${innermost.what}${also}`, span: innermost.brace });
  }

  // ---- arm ----

  private arm(item: CstNode, head: IToken, block: CstNode): MutableArm {
    let title: StringNode | undefined;
    for (const [i, v] of nodes(item.children, "value").entries()) {
      const node = this.value(v);
      if (i === 0 && node?.kind === "string") title = node;
      else if (node)
        this.error(`unexpected \`${this.textOf(node.span)}\`: the arm takes a title in quotes`, node.span);
    }
    for (const j of nodes(item.children, "junk")) this.junk(j);
    const lcurly = tokens(block.children, "LCurly")[0]!;
    const arm = new MutableArm(tokenSpan(head), title, tokenSpan(lcurly));
    const body = nodes(block.children, "body")[0];
    if (body) for (const part of ordered(body)) if (!isToken(part)) this.armPart(part, arm);
    const rcurly = tokens(block.children, "RCurly")[0];
    if (rcurly) arm.closeAt(tokenSpan(rcurly));
    else {
      arm.extendTo(nodeSpan(block).end);
      this.unclosed(tokenSpan(lcurly), "the arm", nodeSpan(block).end);
    }
    return arm;
  }

  private armPart(part: CstNode, arm: MutableArm): void {
    if (part.name === "item") this.armItem(part, arm);
    else if (part.name === "block")
      this.error("a `{` with no declaration before it", tokenSpan(tokens(part.children, "LCurly")[0]!));
    else if (part.name === "strayLine") this.strayLine(part);
  }

  private armItem(item: CstNode, arm: MutableArm): void {
    const head = tokens(item.children, "Identifier")[0]!;
    const block = nodes(item.children, "block")[0];
    if (block) {
      arm.declarations.push(this.declaration(item, head, block));
      arm.extendTo(nodeSpan(item).end);
      return;
    }
    if (isDeclarationKeyword(head.image)) {
      this.error(`expected \`{\` after \`${this.textOf(nodeSpan(item))}\``, nodeSpan(item));
      return;
    }
    arm.properties.push(this.property(item, head));
    arm.extendTo(nodeSpan(item).end);
  }

  // ---- declarations ----

  private declaration(item: CstNode, head: IToken, block: CstNode): DeclarationNode {
    const keyword: IdentifierNode = { text: head.image, span: tokenSpan(head) };
    const values = nodes(item.children, "value").map((v) => this.value(v));
    let name: IdentifierNode | undefined;
    const first = values[0];
    if (first?.kind === "reference" && first.parts.length === 1 && !first.point) name = first.parts[0];
    const known = isDeclarationKeyword(head.image);
    const named = !(UNNAMED_DECLARATIONS as readonly string[]).includes(head.image);
    if (first && !name)
      this.error(`expected a name after \`${head.image}\`, got \`${this.textOf(first.span)}\``, first.span);
    else if (name && !named)
      this.error(`\`${head.image}\` takes no name: write \`${head.image} {\``, name.span);
    else if (!name && named && known)
      this.error(`\`${head.image}\` needs a name: \`${head.image} NAME {\``, keyword.span);
    for (const extra of values.slice(1))
      if (extra) this.error(`unexpected \`${this.textOf(extra.span)}\` before \`{\``, extra.span);
    for (const j of nodes(item.children, "junk")) this.junk(j);

    const what = name ? `${head.image} ${name.text}` : head.image;
    const lcurly = tokens(block.children, "LCurly")[0]!;
    const properties: PropertyNode[] = [];
    const body = nodes(block.children, "body")[0];
    if (body) {
      for (const part of ordered(body)) {
        if (isToken(part)) continue;
        if (part.name === "item") {
          const h = tokens(part.children, "Identifier")[0]!;
          const inner = nodes(part.children, "block")[0];
          if (inner)
            this.error(
              `a \`{ }\` block cannot sit inside ${what}`,
              tokenSpan(tokens(inner.children, "LCurly")[0]!),
            );
          else properties.push(this.property(part, h));
        } else if (part.name === "block")
          this.error(
            `a \`{ }\` block cannot sit inside ${what}`,
            tokenSpan(tokens(part.children, "LCurly")[0]!),
          );
        else if (part.name === "strayLine") this.strayLine(part);
      }
    }
    const rcurly = tokens(block.children, "RCurly")[0];
    const blockEnd = nodeSpan(block).end;
    if (!rcurly) this.unclosed(tokenSpan(lcurly), what, blockEnd);
    return {
      kind: "declaration",
      keyword,
      ...(name ? { name } : {}),
      properties,
      bodySpan: span(lcurly.startOffset, blockEnd),
      span: span(head.startOffset, blockEnd),
    };
  }

  private unclosed(brace: Span, what: string, blockEnd: number): void {
    if (blockEnd >= this.lastTokenEnd) this.unclosedAtEnd.push({ brace, what });
    else this.error(`unclosed \`{\` of ${what}`, brace);
  }

  // ---- properties and values ----

  private property(item: CstNode, head: IToken): PropertyNode {
    const values: ValueNode[] = [];
    for (const v of nodes(item.children, "value")) values.push(...this.valueNodes(v));
    for (const j of nodes(item.children, "junk")) this.junk(j, head);
    return {
      kind: "property",
      key: { text: head.image, span: tokenSpan(head) },
      values,
      span: nodeSpan(item),
    };
  }

  private value(v: CstNode): ValueNode | undefined {
    return this.valueNodes(v)[0];
  }

  /** A value's nodes: one, except `word (x1, y1) .. (x2, y2)` (a `tune anchor` line), which reads
   * as the word and the region after it. */
  private valueNodes(v: CstNode): ValueNode[] {
    const c = v.children as Children;
    const ref = nodes(c, "reference")[0];
    const tail = ref && nodes(ref.children as Children, "regionTail")[0];
    if (ref && tail) {
      const word = this.reference(ref, false);
      const low = this.point(nodes(ref.children as Children, "point")[0]!);
      const region = low ? this.region(low, tail) : undefined;
      return region ? [word, region] : [word];
    }
    const one = this.singleValue(v);
    return one ? [one] : [];
  }

  private singleValue(v: CstNode): ValueNode | undefined {
    const c = v.children as Children;
    const qf = nodes(c, "quantityForm")[0];
    if (qf) return this.quantityForm(qf);
    const pf = nodes(c, "pointForm")[0];
    if (pf) {
      const pc = pf.children as Children;
      const low = this.point(nodes(pc, "point")[0]!);
      const tail = nodes(pc, "regionTail")[0];
      return low && tail ? this.region(low, tail) : low;
    }
    const ref = nodes(c, "reference")[0];
    if (ref) return this.reference(ref);
    const str = tokens(c, "StringLiteral")[0];
    if (str) return { kind: "string", value: unescape(str.image.slice(1, -1)), span: tokenSpan(str) };
    const open = tokens(c, "UnclosedString")[0];
    if (open) {
      this.error('unclosed string: add the closing `"`', tokenSpan(open));
      return { kind: "string", value: unescape(open.image.slice(1)), span: tokenSpan(open) };
    }
    return undefined;
  }

  private quantityForm(node: CstNode): ValueNode {
    const c = node.children as Children;
    const qs = nodes(c, "quantity").map((q) => this.quantity(q));
    const low = qs[0]!;
    const joiner = tokens(c, "DotDot")[0] ?? tokens(c, "Cross")[0];
    if (!joiner) return low;
    const high = qs[1];
    if (!high) {
      this.error(`expected a number after \`${joiner.image}\``, tokenSpan(joiner));
      return low;
    }
    const whole = span(low.span.start, high.span.end);
    return joiner.tokenType.name === "DotDot"
      ? { kind: "range", low, high, span: whole }
      : { kind: "dims", first: low, second: high, span: whole };
  }

  private quantity(node: CstNode): QuantityNode {
    const c = node.children as Children;
    const num = tokens(c, "NumberLiteral")[0]!;
    const unitToken = tokens(c, "CompoundUnit")[0] ?? tokens(c, "Identifier")[0];
    const numberSpan = tokenSpan(num);
    return {
      kind: "quantity",
      value: Number(num.image),
      numberText: num.image,
      numberSpan,
      ...(unitToken ? { unit: { text: unitToken.image, span: tokenSpan(unitToken) } } : {}),
      span: unitToken ? span(numberSpan.start, unitToken.endOffset! + 1) : numberSpan,
    };
  }

  private point(node: CstNode): PointNode | undefined {
    const c = node.children as Children;
    const lparen = tokens(c, "LParen")[0]!;
    const qs = nodes(c, "quantity").map((q) => this.quantity(q));
    const comma = tokens(c, "Comma")[0];
    const comma2 = tokens(c, "Comma")[1];
    const rparen = tokens(c, "RParen")[0];
    const x = qs[0] && (!comma || qs[0].span.start < comma.startOffset) ? qs[0] : undefined;
    const y = x ? qs[1] : qs[0];
    const z = comma2 ? qs.find((q) => q.span.start > comma2.startOffset) : undefined;
    if (comma2 && !z) this.error("expected the third component after `,`", tokenSpan(comma2));
    if (!x)
      this.error(
        "expected the point's x after `(`, e.g. `(40 mm, 0 mm)`",
        comma ? tokenSpan(comma) : tokenSpan(lparen),
      );
    else if (!comma) this.error("expected `,` between the point's x and y", y ? y.span : x.span);
    else if (!y) this.error("expected the point's y after `,`", tokenSpan(comma));
    else if (!rparen) this.error("unclosed `(`: expected `)` after the point's y", tokenSpan(lparen));
    if (!x || !y || !comma) return undefined;
    return { kind: "point", x, y, ...(z ? { z } : {}), span: nodeSpan(node) };
  }

  /** `(x1, y1) .. (x2, y2)` from its first point and the `.. (x2, y2)` after it. */
  private region(low: PointNode, tail: CstNode): RegionNode | undefined {
    const tc = tail.children as Children;
    const dots = tokens(tc, "DotDot")[0]!;
    const pt = nodes(tc, "point")[0];
    if (!pt) {
      this.error("expected the region's far corner `(x, y)` after `..`", tokenSpan(dots));
      return undefined;
    }
    const high = this.point(pt);
    if (!high) return undefined;
    return { kind: "region", low, high, span: span(low.span.start, high.span.end) };
  }

  private reference(node: CstNode, withPoint = true): ReferenceNode {
    const c = node.children as Children;
    const ids = tokens(c, "Identifier").map((t) => ({ text: t.image, span: tokenSpan(t) }));
    const dots = tokens(c, "Dot");
    // Every dot is followed by a name unless the reference stops at a dangling dot (`mast.`).
    const dangling = dots.length >= ids.length ? dots[dots.length - 1] : undefined;
    if (dangling)
      this.error(
        `expected a point name after \`${this.textOf(span(ids[0]!.span.start, dangling.endOffset! + 1))}\``,
        tokenSpan(dangling),
      );
    if (!withPoint) {
      // The point after the name starts a region: the reference is the name alone.
      const last =
        dots.length >= ids.length ? dots[dots.length - 1]!.endOffset! + 1 : ids[ids.length - 1]!.span.end;
      return { kind: "reference", parts: ids, span: span(ids[0]!.span.start, last) };
    }
    const pt = nodes(c, "point")[0];
    const point = pt ? this.point(pt) : undefined;
    const whole = nodeSpan(node);
    return { kind: "reference", parts: ids, ...(point ? { point } : {}), span: whole };
  }

  /** Left-over tokens after a line's values. */
  private junk(node: CstNode, key?: IToken): void {
    const ts = allTokens(node);
    const first = ts[0]!;
    const whole = span(first.startOffset, ts[ts.length - 1]!.endOffset! + 1);
    switch (first.tokenType.name) {
      case "CompoundUnit":
        this.error(`expected a number before the unit \`${first.image}\``, tokenSpan(first));
        return;
      case "DotDot":
      case "Cross":
        this.error(`expected a number before \`${first.image}\``, tokenSpan(first));
        return;
      case "Comma":
        // `1,5 mm`: a decimal comma between two digits.
        if (
          /\d/.test(this.text[first.startOffset - 1] ?? "") &&
          /\d/.test(this.text[first.endOffset! + 1] ?? "")
        ) {
          this.error("write decimals with a point, e.g. `1.5`, not a comma", tokenSpan(first));
          return;
        }
        this.error(`unexpected \`${this.textOf(whole)}\`${key ? ` after \`${key.image}\`` : ""}`, whole);
        return;
      default: {
        const after = key ? ` after \`${key.image}\`` : "";
        this.error(`unexpected \`${this.textOf(whole)}\`${after}`, whole);
      }
    }
  }

  private strayLine(node: CstNode): void {
    const whole = nodeSpan(node);
    const first = allTokens(node)[0];
    if (first?.tokenType.name === "NumberLiteral")
      this.error(`expected a property name before \`${this.textOf(whole)}\``, whole);
    else this.error(`unexpected \`${this.textOf(whole)}\``, whole);
  }
}

/** An arm under construction: a stray `}` may close it early and what follows is added back. */
class MutableArm {
  readonly declarations: DeclarationNode[] = [];
  readonly properties: PropertyNode[] = [];
  closeBrace?: Span;
  private end: number;

  constructor(
    readonly keywordSpan: Span,
    readonly title: StringNode | undefined,
    readonly lcurly: Span,
  ) {
    this.end = lcurly.end;
  }

  closeAt(brace: Span): void {
    this.closeBrace = brace;
    this.end = Math.max(this.end, brace.end);
  }

  reopen(): void {
    delete this.closeBrace;
  }

  extendTo(end: number): void {
    this.end = Math.max(this.end, end);
  }

  get node(): ArmNode {
    return {
      kind: "arm",
      keywordSpan: this.keywordSpan,
      ...(this.title ? { title: this.title } : {}),
      declarations: this.declarations,
      properties: this.properties,
      bodySpan: span(this.lcurly.start, this.end),
      span: span(this.keywordSpan.start, this.end),
    };
  }
}

function unescape(raw: string): string {
  return raw.replace(/\\(.)/g, (_m, ch: string) => (ch === "n" ? "\n" : ch === "t" ? "\t" : ch));
}
