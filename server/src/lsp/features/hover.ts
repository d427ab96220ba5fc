// Hover: a quantity in both unit systems; a name with what it is, its key properties and the
// analysis figures (readouts, worst safety); a property's meaning; the explanation of the finding
// under the cursor; on a part's name, the findings about it (by their subject). Figures come from
// the last good analysis while a new one runs.
import type { Hover } from "vscode-languageserver";
import type { Analysis } from "../../analysis";
import { CODES } from "../../findings/codes";
import type { Finding } from "../../findings/finding";
import type { Figure, PartReadout } from "../../checks/readout";
import type { ArmModel, Body, Spring } from "../../model/types";
import { ARM_PROPERTIES, declarationSpec } from "../../model/schema";
import { springKind } from "../../model/spring-kinds";
import { spanContains } from "../../syntax/span";
import type { QuantityNode } from "../../syntax/ast";
import { formatNumber, formatQuantity, formatResult, otherSystem } from "../../units/format";
import { parseUnit, dimensionNameOf } from "../../units/quantity";
import type { UnitSystem } from "../../units/unit-table";
import type { ServerFeature } from "../context";
import { spanToRange } from "../convert";
import { occurrenceAt, type NameSymbol } from "../../services/names";
import { guarded } from "../safe";
import type { SyntaxView } from "../session/syntax-view";
import { spotAt } from "../../services/tree-walk";
import { shownUnits } from "../session/settings";

const f = formatQuantity;

function quantityHover(q: QuantityNode, system: UnitSystem): string | undefined {
  if (!q.unit) return undefined;
  const parsed = parseUnit(q.unit.text);
  if (!parsed.ok) return undefined;
  const dimension = dimensionNameOf(parsed.unit.dimension);
  if (!dimension) return undefined;
  const si = q.value * parsed.unit.factor;
  const lines = [`**${q.numberText} ${q.unit.text}** (${dimension.replace("_", " ")})`];
  // The user's display system first, then the other one.
  lines.push(`= ${f(si, dimension, system)} · ${f(si, dimension, otherSystem(system))}`);
  return lines.join("\n\n");
}

function bodyFacts(b: Body, system: UnitSystem): string[] {
  const facts: string[] = [];
  if (b.length > 0) facts.push(`length ${f(b.length, "length", system)}`);
  facts.push(
    `mass ${f(b.mass, "mass", system)}${b.massGiven ? " (given)" : b.material ? ` (${b.material})` : ""}`,
  );
  const pts = Object.keys(b.points);
  if (pts.length) facts.push(`points ${pts.join(", ")}`);
  return facts;
}

function springFacts(s: Spring, system: UnitSystem): string[] {
  return springKind(s).facts(s, (value, dimension) => f(value, dimension, system));
}

