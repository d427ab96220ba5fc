// Lays out the folder that the editor test opens in VS Code: copies of the samples, a spec made
// unbalanced for the quick-fix check, and two copies of the extension's manifest (as it is, and
// with the activation event that VS Code flags as redundant put back, to show that VS Code's own
// manifest check is running). Usage: node test/editor/workspace.mjs FOLDER
import { copyFileSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), "..", "..");

/** The camera arm with a spring over twice as stiff as it should be: balance.unbalanced. */
export const UNBALANCED_RATE = "0.6 N/mm";

export function unbalancedCameraArm() {
  const text = readFileSync(join(ROOT, "samples", "camera-arm.poise"), "utf8");
  const stiffer = text.replace(/^(\s*rate )0\.27 N\/mm/m, `$1${UNBALANCED_RATE}`);
  if (stiffer === text) throw new Error("camera-arm.poise no longer has `rate 0.27 N/mm`");
  return stiffer;
}

export function layOut(folder) {
  mkdirSync(folder, { recursive: true });
  for (const f of readdirSync(join(ROOT, "samples")).filter((f) => f.endsWith(".poise")))
    copyFileSync(join(ROOT, "samples", f), join(folder, f));
  writeFileSync(join(folder, "balance-fix.poise"), unbalancedCameraArm());
  writeFileSync(join(folder, "tune-fix.poise"), unbalancedCameraArm());

  const manifest = readFileSync(join(ROOT, "package.json"), "utf8");
  mkdirSync(join(folder, "manifest"), { recursive: true });
  writeFileSync(join(folder, "manifest", "package.json"), manifest);
  const control = JSON.parse(manifest);
  control.activationEvents = ["onLanguage:counterpoise"];
  mkdirSync(join(folder, "control"), { recursive: true });
  writeFileSync(join(folder, "control", "package.json"), JSON.stringify(control, null, 2) + "\n");
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  if (!process.argv[2]) {
    console.error("usage: node test/editor/workspace.mjs FOLDER");
    process.exit(2);
  }
  layOut(process.argv[2]);
}
