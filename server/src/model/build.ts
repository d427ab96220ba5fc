// Syntax tree to arm model: names resolved, values in SI, parallelograms expanded, defaults filled,
// and every problem a finding at the words that must change. Best effort: whatever can be built
// is built, so the editor keeps its names even while the text has errors.
import type { ArmNode, DeclarationNode, SyntaxTree } from "../syntax/ast";
import { LineIndex, span } from "../syntax/span";
import type { Finding } from "../findings/finding";
import { closestWord } from "../units/did-you-mean";
import { STANDARD_GRAVITY } from "../units/unit-table";
import type {
  ArmModel,
  Base,
  Body,
  Joint,
  Parallelogram,
  Payload,
  Requirements,
  Spring,
  SweepSettings,
  Swivel,
} from "./types";
import { ARM_PROPERTIES, DECLARATIONS, declarationSpec } from "./schema";
import { builtinMaterials } from "./materials";
import { Reporter, Values, readQuantity } from "./read-values";
import { BuildContext, Props } from "./build-context";
import {
  buildBase,
  buildJoint,
  buildLink,
  buildMaterial,
  buildParallelogram,
  type ParallelogramBuild,
} from "./build-parts";
import { buildSpring } from "./build-springs";
import { baseSwivel, buildSwivel, checkSwivelCuts } from "./build-swivels";
import { readTunings, reportAdjustWithoutRange } from "./build-tuning";
import {
  buildPayload,
  buildRequirements,
  buildAged,
  buildSweep,
  defaultRequirements,
  defaultSweep,
} from "./build-limits";
import { analyseMobility } from "./mobility";
import { buildBearing, buildFastening, readUses } from "./build-hardware";
import type { Bearing, Fastening } from "./types";
import { emptySymbols, type SymbolKind, type SymbolTable } from "./symbols";
import { writtenUnitSystem } from "./written-units";

export interface BuildResult {
  model?: ArmModel;
  findings: Finding[];
  symbols: SymbolTable;
}

export function buildModel(tree: SyntaxTree, text: string): BuildResult {
  const r = new Reporter(text, linesWithSyntaxErrors(tree, text));
  r.units = writtenUnitSystem(tree);
  if (tree.arms.length === 0) {
    const first = /\S/.exec(text);
    const at = first ? span(first.index, lineEnd(text, first.index)) : span(0, 0);
    r.add("arm.missing", at, 'the file has no arm: write `arm "title" { ... }` around the declarations');
    return { findings: r.findings, symbols: emptySymbols() };
  }
  for (const extra of tree.arms.slice(1)) {
    r.add("arm.second", extra.keywordSpan, "a file holds one arm: this second `arm` is ignored", {
      related: [{ span: tree.arms[0]!.keywordSpan, message: "the arm that counts" }],
    });
  }
  const ctx = new BuildContext(r);
  const model = buildArm(ctx, tree.arms[0]!);
  const findings = [...r.findings].sort((a, b) => a.span.start - b.span.start);
  return { model, findings, symbols: ctx.symbols };
}

/** A line the parser already complained about gets no model finding on top (one typo, one finding). */
function linesWithSyntaxErrors(tree: SyntaxTree, text: string): Set<number> {
  if (tree.errors.length === 0) return new Set();
  const index = new LineIndex(text);
  return new Set(tree.errors.map((e) => index.position(e.span.start).line));
}

function lineEnd(text: string, from: number): number {
  const nl = text.indexOf("\n", from);
  return (nl < 0 ? text.length : nl) - (text[nl - 1] === "\r" ? 1 : 0);
}