function modelFacts(model: ArmModel, symbol: NameSymbol, system: UnitSystem): string[] {
  const id = symbol.id;
  switch (symbol.kind) {
    case "base":
    case "link":
    case "bar":
    case "head": {
      const b = model.bodies.find((x) => x.id === id);
      return b ? bodyFacts(b, system) : [];
    }
    case "joint": {
      const j = model.joints.find((x) => x.id === id);
      if (!j) return [];
      const facts = [`${j.parent} → ${j.child}`, `angle ${f(j.angle, "angle", system)}`];
      if (j.mode === "range" && j.range)
        facts.push(`range ${f(j.range[0], "angle", system)} .. ${f(j.range[1], "angle", system)}`);
      else facts.push(j.mode);
      if (j.pin) facts.push(`pin ${f(j.pin.diameter, "length", system)} ${j.pin.material}`);
      return facts;
    }
    case "swivel": {
      const s = (model.swivels ?? []).find((x) => x.id === id);
      if (!s) return [];
      const facts = [`${s.parent} → ${s.child ?? "everything on it"}`];
      facts.push(
        s.heading
          ? `heading ${f(s.heading[0], "angle", system)} .. ${f(s.heading[1], "angle", system)}`
          : "heading all the way round",
      );
      if (s.bearings) facts.push(`bearings ${f(s.bearings.spacing, "length", system)} apart`);
      return facts;
    }
    case "parallelogram": {
      const p = model.parallelograms.find((x) => x.id === id);
      if (!p) return [];
      const facts = [
        `on ${p.parent}`,
        `length ${f(p.length, "length", system)}`,
        `spacing ${f(p.spacing, "length", system)}`,
        `angle ${f(p.angle, "angle", system)}`,
      ];
      if (p.range) facts.push(`range ${f(p.range[0], "angle", system)} .. ${f(p.range[1], "angle", system)}`);
      facts.push(`bodies ${p.bodies.lower}, ${p.bodies.upper}, ${p.bodies.head}`);
      return facts;
    }
    case "spring": {
      const s = model.springs.find((x) => x.id === id);
      return s ? springFacts(s, system) : [];
    }
    case "payload": {
      const p = model.payloads.find((x) => x.id === id);
      if (!p) return [];
      const facts = [`mass ${f(p.mass, "mass", system)}`, `on ${p.body}`];
      if (p.massRange)
        facts.push(`mass range ${f(p.massRange[0], "mass", system)} .. ${f(p.massRange[1], "mass", system)}`);
      return facts;
    }
    case "material": {
      const m = model.materials[id];
      if (!m) return [];
      const facts = [
        `density ${f(m.density, "density", system)}`,
        `modulus ${f(m.modulus, "pressure", system)}`,
        `strength ${f(m.strength, "pressure", system)}`,
      ];
      if (m.layerStrength !== undefined)
        facts.push(`across layers ${f(m.layerStrength, "pressure", system)}`);
      if (m.source) facts.push(`source: ${m.source}`);
      return facts;
    }
    case "bearing": {
      const b = model.bearings[id];
      if (!b) return [];
      switch (b.kind) {
        case "balls":
          return [
            `${b.count} balls of ${f(b.ballDiameter, "length", system)} ${b.ballMaterial}`,
            `pitch ${f(b.pitchDiameter, "length", system)}`,
            `races ${b.raceMaterial}`,
          ];
        case "plain":
          return [
            `plain bearing: bore ${f(b.bore, "length", system)}`,
            `length ${f(b.length, "length", system)}`,
            b.material,
          ];
        case "rated":
          return [`static rating C0 ${f(b.staticRating, "force", system)}`];
      }
      return [];
    }
    case "fastening": {
      const x = model.fastenings[id];
      if (!x) return [];
      switch (x.kind) {
        case "screws":
          return [
            `${x.count} screws of ${f(x.diameter, "length", system)} into ${x.into}`,
            `engagement ${f(x.engagement, "length", system)} (${x.thread})`,
          ];
        case "bolts":
          return [`${x.count} bolts of ${f(x.diameter, "length", system)} ${x.material}`];
        case "glue":
          return [`${x.adhesive} over ${f(x.area, "area", system)}`];
      }
      return [];
    }
    case "point": {
      const body = model.bodies.find((b) => b.id === symbol.parent);
      const p = body?.points[symbol.name];
      return p ? [`(${f(p.x, "length", system)}, ${f(p.y, "length", system)}) on ${body!.id}`] : [];
    }
  }
}

function figureLine(fig: Figure, system: UnitSystem): string {
  const value =
    fig.high !== undefined
      ? `${formatResult(fig.value, fig.dimension, system)} .. ${formatResult(fig.high, fig.dimension, system)}`
      : formatResult(fig.value, fig.dimension, system);
  return `- ${fig.label}: ${value}${fig.where ? ` (${fig.where})` : ""}`;
}

/** The figures that matter most lead: the least safety factor and the figures the results record
 * holds (each check tags those); the rest, and the notes, follow under "More". */
function readoutLines(r: PartReadout, system: UnitSystem): { lead: string[]; more: string[] } {
  const lead: string[] = [];
  if (r.worstSafety)
    lead.push(
      `- least safety factor: **${formatNumber(r.worstSafety.value)}** (${r.worstSafety.what}${r.worstSafety.where ? `, ${r.worstSafety.where}` : ""})`,
    );
  const tagged = r.figures.filter((fig) => fig.result);
  // A part no check tags still leads with something: its first two figures.
  const leading = tagged.length ? tagged : r.figures.slice(0, 2);
  lead.push(...leading.map((fig) => figureLine(fig, system)));
  const more = r.figures.filter((fig) => !leading.includes(fig)).map((fig) => figureLine(fig, system));
  more.push(...r.notes.map((note) => `- ${note}`));
  return { lead, more };
}

/** "1 error, 2 warnings" for the findings about a part, or nothing when it has none. */
function troubleCount(findings: readonly Finding[]): string {
  const count = (severity: string) => findings.filter((f) => f.severity === severity).length;
  const errors = count("error");
  const warnings = count("warning");
  const words = [
    errors ? `${errors} error${errors > 1 ? "s" : ""}` : "",
    warnings ? `${warnings} warning${warnings > 1 ? "s" : ""}` : "",
  ].filter(Boolean);
  return words.join(", ");
}

const KIND_WORDS: Record<string, string> = {
  material: "material",
  base: "base (fixed ground)",
  link: "link (rigid bar)",
  joint: "joint (revolute pivot)",
  parallelogram: "parallelogram stage",
  spring: "spring",
  payload: "payload",
  bearing: "bearing",
  fastening: "fastening",
  bar: "parallelogram bar",
  head: "parallelogram head (far upright)",
  point: "point",
};

