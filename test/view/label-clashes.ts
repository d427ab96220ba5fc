// Measures, in the page, every svg's text boxes: pairs that intersect and boxes that leave their
// svg. Shared by the report's and the preview's label tests.
import type { Page } from "playwright-core";

export interface Clash {
  figure: string;
  a: string;
  b?: string;
}

/** In the page: for every svg, the text boxes that intersect each other or leave the svg. */
/** The little of the DOM this reads (the project compiles without the DOM library). */
interface Rect {
  left: number;
  top: number;
  right: number;
  bottom: number;
}
interface El {
  getAttribute(name: string): string | null;
  getBoundingClientRect(): Rect;
  querySelectorAll(selector: string): Iterable<El> & { forEach(f: (e: El, i: number) => void): void };
  textContent: string | null;
}

export async function labelClashes(p: Page): Promise<Clash[]> {
  return p.evaluate(() => {
    const document = (globalThis as unknown as { document: El }).document;
    const out: { figure: string; a: string; b?: string }[] = [];
    document.querySelectorAll("svg").forEach((svg, i) => {
      const frame = svg.getBoundingClientRect();
      const figure = `${svg.getAttribute("class") ?? "svg"}#${i} ${svg.getAttribute("data-plot") ?? ""}`;
      const texts = [...svg.querySelectorAll("text")].map((t) => ({
        text: t.textContent ?? "",
        box: t.getBoundingClientRect(),
      }));
      // Half a pixel of slack: anti-aliasing, not a visible overlap.
      const e = 0.5;
      for (const t of texts) {
        const b = t.box;
        if (
          b.left < frame.left - e ||
          b.top < frame.top - e ||
          b.right > frame.right + e ||
          b.bottom > frame.bottom + e
        )
          out.push({ figure, a: `${t.text} leaves the figure` });
      }
      for (let m = 0; m < texts.length; m++)
        for (let n = m + 1; n < texts.length; n++) {
          const a = texts[m]!.box;
          const b = texts[n]!.box;
          if (a.left < b.right - e && b.left < a.right - e && a.top < b.bottom - e && b.top < a.bottom - e)
            out.push({ figure, a: texts[m]!.text, b: texts[n]!.text });
        }
    });
    return out;
  });
}