function buildArm(ctx: BuildContext, arm: ArmNode): ArmModel {
  const r = ctx.r;
  const gravity = readGravity(ctx, arm);

  // 1. Names first, so references may point forward.
  const declared: { decl: DeclarationNode; props: Props; id: string; keyword: string }[] = [];
  let requireDecl: Props | undefined;
  let sweepDecl: Props | undefined;
  let agedDecl: Props | undefined;
  for (const decl of arm.declarations) {
    let spec = declarationSpec(decl.keyword.text);
    if (!spec) {
      const best = closestWord(
        decl.keyword.text,
        DECLARATIONS.map((d) => d.keyword),
      );
      // Read as `best`, the declaration becomes the part its name names (unless that name is taken).
      const builtAs = best && decl.name && !ctx.names.has(decl.name.text) ? decl.name.text : undefined;
      r.add(
        "declaration.unknown",
        decl.keyword.span,
        `unknown declaration \`${decl.keyword.text}\`${best ? `; did you mean \`${best}\`?` : ""}`,
        best ? { data: { suggestion: best, ...(builtAs ? { subject: builtAs } : {}) } } : {},
      );
      // A likely typo is read as the keyword it resembles, so its name and contents still count
      // (and references to it raise nothing more); the error above stands.
      spec = best ? declarationSpec(best) : undefined;
      if (!spec) continue;
    }
    if (!spec.named) {
      const props = r.about(undefined, () => new Props(decl, spec, r));
      ctx.symbols.declarations.push({
        id: spec.keyword,
        kind: spec.keyword as SymbolKind,
        name: spec.keyword,
        nameSpan: decl.keyword.span,
        span: decl.span,
      });
      if (spec.keyword === "require") {
        if (requireDecl)
          r.add("property.repeated", decl.keyword.span, "a second `require` block: put every limit in one", {
            related: [{ span: requireDecl.decl.keyword.span, message: "the first one" }],
          });
        else requireDecl = props;
      } else if (spec.keyword === "aged") {
        if (agedDecl)
          r.add("property.repeated", decl.keyword.span, "a second `aged` block: state one aged case", {
            related: [{ span: agedDecl.decl.keyword.span, message: "the first one" }],
          });
        else agedDecl = props;
      } else if (sweepDecl)
        r.add("property.repeated", decl.keyword.span, "a second `sweep` block: put every setting in one", {
          related: [{ span: sweepDecl.decl.keyword.span, message: "the first one" }],
        });
      else sweepDecl = props;
      continue;
    }
    if (!decl.name) continue; // the syntax error says the name is missing
    const name = decl.name.text;
    if (!ctx.checkName(name, decl.name.span)) continue;
    const earlier = ctx.names.get(name);
    if (earlier) {
      r.add(
        "name.duplicate",
        decl.name.span,
        `\`${name}\` is already the name of a ${earlier.kind}: names are unique within the arm`,
        {
          related: [{ span: earlier.decl.name!.span, message: "the first one" }],
        },
      );
      continue;
    }
    ctx.names.set(name, { kind: spec.keyword as SymbolKind, decl });
    ctx.symbols.declarations.push({
      id: name,
      kind: spec.keyword as SymbolKind,
      name,
      nameSpan: decl.name.span,
      span: decl.span,
    });
    declared.push({
      decl,
      props: r.about(name, () => new Props(decl, spec, r)),
      id: name,
      keyword: spec.keyword,
    });
  }
  const of = (keyword: string) => declared.filter((d) => d.keyword === keyword);

  // 2. Materials: the library, then the arm's own (an own material may shadow a built-in name).
  ctx.materials = builtinMaterials();
  for (const d of of("material"))
    ctx.materials[d.id] = r.about(d.id, () => buildMaterial(ctx, d.props, d.id));

  // 2b. Bearings and fastenings: made of materials, used by the parts below.
  const bearings: Record<string, Bearing> = {};
  for (const d of of("bearing")) {
    const b = r.about(d.id, () => buildBearing(ctx, d.props, d.id));
    if (b) bearings[d.id] = b;
  }
  const fastenings: Record<string, Fastening> = {};
  for (const d of of("fastening")) {
    const f = r.about(d.id, () => buildFastening(ctx, d.props, d.id));
    if (f) fastenings[d.id] = f;
  }

  // 3. Bodies: the base first.
  const bodies: Body[] = [];
  let base: Base | undefined;
  let baseDecl: (typeof declared)[number] | undefined;
  for (const d of of("base")) {
    const built = r.about(d.id, () => buildBase(ctx, d.props, d.id));
    if (base) {
      r.add("base.second", d.decl.name!.span, `an arm has one base: \`${d.id}\` is a second one`, {
        related: [{ span: ctx.names.get(base.bodyId)!.decl.name!.span, message: "the base that counts" }],
      });
      continue;
    }
    base = built.base;
    r.about(d.id, () => readUses(ctx, d.props, { keyword: "base", base: built.base }));
    baseDecl = d;
    bodies.push(built.body);
  }
  if (!base)
    r.add(
      "base.missing",
      arm.keywordSpan,
      "the arm has no `base`: declare the fixed ground, e.g. `base bench { point top (0 mm, 300 mm) }`",
    );
  for (const d of of("link")) bodies.push(r.about(d.id, () => buildLink(ctx, d.props, d.id)));
  const stages: { id: string; build: ParallelogramBuild }[] = [];
  for (const d of of("parallelogram")) {
    const build = r.about(d.id, () => buildParallelogram(ctx, d.props, d.id));
    stages.push({ id: d.id, build });
    bodies.push(...build.bodies);
  }
  for (const b of bodies) ctx.bodies.set(b.id, b);

  // 4. Joints, then the parallelograms' joints (their parents are bodies declared anywhere).
  const joints: Joint[] = [];
  for (const d of of("joint")) {
    const j = r.about(d.id, () => buildJoint(ctx, d.props, d.id));
    if (j) r.about(d.id, () => readUses(ctx, d.props, { keyword: "joint", joint: j }));
    if (j) joints.push(j);
    else ctx.jointGraphIncomplete = true;
  }
  const swivels: Swivel[] = [];
  if (base && baseDecl) {
    const yaw = r.about(baseDecl.id, () => baseSwivel(ctx, base!, baseDecl!.props));
    if (yaw) swivels.push(yaw);
  }
  for (const d of of("swivel")) {
    const built = r.about(d.id, () => buildSwivel(ctx, d.props, d.id));
    if (built) {
      joints.push(built.joint);
      swivels.push(built.swivel);
    } else ctx.jointGraphIncomplete = true;
  }
  const parallelograms: Parallelogram[] = [];
  for (const s of stages) {
    const done = r.about(s.id, () => s.build.finish());
    joints.push(...done.joints);
    if (done.parallelogram) parallelograms.push(done.parallelogram);
    else ctx.jointGraphIncomplete = true;
  }
  for (const j of joints) ctx.joints.set(j.id, j);
  for (const p of parallelograms) ctx.parallelograms.set(p.id, p);

  // 5. Springs and payloads.
  const springs: Spring[] = [];
  for (const d of of("spring")) {
    const s = r.about(d.id, () => buildSpring(ctx, d.props, d.id));
    if (s) r.about(d.id, () => readUses(ctx, d.props, { keyword: "spring", spring: s }));
    if (s) r.about(d.id, () => readTunings(ctx, d.props, s));
    if (s) springs.push(s);
  }
  const payloads: Payload[] = [];
  for (const d of of("payload")) {
    const p = r.about(d.id, () => buildPayload(ctx, d.props, d.id));
    if (p) r.about(d.id, () => readUses(ctx, d.props, { keyword: "payload", payload: p }));
    if (p) {
      payloads.push(p);
      ctx.payloads.set(p.id, p);
    }
  }

  checkSwivelCuts(ctx, joints, swivels, springs);
  reportAdjustWithoutRange(ctx, springs, payloads);

  // 6. Limits and sweep settings.
  const require: Requirements = requireDecl ? buildRequirements(ctx, requireDecl) : defaultRequirements();
  const sweep: SweepSettings = sweepDecl ? buildSweep(ctx, sweepDecl) : defaultSweep();
  const aged = agedDecl ? buildAged(ctx, agedDecl) : undefined;

  for (const d of declared) r.about(d.id, () => d.props.flushMissing());
  requireDecl?.flushMissing();
  sweepDecl?.flushMissing();
  agedDecl?.flushMissing();

  // 7. What holds each joint, and what is connected at all.
  if (!ctx.jointGraphIncomplete) reportMobility(ctx, bodies, base, joints, parallelograms);

  return {
    title: arm.title?.value ?? "",
    gravity,
    ...(base ? { base } : {}),
    bodies,
    joints,
    swivels,
    parallelograms,
    springs,
    payloads,
    materials: ctx.materials,
    bearings,
    fastenings,
    require,
    sweep,
    ...(aged ? { aged } : {}),
    span: arm.span,
  };
}