/** The findings about a part, read from their subject: the part itself, or (for a parallelogram)
 * the bodies and joints it generates. */
function findingsAbout(id: string, findings: readonly Finding[]): Finding[] {
  return findings.filter((f) => {
    const subject = f.data.subject;
    return subject !== undefined && (subject === id || subject.startsWith(`${id}.`));
  });
}

function nameHover(
  symbol: NameSymbol,
  analysis: Analysis | undefined,
  system: UnitSystem,
  findings: readonly Finding[] = [],
): string {
  const about = findingsAbout(symbol.id, findings);
  const trouble = troubleCount(about);
  const title = `**${symbol.id}** — ${KIND_WORDS[symbol.kind] ?? symbol.kind}${symbol.builtin ? " (built in)" : ""}${trouble ? ` — ${trouble}` : ""}`;
  const parts = [title];
  const model = analysis?.model;
  const readout = analysis?.readouts[symbol.id];
  const lines = readout ? readoutLines(readout, system) : { lead: [], more: [] };
  // What matters first: the key figures, then what is wrong; the rest below, so the hover
  // answers without scrolling.
  if (lines.lead.length) parts.push(lines.lead.join("\n"));
  if (about.length > 0)
    parts.push(
      about.map((f) => `- **${CODES[f.code]?.words ?? f.code}** (${f.severity}): ${f.message}`).join("\n"),
    );
  const facts = model ? modelFacts(model, symbol, system) : [];
  if (facts.length || lines.more.length) {
    const more = [facts.length ? facts.join(" · ") : "", lines.more.join("\n")].filter(Boolean);
    parts.push(lines.lead.length || about.length ? `**More**\n\n${more.join("\n\n")}` : more.join("\n\n"));
  }
  if (!model) parts.push("_Figures appear once the spec builds a model._");
  return parts.join("\n\n");
}

export function hoverAt(
  view: SyntaxView,
  offset: number,
  analysis: Analysis | undefined,
  current: Analysis | undefined,
  system: UnitSystem,
): Hover | null {
  const sections: string[] = [];
  let range = undefined;
  const occ = occurrenceAt(view.names, offset);
  const symbol = occ && view.names.symbols.get(occ.symbolId);
  const spot = spotAt(view.tree, offset);
  // Findings only of this very text: their spans and subjects are of what the editor shows.
  const findings = current && current.text === view.text ? current.findings : [];
  if (occ && symbol) {
    sections.push(nameHover(symbol, analysis, system, findings));
    range = spanToRange(view.lines, occ.span);
  } else if (spot.quantity) {
    const text = quantityHover(spot.quantity, system);
    if (text) sections.push(text);
    range = spanToRange(view.lines, spot.quantity.span);
  } else if (spot.property && spanContains(spot.property.key.span, offset)) {
    const key = spot.property.key.text;
    const spec = spot.declaration
      ? declarationSpec(spot.declaration.keyword.text)?.properties.find((p) => p.key === key)
      : ARM_PROPERTIES.find((p) => p.key === key);
    if (spec)
      sections.push(`**${key}**${spec.required ? " (required)" : ""} — ${spec.doc}\n\n\`${spec.example}\``);
    range = spanToRange(view.lines, spot.property.key.span);
  } else if (spot.declaration && spanContains(spot.declaration.keyword.span, offset)) {
    const spec = declarationSpec(spot.declaration.keyword.text);
    if (spec) sections.push(`**${spec.keyword}** — ${spec.doc}`);
    range = spanToRange(view.lines, spot.declaration.keyword.span);
  }
  // The findings under the cursor, with what their code means (only if they are of this text).
  for (const finding of findings) {
    if (!spanContains(finding.span, offset)) continue;
    sections.push(`\`${finding.code}\` — ${CODES[finding.code]?.explanation ?? ""}`);
  }
  if (sections.length === 0) return null;
  return { contents: { kind: "markdown", value: sections.join("\n\n---\n\n") }, ...(range ? { range } : {}) };
}

export const hoverFeature: ServerFeature = {
  name: "hover",
  capabilities: () => ({ hoverProvider: true }),
  register(ctx) {
    ctx.connection.onHover(
      guarded("hover", null as Hover | null, (params) => {
        const uri = params.textDocument.uri;
        const view = ctx.syntax(uri);
        if (!view) return null;
        return hoverAt(
          view,
          view.lines.offset(params.position),
          ctx.figures(uri),
          ctx.scheduler.current(uri),
          shownUnits(ctx.settings(), ctx.figures(uri)),
        );
      }),
    );
  },
};
