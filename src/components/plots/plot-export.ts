/**
 * Exports of a plot as files: a standalone SVG (styles inlined, the interactive layers left out, the
 * two typefaces embedded so the file looks the same anywhere) and a PNG drawn from that SVG on a
 * canvas. Plus the small download helpers the export menus use.
 */
import monoFontUrl from '@fontsource/jetbrains-mono/files/jetbrains-mono-latin-400-normal.woff2?url';
import sansFontUrl from '@fontsource/inter/files/inter-latin-400-normal.woff2?url';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** properties copied from the computed style of any element that still carries a class */
const INLINED = ['fill', 'fill-opacity', 'stroke', 'stroke-width', 'stroke-dasharray', 'stroke-opacity', 'opacity', 'font-family', 'font-size', 'font-weight'];

async function dataUrl(url: string): Promise<string> {
  const blob = await (await fetch(url)).blob();
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error ?? new Error('could not read the font'));
    reader.readAsDataURL(blob);
  });
}

let fontCss: Promise<string> | null = null;

/** @font-face rules with the fonts inlined as data URLs (fetched once per page). */
function embeddedFontCss(): Promise<string> {
  fontCss ??= Promise.all([dataUrl(sansFontUrl), dataUrl(monoFontUrl)])
    .then(
      ([sans, mono]) =>
        `@font-face{font-family:"Inter";font-weight:400;src:url(${sans}) format("woff2");}` +
        `@font-face{font-family:"JetBrains Mono";font-weight:400;src:url(${mono}) format("woff2");}`,
    )
    .catch(() => {
      fontCss = null;
      return '';
    });
  return fontCss;
}

export interface SerializeOptions {
  /** a <title> for the file (shown by viewers) */
  title?: string;
  /** embed the typefaces (default true) */
  embedFonts?: boolean;
}

/** The plot's SVG as a standalone document (UTF-8 text). */
export async function serializePlotSvg(svg: SVGSVGElement, options: SerializeOptions = {}): Promise<string> {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  // styles: elements keep their presentation attributes; anything styled by a class gets it inlined
  const originals = [svg, ...Array.from(svg.querySelectorAll('*'))];
  const copies = [clone, ...Array.from(clone.querySelectorAll('*'))];
  originals.forEach((el, i) => {
    const copy = copies[i];
    if (!copy) return;
    if (el.getAttribute('class')) {
      const computed = getComputedStyle(el);
      const style = INLINED.map((p) => `${p}:${computed.getPropertyValue(p)}`).join(';');
      copy.setAttribute('style', style);
      copy.removeAttribute('class');
    } else {
      copy.removeAttribute('style');
    }
    copy.removeAttribute('tabindex');
    copy.removeAttribute('data-testid');
  });
  clone.querySelectorAll('[data-export="omit"]').forEach((el) => el.remove());
  const width = svg.width.baseVal.value || svg.getBoundingClientRect().width;
  const height = svg.height.baseVal.value || svg.getBoundingClientRect().height;
  clone.setAttribute('xmlns', SVG_NS);
  clone.setAttribute('width', String(width));
  clone.setAttribute('height', String(height));
  clone.setAttribute('viewBox', `0 0 ${width} ${height}`);
  if (options.title) {
    const title = document.createElementNS(SVG_NS, 'title');
    title.textContent = options.title;
    clone.insertBefore(title, clone.firstChild);
  }
  if (options.embedFonts !== false) {
    const css = await embeddedFontCss();
    if (css) {
      const style = document.createElementNS(SVG_NS, 'style');
      style.textContent = css;
      clone.insertBefore(style, clone.firstChild);
    }
  }
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}\n`;
}

/** A PNG of an SVG document, drawn at `scale` × its size (2 = sharp on high-density screens and in print). */
export async function svgToPng(svgText: string, width: number, height: number, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const img = new Image();
    img.width = width;
    img.height = height;
    img.src = url;
    await img.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('this browser cannot draw on a canvas');
    ctx.scale(scale, scale);
    ctx.drawImage(img, 0, 0, width, height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the PNG could not be made'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Offers a blob as a download with the given file name. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 30_000);
}

export function downloadText(text: string, fileName: string, type: string): void {
  downloadBlob(new Blob([text], { type }), fileName);
}

/** A file-name-safe stem: "Kestrel ECL-1550 / 2026-03-14" → "kestrel-ecl-1550-2026-03-14". */
export function fileStem(...parts: Array<string | null | undefined>): string {
  const stem = parts
    .filter((p): p is string => Boolean(p))
    .join('-')
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9.]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .replace(/-{2,}/g, '-');
  return stem || 'phaseloom';
}