function readGravity(ctx: BuildContext, arm: ArmNode): number {
  let gravity = STANDARD_GRAVITY;
  const keys = ARM_PROPERTIES.map((p) => p.key);
  const seen = new Set<string>();
  for (const prop of arm.properties) {
    const key = prop.key.text;
    const spec = ARM_PROPERTIES.find((p) => p.key === key);
    if (!spec) {
      const best = closestWord(key, [...keys, ...DECLARATIONS.map((d) => d.keyword)]);
      ctx.r.add(
        "property.unknown",
        prop.key.span,
        `the arm has no property \`${key}\`${best ? `; did you mean \`${best}\`?` : ""}`,
        best ? { data: { suggestion: best } } : {},
      );
      continue;
    }
    if (seen.has(key))
      ctx.r.add("property.repeated", prop.key.span, `\`${key}\` is given twice; this one counts`);
    seen.add(key);
    const v = new Values(prop, ctx.r, spec.example);
    const g = readQuantity(v, ["acceleration"]);
    v.finish();
    if (g && g.value <= 0)
      ctx.r.add(
        "value.impossible",
        g.span,
        `gravity must be positive (it points down), got ${ctx.r.quote(g.span)}`,
      );
    else if (g) gravity = g.value;
  }
  return gravity;
}

function reportMobility(
  ctx: BuildContext,
  bodies: Body[],
  base: Base | undefined,
  joints: Joint[],
  parallelograms: Parallelogram[],
): void {
  const result = analyseMobility(
    bodies.map((b) => b.id),
    base?.bodyId,
    joints.map((j) => ({ id: j.id, parent: j.parent, child: j.child, passive: j.mode === "passive" })),
  );
  const stageIds = new Set(parallelograms.map((p) => p.id));
  for (const block of result.unheld) {
    // Report once per block, on the joint a designer would hold: a declared joint or a stage's own
    // (lower root) joint, which carry the names written in the text.
    const pick = block.passiveJoints.find((id) => !id.includes(".")) ?? block.passiveJoints[0]!;
    const joint = ctx.joints.get(pick)!;
    const at = joint.origin.name ?? joint.origin.declaration;
    const what = stageIds.has(pick)
      ? `parallelogram ${pick}`
      : joint.origin.generatedBy
        ? `joint ${pick} of parallelogram ${joint.origin.generatedBy}`
        : `joint ${pick}`;
    ctx.r.add("joint.unheld", at, `${what} is free but nothing holds it: give it a range or make it fixed`, {
      data: { subject: pick, joints: block.passiveJoints, mobility: block.mobility },
    });
  }
  const reportedStages = new Set<string>();
  for (const id of result.unconnected) {
    const body = ctx.bodies.get(id)!;
    const stage = body.origin.generatedBy;
    if (stage) {
      // A stage whose `on` could not be read already has its error; otherwise say it once.
      if (reportedStages.has(stage) || !ctx.parallelograms.has(stage)) continue;
      reportedStages.add(stage);
      ctx.r.add(
        "body.unconnected",
        body.origin.name ?? body.origin.declaration,
        `parallelogram ${stage} is not connected to the base`,
        { data: { subject: stage } },
      );
      continue;
    }
    if (body.kind === "base") continue;
    ctx.r.add(
      "body.unconnected",
      body.origin.name ?? body.origin.declaration,
      `link ${id} is not connected to the base: no joint chain reaches it`,
      { data: { subject: id } },
    );
  }
}
