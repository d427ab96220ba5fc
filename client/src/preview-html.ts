// The preview webview's HTML shell: a strict content-security policy (nothing by default, the
// script only by nonce, styles only from the extension), and the empty places the script fills.
// No editor imports, so the page can be rendered and tested outside the editor.

export interface PreviewPageParts {
  /** The webview's source for the extension's own files (webview.cspSource). */
  cspSource: string;
  nonce: string;
  scriptUri: string;
  styleUri: string;
}

export function previewHtml(p: PreviewPageParts): string {
  const csp = [
    "default-src 'none'",
    `style-src ${p.cspSource}`,
    `img-src ${p.cspSource} data:`,
    `font-src ${p.cspSource}`,
    `script-src 'nonce-${p.nonce}'`,
  ].join("; ");
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${csp}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<link rel="stylesheet" href="${p.styleUri}">
<title>Arm drawing</title></head>
<body>
<h1 id="title">Waiting for the analysis…</h1>
<p id="status"></p>
<div id="drawing"></div>
<div id="sliders"></div>
<div id="top"></div>
<h2>Torques and hand force</h2>
<div id="plots"></div>
<p class="note" id="method"></p>
<h2>Safety factors</h2>
<div id="safety"></div>
<h2>Figures over the range</h2>
<div id="figures"></div>
<h2>Diagnostics</h2>
<div id="findings"></div>
<details id="limits"><summary>Limits of the model</summary></details>
<details id="cautions" open><summary>Before you build</summary></details>
<script nonce="${p.nonce}" src="${p.scriptUri}"></script>
</body></html>`;
}

/** 32 random letters and digits for the script nonce (the Web Crypto API of Node 20 and browsers). */
export function makeNonce(): string {
  const alphabet = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789";
  const bytes = new Uint8Array(32);
  globalThis.crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => alphabet[b % alphabet.length]).join("");
}
