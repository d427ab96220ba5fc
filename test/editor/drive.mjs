// Works the Counterpoise extension inside real VS Code (code-server's workbench, started by
// scripts/editor-test.sh) through Debian's Chromium with playwright-core, the way a person would:
// keyboard, command palette, mouse. Each check prints PASS or FAIL with what it saw, and holds the
// editor to what the `poise` command says about the same file. Screenshots go to --artifacts.
//
// node test/editor/drive.mjs --url URL --workspace DIR --extensions DIR --logs DIR --artifacts DIR
// Exit status: 0 all checks passed, 1 a check failed, 2 the driver itself broke.
import { chromium } from "playwright-core";
import { existsSync, readFileSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { parseArgs } from "node:util";
import { agrees, check, checkText, diagnosticKey, range, sweep } from "./poise.mjs";
import { UNBALANCED_RATE } from "./workspace.mjs";

const { values: opt } = parseArgs({
  options: {
    url: { type: "string" },
    workspace: { type: "string" },
    extensions: { type: "string" },
    logs: { type: "string" },
    artifacts: { type: "string" },
  },
});
for (const k of ["url", "workspace", "extensions", "logs", "artifacts"])
  if (!opt[k]) throw new Error(`--${k} is required`);
const WS = opt.workspace;
const CHROMIUM = process.env.CHROMIUM || "/usr/bin/chromium";
const W = 1440;
const H = 900;
/** Longest wait for anything the editor should show: generous for a 2-core machine shared with
 * other work, and still a bound. */
const WAIT_MS = 30_000;

const t0 = Date.now();
const log = (...a) => console.log(`[+${((Date.now() - t0) / 1000).toFixed(1)}s]`, ...a);
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const results = { passed: 0, failed: 0 };
function verdict(ok, what, saw) {
  results[ok ? "passed" : "failed"]++;
  console.log(`${ok ? "PASS" : "FAIL"} ${what} — ${saw}`);
  return ok;
}
const short = (s, n = 300) => (s.length > n ? `${s.slice(0, n)}…` : s);
const oneLine = (s) => s.replace(/\s+/g, " ").trim();

/** Polls `read` until `good(value)` or the time is up; returns the last value read. */
async function until(read, good, ms = WAIT_MS, every = 250) {
  const end = Date.now() + ms;
  let value = await read();
  while (!good(value) && Date.now() < end) {
    await sleep(every);
    value = await read();
  }
  return value;
}

/** 1-based line and column of the `nth` match of `pattern` (a RegExp with a group for the word
 * to land on, or a string) in `text`. */
function locate(text, pattern) {
  const m = typeof pattern === "string" ? { index: text.indexOf(pattern), 0: pattern } : pattern.exec(text);
  if (!m || m.index < 0) throw new Error(`${pattern} not found`);
  const at = m.index + (m[1] !== undefined ? m[0].indexOf(m[1]) : 0);
  const before = text.slice(0, at).split("\n");
  return { line: before.length, column: before[before.length - 1].length + 1 };
}

let page;

// ---- workbench helpers (selectors of VS Code 1.100's workbench) ----
const quickInput = () =>
  page.waitForSelector(".quick-input-widget .quick-input-box input", { state: "visible", timeout: WAIT_MS });

/** Runs a command by its full title from the command palette. */
async function palette(command) {
  await page.keyboard.press("F1");
  await quickInput();
  await page.keyboard.insertText(command);
  // The row whose title is exactly the command (its aria-label may add the key binding).
  const row = `.quick-input-list .monaco-list-row[aria-label="${command}"], .quick-input-list .monaco-list-row[aria-label^="${command},"]`;
  await page.waitForSelector(row, { timeout: WAIT_MS });
  await sleep(150);
  await page.click(row);
}

const panelHeight = () =>
  page.$eval(".part.panel", (e) => (e.offsetParent ? e.getBoundingClientRect().height : 0)).catch(() => 0);

async function hidePanel() {
  if ((await panelHeight()) > 0) await palette("View: Toggle Panel Visibility");
  await until(panelHeight, (h) => h === 0, 5000);
}

/** Opens a workspace file by quick open and waits until its editor is the active one. */
async function openFile(relPath) {
  const name = relPath.split("/").pop();
  await page.keyboard.press("Control+P");
  await quickInput();
  await page.keyboard.insertText(relPath);
  // The list first shows recently opened files: wait until the focused row is the file asked for
  // (its label reads "NAME FOLDER, ..." or "NAME, ..." at the root).
  const folder = relPath.split("/").slice(0, -1).join("/");
  const wanted = `${name}${folder ? ` ${folder}` : ""},`;
  const focused = () =>
    page
      .$eval(".quick-input-list .monaco-list-row.focused", (e) => e.getAttribute("aria-label") ?? "")
      .catch(() => "");
  const row = await until(focused, (a) => a.startsWith(wanted), WAIT_MS);
  if (!row.startsWith(wanted)) throw new Error(`quick open offers "${row}", not ${relPath}`);
  await page.keyboard.press("Enter");
  await page.waitForSelector(`.tabs-container .tab.active:has-text("${name}")`, { timeout: WAIT_MS });
  const crumbs = await until(breadcrumbs, (b) => b.includes(relPath.split("/").join(" ")), 5000);
  if (!crumbs.includes(relPath.split("/").join(" "))) throw new Error(`opened ${crumbs}, not ${relPath}`);
  await sleep(300);
}
const breadcrumbs = () =>
  page
    .$eval(".editor-group-container.active .breadcrumbs-control", (e) =>
      [...e.querySelectorAll(".monaco-breadcrumb-item")].map((i) => i.textContent.trim()).join(" "),
    )
    .catch(() => "");

async function focusEditor() {
  await page.keyboard.press("Control+1");
  await sleep(150);
}

async function goTo(line, column) {
  await focusEditor();
  await page.keyboard.press("Control+G");
  await quickInput();
  await page.keyboard.insertText(`${line}:${column}`);
  await page.keyboard.press("Enter");
  await sleep(300);
}

const statusItem = () =>
  page
    .$eval(".part.statusbar .statusbar-item[id$='counterpoise.summary']", (e) => e.textContent.trim())
    .catch(() => "");
const cursorStatus = () =>
  page.$eval("#status\\.editor\\.selection", (e) => e.textContent.trim()).catch(() => "");

/** Every row of the Problems panel, grouped by file (`folder/name`, or `name` at the root). The
 * panel is maximised (and stays so when it is shown again) so that no row is scrolled out of the
 * list. */
async function problems() {
  await palette("View: Focus Problems (Errors, Warnings, Infos)");
  await page.waitForSelector(".markers-panel", { state: "visible", timeout: WAIT_MS });
  if ((await panelHeight()) < H / 2) {
    await palette("View: Toggle Maximized Panel");
    await until(panelHeight, (h) => h >= H / 2, 5000);
  }
  await sleep(300);
  const rows = await page.$$eval(".markers-panel .monaco-list-row", (els) =>
    els.map((e) => ({
      level: e.getAttribute("aria-level"),
      aria: e.getAttribute("aria-label") ?? "",
      text: e.innerText.replace(/\s+/g, " ").trim(),
    })),
  );
  await hidePanel();
  const byFile = new Map();
  let file;
  for (const r of rows) {
    const head = /problems? in file (.+) of folder (.+)$/.exec(r.aria);
    if (r.level === "1" && head) {
      file = head[2] === "." || head[2] === "" ? head[1] : `${head[2]}/${head[1]}`;
      if (!byFile.has(file)) byFile.set(file, []);
      continue;
    }
    if (r.level !== "2" || !file) continue;
    const m = /^(Error|Warning|Info): ([\s\S]*) at line (\d+) and character (\d+)\./.exec(r.aria);
    if (!m) continue;
    const code = /(\S+) \[Ln \d+, Col \d+\]$/.exec(r.text)?.[1] ?? "";
    const severity = { Error: "error", Warning: "warning", Info: "information" }[m[1]];
    byFile.get(file).push({ severity, code, line: Number(m[3]), column: Number(m[4]), message: m[2] });
  }
  return byFile;
}

/** The webview frame (VS Code nests them) holding `selector`, if any. */
async function webviewFrame(selector) {
  for (const f of page.frames()) {
    if (f === page.mainFrame()) continue;
    try {
      if (await f.$(selector)) return f;
    } catch {
      // a frame that went away while we looked
    }
  }
  return undefined;
}

async function shot(name) {
  await page.screenshot({ path: join(opt.artifacts, `${name}.png`) });
}

/** Diagnostics the editor shows for `file` against `poise check --json` of the same text. */
function compareDiagnostics(shown, expected) {
  const want = expected.map(diagnosticKey).sort();
  const got = (shown ?? []).map(diagnosticKey).sort();
  const missing = want.filter((k) => !got.includes(k));
  const extra = got.filter((k) => !want.includes(k));
  return { same: missing.length === 0 && extra.length === 0, missing, extra, got };
}

async function waitForDiagnostics(file, expected) {
  let cmp;
  await until(
    async () => (cmp = compareDiagnostics((await problems()).get(file), expected)),
    (c) => c.same,
    WAIT_MS,
    1000,
  );
  return cmp;
}

// ---- the checks ----

async function extensionInstalled() {
  const dirs = existsSync(opt.extensions) ? readdirSync(opt.extensions) : [];
  const ours = dirs.filter((d) => d.startsWith("counterpoise.counterpoise-"));
  verdict(
    ours.length === 1,
    "the .vsix installs into the editor",
    `extensions folder holds ${JSON.stringify(dirs)}`,
  );
}

async function activation() {
  await openFile("camera-arm.poise");
  const t = Date.now();
  const text = await until(statusItem, (s) => /hand .* · safety/.test(s), 60_000);
  verdict(
    /hand .* · safety/.test(text),
    "the extension activates on a .poise file and the first analysis reaches the status bar",
    `status bar item "${text}" ${Date.now() - t} ms after the tab opened`,
  );
  const mode = await page.$eval("#status\\.editor\\.mode", (e) => e.textContent.trim()).catch(() => "");
  verdict(
    mode === "Counterpoise",
    "a .poise file is in the Counterpoise language",
    `language mode "${mode}"`,
  );
  await sleep(800);
  await shot("01-camera-arm-opened");
}

async function diagnostics() {
  // A spec without findings: the editor shows none, as `poise check` finds none.
  const clean = check(join(WS, "camera-arm.poise"));
  let cmp = await waitForDiagnostics("camera-arm.poise", clean);
  verdict(
    cmp.same,
    "camera-arm.poise: the editor's diagnostics are those of `poise check`",
    `poise check: ${clean.length}; editor: ${JSON.stringify(cmp.got)}`,
  );

  // A spec full of mistakes: every diagnostic on the same line and column, same code, message
  // and severity.
  await openFile("mistakes.poise");
  const expected = check(join(WS, "mistakes.poise"));
  cmp = await waitForDiagnostics("mistakes.poise", expected);
  verdict(
    cmp.same && expected.length > 0,
    "mistakes.poise: every diagnostic on the line and column `poise check` gives, with its code, severity and message",
    cmp.same
      ? `${expected.length} diagnostics agree, e.g. ${JSON.stringify(cmp.got.slice(0, 3))}`
      : `missing ${JSON.stringify(cmp.missing)}; extra ${JSON.stringify(cmp.extra)}`,
  );
  const squiggles = await until(
    () => page.$$eval(".editor-instance .squiggly-error", (e) => e.length),
    (n) => n > 0,
  );
  verdict(
    squiggles > 0,
    "mistakes.poise: errors are underlined in the text",
    `${squiggles} error squiggles in view`,
  );
  await palette("View: Focus Problems (Errors, Warnings, Infos)");
  await sleep(800);
  await shot("02-mistakes-problems");
  await hidePanel();
}

async function statusBar() {
  await openFile("camera-arm.poise");
  const text = await until(statusItem, (s) => /hand .* · safety/.test(s));
  const s = sweep(join(WS, "camera-arm.poise"));
  const payload = Object.keys(s.poses[0].hand_force)[0];
  const [, worst] = range(s.poses.map((p) => p.hand_force[payload]));
  const shown = /hand ([\d.]+) N/.exec(text)?.[1];
  verdict(
    shown !== undefined && agrees(shown, worst),
    "status bar: the worst hand force is the one `poise sweep` gives",
    `status bar "${text}"; poise sweep: greatest hand force at ${payload} ${worst} N over ${s.poses.length} poses`,
  );
  const item = await page.$(".part.statusbar .statusbar-item[id$='counterpoise.summary']");
  await item.hover();
  const tip = await until(
    () => page.$$eval(".workbench-hover, .monaco-hover", (els) => els.map((e) => e.innerText).join(" | ")),
    (t) => /Worst hand force/.test(t),
    10_000,
  );
  const limit = /balance ([\d.]+) N at camera/.exec(readFileSync(join(WS, "camera-arm.poise"), "utf8"))?.[1];
  verdict(
    new RegExp(`Worst hand force: ${shown} N at ${payload} \\(limit ${limit} N\\)`).test(tip),
    "status bar tooltip names the payload and the spec's balance limit",
    `tooltip "${oneLine(tip)}"`,
  );
  await shot("03-status-bar-tooltip");
  await page.mouse.move(W / 2, H / 2);
}

async function hover() {
  const text = readFileSync(join(WS, "camera-arm.poise"), "utf8");
  const at = locate(text, /spring (lift) \{/);
  await goTo(at.line, at.column + 1);
  await page.keyboard.press("Control+K");
  await page.keyboard.press("Control+I");
  const shown = await until(
    () => page.$$eval(".monaco-hover .hover-contents", (els) => els.map((e) => e.innerText).join("\n")),
    (t) => /force range/.test(t),
  );
  const s = sweep(join(WS, "camera-arm.poise"));
  const [fLo, fHi] = range(s.poses.map((p) => p.springs.lift.force));
  const [lLo, lHi] = range(s.poses.map((p) => p.springs.lift.length));
  const f = /force range: ([\d.]+) N \.\. ([\d.]+) N/.exec(shown);
  const l = /length range: ([\d.]+) mm \.\. ([\d.]+) mm/.exec(shown);
  verdict(
    /lift\s+—\s+spring/.test(shown) &&
      !!f &&
      agrees(f[1], fLo) &&
      agrees(f[2], fHi) &&
      !!l &&
      agrees(l[1], lLo) &&
      agrees(l[2], lHi),
    "hover on a spring: its force and length over the range are those of `poise sweep`",
    `hover "${short(oneLine(shown), 240)}"; poise sweep: force ${fLo} .. ${fHi} N, length ${lLo} .. ${lHi} mm`,
  );
  await shot("04-hover-spring");
  await page.keyboard.press("Escape");
}

async function drawing() {
  const text = readFileSync(join(WS, "camera-arm.poise"), "utf8");
  const s = sweep(join(WS, "camera-arm.poise"));
  await focusEditor();
  await palette("Counterpoise: Show Arm Drawing");
  const tab = await page
    .waitForSelector(".tabs-container .tab:has-text('Arm: camera-arm.poise')", { timeout: WAIT_MS })
    .then(
      () => true,
      () => false,
    );
  const frame = await until(
    () => webviewFrame("svg g.payload[data-payload='camera'] circle"),
    (f) => !!f,
  );
  const status = frame ? oneLine(await frame.$eval("#status", (e) => e.textContent)) : "";
  verdict(
    tab && !!frame && status.includes(`${s.poses.length} poses`),
    "the drawing panel opens by its command and draws the arm over the poses `poise sweep` solves",
    `tab: ${tab}; drawing: ${!!frame}; panel status "${status}"; poise sweep: ${s.poses.length} poses`,
  );
  await sleep(600);
  await shot("05-drawing");
  if (!frame) return;

  // The slider at each end of the range: the angle shown is the sweep's, and the payload moves in
  // the drawing as far as the sweep says it does, at the drawing's own scale bar.
  const dof = s.dofs[0];
  const [aLo, aHi] = range(s.poses.map((p) => p.angles[dof]));
  const offset = /payload camera \{[^}]*at (\w+\.\w+)\((-?[\d.]+) mm, (-?[\d.]+) mm\)/.exec(text);
  const worldOf = (pose) => {
    const b = pose.bodies[offset[1]];
    const a = (b.angle * Math.PI) / 180;
    const [x, y] = [Number(offset[2]), Number(offset[3])];
    return [b.x + x * Math.cos(a) - y * Math.sin(a), b.y + x * Math.sin(a) + y * Math.cos(a)];
  };
  const first = s.poses.find((p) => p.angles[dof] === aLo);
  const last = s.poses.find((p) => p.angles[dof] === aHi);
  const [wx0, wy0] = worldOf(first);
  const [wx1, wy1] = worldOf(last);
  const read = () =>
    frame.evaluate(() => {
      const c = document.querySelector("svg g.payload[data-payload='camera'] circle");
      const bar = document.querySelector("svg g.scale line");
      const label = document.querySelector("svg g.scale text")?.textContent ?? "";
      return {
        angle: document.querySelector("#dof-0-value")?.textContent ?? "",
        cx: Number(c?.getAttribute("cx")),
        cy: Number(c?.getAttribute("cy")),
        bar: Number(bar?.getAttribute("x2")) - Number(bar?.getAttribute("x1")),
        label,
      };
    });
  await frame.focus("input[type=range]");
  await page.keyboard.press("Home");
  const lo = await until(read, (r) => r.angle === `${aLo.toFixed(1)}°`, 5000);
  await page.keyboard.press("End");
  const hi = await until(read, (r) => r.angle === `${aHi.toFixed(1)}°`, 5000);
  const mmPerUnit = Number(/([\d.]+) mm/.exec(hi.label)?.[1]) / hi.bar;
  const dx = (hi.cx - lo.cx) * mmPerUnit;
  const dy = -(hi.cy - lo.cy) * mmPerUnit; // the drawing's y grows downwards
  verdict(
    lo.angle === `${aLo.toFixed(1)}°` &&
      hi.angle === `${aHi.toFixed(1)}°` &&
      Math.abs(dx - (wx1 - wx0)) < 1 &&
      Math.abs(dy - (wy1 - wy0)) < 1,
    "the slider moves the arm: from one end of the range to the other the payload travels as `poise sweep` says",
    `slider ${lo.angle} -> ${hi.angle}; payload moved (${dx.toFixed(1)}, ${dy.toFixed(1)}) mm at the scale bar's ${hi.label}; poise sweep: ${aLo}..${aHi} deg, (${(wx1 - wx0).toFixed(1)}, ${(wy1 - wy0).toFixed(1)}) mm`,
  );
  await sleep(400);
  await shot("06-drawing-slider-end");
  const whileInPanel = await statusItem();
  verdict(
    /hand .* · safety/.test(whileInPanel),
    "the status bar keeps the spec's figures while the drawing panel has the focus",
    `status bar item "${whileInPanel}" with the slider focused`,
  );

  // A click on the spring in the drawing reveals its declaration.
  const decl = locate(text, /spring (lift) \{/);
  await frame.click("svg g.spring[data-spring='lift']", { force: true });
  const cur = await until(cursorStatus, (c) => c.startsWith(`Ln ${decl.line},`), 5000);
  verdict(
    cur.startsWith(`Ln ${decl.line},`),
    "a click on the spring in the drawing reveals its declaration",
    `cursor at "${cur}"; spring lift is declared on line ${decl.line}`,
  );
}

/** In a page or frame: the flag labels of the drawing, and every pair of text boxes of one svg
 * that intersect or a box that leaves its svg (half a pixel of slack for anti-aliasing). */
async function labelReport(frame) {
  return frame.evaluate(() => {
    const clashes = [];
    const e = 0.5;
    document.querySelectorAll("svg").forEach((svg, i) => {
      const f = svg.getBoundingClientRect();
      const texts = [...svg.querySelectorAll("text")].map((t) => ({
        t: t.textContent,
        b: t.getBoundingClientRect(),
      }));
      for (const { t, b } of texts)
        if (b.left < f.left - e || b.top < f.top - e || b.right > f.right + e || b.bottom > f.bottom + e)
          clashes.push(`svg ${i}: "${t}" leaves it`);
      for (let m = 0; m < texts.length; m++)
        for (let n = m + 1; n < texts.length; n++) {
          const [a, b] = [texts[m].b, texts[n].b];
          if (a.left < b.right - e && b.left < a.right - e && a.top < b.bottom - e && b.top < a.bottom - e)
            clashes.push(`svg ${i}: "${texts[m].t}" on "${texts[n].t}"`);
        }
    });
    const flags = [...document.querySelectorAll("svg.arm-drawing .flag-label")].map((x) => x.textContent);
    return { clashes, flags };
  });
}

async function typing() {
  // Typing a stiffer rate unbalances the arm, live: the editor shows what `poise check` says of
  // the edited text; undo brings the clean state back.
  const text = readFileSync(join(WS, "camera-arm.poise"), "utf8");
  const at = locate(text, /^\s*rate (0\.27) N\/mm/m);
  await goTo(at.line, at.column);
  for (let i = 0; i < 4; i++) await page.keyboard.press("Shift+ArrowRight");
  await page.keyboard.type(UNBALANCED_RATE.split(" ")[0], { delay: 60 });
  const edited = text.replace(/^(\s*rate )0\.27 N\/mm/m, `$1${UNBALANCED_RATE}`);
  const expected = checkText("camera-arm.poise", edited);
  const cmp = await waitForDiagnostics("camera-arm.poise", expected);
  verdict(
    cmp.same && expected.some((d) => d.code === "balance.unbalanced"),
    "typing: diagnostics follow the text as it is typed, as `poise check` finds them in the edited text",
    cmp.same
      ? `after typing rate ${UNBALANCED_RATE}: ${JSON.stringify(cmp.got)}`
      : `missing ${JSON.stringify(cmp.missing)}; extra ${JSON.stringify(cmp.extra)}`,
  );
  // The drawing panel beside it follows the edit (it was hidden and shown again while the
  // Problems panel was read, as a person's layout changes would do).
  const errors = expected.filter((d) => d.severity === "error").length;
  const panelStatus = async () => {
    const f = await webviewFrame("#status");
    return f ? oneLine(await f.$eval("#status", (e) => e.textContent).catch(() => "")) : "";
  };
  const status = await until(panelStatus, (t) => t.startsWith(`${errors} error(s)`));
  verdict(
    status.startsWith(`${errors} error(s)`),
    "typing: the drawing panel follows the edit",
    `panel status "${status}"; poise check of the edited text: ${errors} error(s)`,
  );
  // Its labels as VS Code's webview lays them out: the failing spring's flag names the trouble in
  // words, and no label overlaps another or leaves its figure.
  const panel = await webviewFrame("#status");
  const labels = panel ? await labelReport(panel) : { clashes: ["no panel"], flags: [] };
  verdict(
    labels.clashes.length === 0 &&
      labels.flags.length > 0 &&
      labels.flags.every((t) => !/\b[a-z]+\.[a-z-]+\b/.test(t)),
    "typing: the drawing's flags name the trouble in words, and no label overlaps another or leaves its figure",
    `flags ${JSON.stringify(labels.flags)}; clashes ${JSON.stringify(labels.clashes.slice(0, 4))}`,
  );
  await shot("07-typing-unbalanced");
  await focusEditor();
  await page.keyboard.press("Control+Z");
  await page.keyboard.press("Control+Z");
  const back = await waitForDiagnostics("camera-arm.poise", check(join(WS, "camera-arm.poise")));
  verdict(
    back.same,
    "typing: undo brings back the clean spec's diagnostics",
    `editor: ${JSON.stringify(back.got)}`,
  );
}

async function balanceFix() {
  const file = join(WS, "balance-fix.poise");
  const before = readFileSync(file, "utf8");
  const found = check(file);
  const unbalanced = found.find((d) => d.code === "balance.unbalanced");
  if (!unbalanced)
    return verdict(false, "balance quick fix", `poise check finds no balance.unbalanced in ${file}`);
  const s0 = sweep(file);
  const [, worstBefore] = range(s0.poses.map((p) => p.hand_force.camera));

  await openFile("balance-fix.poise");
  await waitForDiagnostics("balance-fix.poise", found);
  await goTo(unbalanced.line, unbalanced.column);
  await page.keyboard.press("Control+Period");
  const titles = await until(
    () =>
      page.$$eval(".action-widget .monaco-list-row", (els) =>
        els.map((e) => e.innerText.replace(/\s+/g, " ").trim()),
      ),
    (t) => t.some((x) => /^Set lift's rate/.test(x)),
    WAIT_MS,
  );
  const title = titles.find((x) => /^Set lift's rate/.test(x));
  await shot("08-balance-quick-fixes");
  if (!title) {
    await page.keyboard.press("Escape");
    return verdict(false, "balance quick fix offered", `quick fixes: ${JSON.stringify(titles)}`);
  }
  // "Set lift's rate to R N/mm and initial tension to T N (worst hand force A N → B N …)"
  const m =
    /rate to ([\d.]+) N\/mm and initial tension to ([\d.]+) N \(worst hand force ([\d.]+) N → ([\d.]+) N/.exec(
      title,
    );
  verdict(
    !!m && agrees(m[3], worstBefore, 0.005),
    "the balance quick fix is offered, stating today's worst hand force as `poise sweep` gives it",
    `"${title}"; poise sweep of the file: greatest hand force ${worstBefore} N`,
  );
  // Down the menu to the fix (the first row is a heading), then apply it.
  const focused = () =>
    page.$eval(".action-widget .monaco-list-row.focused", (e) => e.innerText).catch(() => "");
  for (let i = 0; i < titles.length && !/^Set lift's rate/.test(oneLine(await focused())); i++)
    await page.keyboard.press("ArrowDown");
  if (!/^Set lift's rate/.test(oneLine(await focused()))) throw new Error(`could not select "${title}"`);
  await page.keyboard.press("Enter");
  const gone = await until(
    async () => (await problems()).get("balance-fix.poise") ?? [],
    (ds) => !ds.some((d) => d.code === "balance.unbalanced"),
  );
  verdict(
    !gone.some((d) => d.code === "balance.unbalanced"),
    "after the quick fix the balance error goes away in the editor",
    `editor now: ${JSON.stringify(gone.map(diagnosticKey))}`,
  );
  await shot("09-after-balance-fix");

  // Saved, the fixed spec is what `poise` says it is: the values the fix named, no balance error,
  // and the worst hand force it predicted.
  await focusEditor();
  await page.keyboard.press("Control+S");
  const after = await until(
    () => readFileSync(file, "utf8"),
    (t) => t !== before,
    10_000,
  );
  const checked = check(file);
  const s1 = sweep(file);
  const [, worstAfter] = range(s1.poses.map((p) => p.hand_force.camera));
  const status = await until(
    statusItem,
    (t) => /hand ([\d.]+) N/.test(t) && agrees(/hand ([\d.]+) N/.exec(t)[1], worstAfter),
  );
  verdict(
    !!m &&
      after.includes(`rate ${m[1]} N/mm`) &&
      after.includes(`initial_tension ${m[2]} N`) &&
      !checked.some((d) => d.code === "balance.unbalanced") &&
      agrees(m[4], worstAfter, 0.005),
    "the fix's effect is what `poise` predicts: the named values in the saved file, no balance error, the promised hand force",
    `saved file has rate ${m?.[1]} N/mm and initial tension ${m?.[2]} N: ${after.includes(`rate ${m?.[1]} N/mm`) && after.includes(`initial_tension ${m?.[2]} N`)}; poise check: ${JSON.stringify(checked.map((d) => d.code))}; poise sweep: greatest hand force ${worstAfter} N (fix said ${m?.[4]} N)`,
  );
  verdict(
    agrees(/hand ([\d.]+) N/.exec(status)?.[1] ?? "NaN", worstAfter),
    "the status bar shows the fixed spec's worst hand force",
    `status bar "${status}"; poise sweep ${worstAfter} N`,
  );
}

async function manifest() {
  // VS Code's own check of extension manifests flags activation events it generates itself. The
  // control copy (with onLanguage:counterpoise put back) shows the check is running.
  // Ours first: by the time the control copy is flagged, ours has been looked at too.
  await openFile("manifest/package.json");
  await openFile("control/package.json");
  const flagged = (ds) => (ds ?? []).filter((d) => /activation event/i.test(d.message));
  const all = await until(problems, (p) => flagged(p.get("control/package.json")).length > 0);
  const control = flagged(all.get("control/package.json"));
  const ours = all.get("manifest/package.json") ?? [];
  verdict(
    control.length > 0 && ours.length === 0,
    "VS Code finds nothing to flag in the extension's package.json (and does flag the redundant activation event in a control copy)",
    `package.json: ${JSON.stringify(ours.map((d) => d.message))}; control copy: ${JSON.stringify(control.map((d) => `${d.line}:${d.column} ${d.message}`))}`,
  );
}

/** The lines of every file called `name` under `dir` (VS Code starts a log folder per window and
 * extension host), oldest file first. */
function logLines(dir, name) {
  const found = [];
  const walk = (d) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name === name) found.push(p);
    }
  };
  if (existsSync(dir)) walk(dir);
  found.sort((a, b) => statSync(a).mtimeMs - statSync(b).mtimeMs);
  return { files: found, lines: found.flatMap((f) => readFileSync(f, "utf8").split("\n")) };
}

async function logChannel() {
  await palette("Counterpoise: Show the Arm Checker's Log");
  const pattern =
    /\[info\] analysed (\S+) version \d+: (\d+) poses in \d+ ms, (\d+) errors?, (\d+) warnings?/;
  const shown = await until(
    // (the editor draws spaces as no-break spaces)
    () =>
      page.$$eval(".part.panel .monaco-editor .view-lines", (els) =>
        els.map((e) => e.innerText.replace(/\u00a0/g, " ")).join("\n"),
      ),
    (t) => pattern.test(t),
    10_000,
  );
  const lines = shown.split("\n").filter((l) => pattern.test(l));
  verdict(
    lines.length > 0,
    "the log channel shows the server's analyses, at info level",
    `output view "Counterpoise": ${JSON.stringify(lines.slice(-3))}`,
  );
  await shot("10-log-channel");

  // The whole channel, as VS Code writes it to disk: one line per analysis of each file opened,
  // with the pose count `poise sweep` gives.
  const { files: logFiles, lines: all } = logLines(opt.logs, "Counterpoise.log");
  const poses = sweep(join(WS, "camera-arm.poise")).poses.length;
  const camera = all.filter(
    (l) => l.includes("[info] analysed camera-arm.poise ") && l.includes(`: ${poses} poses in`),
  );
  const files = new Set(all.map((l) => pattern.exec(l)?.[1]).filter(Boolean));
  verdict(
    camera.length > 0 && ["mistakes.poise", "balance-fix.poise"].every((f) => files.has(f)),
    "the log has a line for each spec opened, with the pose count `poise sweep` gives",
    `${logFiles.join(", ") || "no Counterpoise.log"}: ${all.filter((l) => pattern.test(l)).length} analysis lines, files ${JSON.stringify([...files])}; camera-arm.poise at ${poses} poses: ${JSON.stringify(camera[0] ?? "")}`,
  );
  const errors = all.filter((l) => /\[error\]/.test(l));
  verdict(
    errors.length === 0,
    "the server logged no error",
    errors.length ? JSON.stringify(errors.slice(0, 3)) : "none",
  );
}

function extensionHostLog() {
  const { files, lines } = logLines(opt.logs, "remoteexthost.log");
  const activated = lines.find((l) => /_doActivateExtension counterpoise\.counterpoise/.test(l)) ?? "";
  verdict(
    /activationEvent: 'onLanguage:counterpoise'/.test(activated),
    "VS Code activates the extension for the language by itself (no activation event listed)",
    oneLine(activated) || `no activation line in ${files.join(", ") || "no remoteexthost.log"}`,
  );
  const ours = lines.filter((l) => /\[error\]/.test(l) && /counterpoise/i.test(l));
  verdict(
    ours.length === 0,
    "the extension host logged no error from the extension",
    ours.length ? JSON.stringify(ours.slice(0, 3)) : "none",
  );
}

async function tuneShow() {
  // The tune command from the palette, shown before it is written: the drawing gets the tuned
  // springs and its legend, and the file stays as it was until the user asks to write.
  const file = join(WS, "tune-fix.poise");
  const before = readFileSync(file, "utf8");
  await openFile("tune-fix.poise");
  await focusEditor();
  await palette("Counterpoise: Tune the Springs and Show the Result in the Arm Drawing");
  const frame = await until(
    () => webviewFrame("svg g.tune-legend text"),
    (f) => !!f,
    60_000,
  );
  const legend = frame
    ? oneLine(
        await frame.$$eval("svg g.tune-legend text", (els) => els.map((e) => e.textContent).join(" | ")),
      )
    : "";
  await sleep(600);
  await shot("10-tune-shown");
  verdict(
    !!frame && /as tuned/.test(legend) && readFileSync(file, "utf8") === before,
    "the palette's tune command shows the tuned design in the drawing, named in its legend, without writing the file",
    `legend: "${legend}"; file unchanged: ${readFileSync(file, "utf8") === before}`,
  );
  // The offer to write stays in a notification: leave it unanswered.
  await page.keyboard.press("Escape").catch(() => {});
}

async function tuneFix() {
  // The design search offered as a quick fix on the unbalanced arm: chosen, it runs in the
  // server's worker and writes spring settings after which `poise check` finds no balance error.
  const file = join(WS, "tune-fix.poise");
  const before = readFileSync(file, "utf8");
  const found = check(file);
  const unbalanced = found.find((d) => d.code === "balance.unbalanced");
  if (!unbalanced)
    return verdict(false, "tune quick fix", `poise check finds no balance.unbalanced in ${file}`);
  await openFile("tune-fix.poise");
  await waitForDiagnostics("tune-fix.poise", found);
  await goTo(unbalanced.line, unbalanced.column);
  await page.keyboard.press("Control+Period");
  const isTune = (x) => /\(tune\)/.test(x);
  const titles = await until(
    () =>
      page.$$eval(".action-widget .monaco-list-row", (els) =>
        els.map((e) => e.innerText.replace(/\s+/g, " ").trim()),
      ),
    (t) => t.some(isTune),
    WAIT_MS,
  );
  await shot("10-tune-quick-fix");
  if (!titles.some(isTune)) {
    await page.keyboard.press("Escape");
    return verdict(
      false,
      "the tune quick fix is offered on the balance error",
      `quick fixes: ${JSON.stringify(titles)}`,
    );
  }
  const focused = () =>
    page.$eval(".action-widget .monaco-list-row.focused", (e) => e.innerText).catch(() => "");
  for (let i = 0; i < titles.length && !isTune(oneLine(await focused())); i++)
    await page.keyboard.press("ArrowDown");
  await page.keyboard.press("Enter");
  const gone = await until(
    async () => (await problems()).get("tune-fix.poise") ?? [],
    (ds) => !ds.some((d) => d.code === "balance.unbalanced"),
    60_000,
  );
  await focusEditor();
  await page.keyboard.press("Control+S");
  const after = await until(
    () => readFileSync(file, "utf8"),
    (t) => t !== before,
    10_000,
  );
  const checked = check(file);
  verdict(
    after !== before &&
      !gone.some((d) => d.code === "balance.unbalanced") &&
      !checked.some((d) => d.code === "balance.unbalanced"),
    "the tune quick fix runs the search and writes settings after which `poise check` finds no balance error",
    `offered "${titles.find(isTune)}"; editor now: ${JSON.stringify(gone.map(diagnosticKey))}; file changed: ${after !== before}; poise check: ${JSON.stringify(checked.map((d) => d.code))}`,
  );
  await shot("11-after-tune");
}

async function headingSlider() {
  // An arm that turns: the drawing panel has a slider per swivel, and moving it turns the arm in
  // the top view.
  await openFile("two-stage-arm.poise");
  await focusEditor();
  await palette("Counterpoise: Show Arm Drawing");
  const frame = await until(
    () => webviewFrame("input[id^='heading-']"),
    (f) => !!f,
  );
  if (!frame) return verdict(false, "the drawing panel has a heading slider per swivel", "no heading slider");
  const read = () =>
    frame.evaluate(() => ({
      sliders: [...document.querySelectorAll("input[id^='heading-']")].map((e) => e.id),
      top: document.querySelector("#top svg")?.innerHTML ?? "",
      shown: document.querySelector("input[id^='heading-'] + output")?.textContent ?? "",
    }));
  const first = await read();
  await frame.focus("input[id^='heading-']");
  await page.keyboard.press("End");
  const last = await until(read, (r) => r.top !== first.top && r.shown !== first.shown, 5000);
  verdict(
    first.sliders.length > 0 && first.top.length > 0 && last.top !== first.top,
    "the drawing panel has a heading slider per swivel, and moving it turns the arm in the top view",
    `sliders ${JSON.stringify(first.sliders)}; heading ${first.shown} -> ${last.shown}; top view changed: ${last.top !== first.top}`,
  );
  await shot("12-heading-slider");
}

async function main() {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"],
  });
  page = await browser.newPage({ viewport: { width: W, height: H } });
  const noise = [];
  page.on("console", (m) => m.type() === "error" && noise.push(m.text().slice(0, 200)));
  page.on("pageerror", (e) => noise.push(`page error: ${String(e).slice(0, 200)}`));

  log("opening", opt.url);
  await page.goto(opt.url, { waitUntil: "domcontentloaded" });
  await page.waitForSelector(".explorer-folders-view .monaco-list-row", { timeout: 120_000 });
  await sleep(1500);
  log("workbench is up");

  const steps = [
    extensionInstalled,
    activation,
    diagnostics,
    statusBar,
    hover,
    drawing,
    typing,
    balanceFix,
    tuneShow,
    tuneFix,
    headingSlider,
    manifest,
    logChannel,
    extensionHostLog,
  ];
  for (const step of steps) {
    log(`-- ${step.name}`);
    const started = Date.now();
    try {
      await step();
      log(`   ${step.name} took ${((Date.now() - started) / 1000).toFixed(1)} s`);
    } catch (err) {
      verdict(
        false,
        `${step.name} ran to its end`,
        String(err?.stack ?? err)
          .split("\n")
          .slice(0, 3)
          .join(" "),
      );
      await shot(`99-failure-${step.name}`).catch(() => {});
      await page.keyboard.press("Escape").catch(() => {});
    }
  }
  // Not checks: what the browser said (code-server lacks the closed-source `vsda` module, and a
  // few cancelled requests are normal), kept for whoever reads the log.
  log(`browser console errors: ${noise.length}`);
  for (const n of noise.slice(0, 10)) log("  ", oneLine(n));
  await browser.close();
  console.log(`editor: ${results.passed} passed, ${results.failed} failed`);
  process.exit(results.failed ? 1 : 0);
}

main().catch(async (err) => {
  console.error(err);
  if (page) await shot("99-driver-broke").catch(() => {});
  process.exit(2);
});
