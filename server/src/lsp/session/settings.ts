// The user's settings for the server, under the `counterpoise.` prefix, with their defaults.
// VS Code sends them through workspace/configuration; other editors through initializationOptions.

import type { UnitSystem } from "../../units/unit-table";

/** "auto" shows figures in the system the spec is written in (model/written-units.ts); "si" or
 * "us" shows every figure, messages included, in that system. */
export type DisplayUnits = UnitSystem | "auto";

export interface Settings {
  displayUnits: DisplayUnits;
  /** Poses per degree of freedom while typing; 0 means the spec's own density. */
  stepsWhileTyping: number;
  diagnosticsDelayMs: number;
  inlayHints: boolean;
  analysisBudgetMs: number;
}

export const DEFAULT_SETTINGS: Readonly<Settings> = {
  displayUnits: "auto",
  stepsWhileTyping: 13,
  diagnosticsDelayMs: 200,
  inlayHints: true,
  analysisBudgetMs: 3000,
};

/** The bounds package.json states; values outside them are clamped rather than refused. */
const LIMITS = {
  stepsWhileTyping: [0, 2001],
  diagnosticsDelayMs: [0, 5000],
  analysisBudgetMs: [100, 60000],
} as const;

function clampInt(value: unknown, [lo, hi]: readonly [number, number], fallback: number): number {
  if (typeof value !== "number" || !Number.isFinite(value)) return fallback;
  return Math.min(hi, Math.max(lo, Math.round(value)));
}

function readDisplayUnits(value: unknown, fallback: DisplayUnits): DisplayUnits {
  return value === "us" || value === "si" || value === "auto" ? value : fallback;
}

/** The system figures are shown in: the setting's, or with "auto" the one the analysis wrote its
 * messages in (the spec's own), SI when there is none yet. */
export function shownUnits(
  settings: Pick<Settings, "displayUnits">,
  analysis?: { units?: UnitSystem },
): UnitSystem {
  return settings.displayUnits === "auto" ? (analysis?.units ?? "si") : settings.displayUnits;
}

/** Reads settings from whatever shape arrives (a `counterpoise` section, or the section itself);
 * anything missing or malformed keeps its default. */
export function readSettings(raw: unknown): Settings {
  let section: Record<string, unknown> = {};
  if (raw && typeof raw === "object") {
    const obj = raw as Record<string, unknown>;
    const inner = obj["counterpoise"];
    section = inner && typeof inner === "object" ? (inner as Record<string, unknown>) : obj;
  }
  const d = DEFAULT_SETTINGS;
  return {
    displayUnits: readDisplayUnits(section["displayUnits"], d.displayUnits),
    stepsWhileTyping: clampInt(section["stepsWhileTyping"], LIMITS.stepsWhileTyping, d.stepsWhileTyping),
    diagnosticsDelayMs: clampInt(
      section["diagnosticsDelayMs"],
      LIMITS.diagnosticsDelayMs,
      d.diagnosticsDelayMs,
    ),
    inlayHints:
      typeof section["inlayHints"] === "boolean" ? (section["inlayHints"] as boolean) : d.inlayHints,
    analysisBudgetMs: clampInt(section["analysisBudgetMs"], LIMITS.analysisBudgetMs, d.analysisBudgetMs),
  };
}
