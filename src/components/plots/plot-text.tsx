/**
 * Quantity symbols in SVG text: "S_ν" is written S with a lowered, smaller ν (a subscript made with
 * dy shifts, which survive serialisation to a standalone SVG file, unlike CSS baseline shifts).
 */
import { Fragment } from 'react';

/** Splits "√S_ν (Hz²/Hz)" into runs: [{ text: '√S' }, { text: 'ν', sub: true }, { text: ' (Hz²/Hz)' }]. */
export function symbolRuns(text: string): { text: string; sub: boolean }[] {
  const runs: { text: string; sub: boolean }[] = [];
  const re = /_([^\s_()]+)/g;
  let last = 0;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    if (m.index > last) runs.push({ text: text.slice(last, m.index), sub: false });
    runs.push({ text: m[1], sub: true });
    last = m.index + m[0].length;
  }
  if (last < text.length) runs.push({ text: text.slice(last), sub: false });
  return runs;
}

/** The runs as <tspan>s, for use inside an SVG <text> whose font size is `fontSize` px. */
export function SvgSymbol({ text, fontSize }: { text: string; fontSize: number }) {
  const runs = symbolRuns(text);
  const shift = Math.round(fontSize * 0.25 * 10) / 10;
  return (
    <>
      {runs.map((r, i) => {
        const afterSub = i > 0 && runs[i - 1].sub;
        return r.sub ? (
          <tspan key={i} dy={shift} fontSize={Math.round(fontSize * 0.8 * 10) / 10}>
            {r.text}
          </tspan>
        ) : (
          <tspan key={i} dy={afterSub ? -shift : undefined}>
            {r.text}
          </tspan>
        );
      })}
    </>
  );
}

/** The runs as HTML (<sub>), for read-outs and panels. */
export function HtmlSymbol({ text }: { text: string }) {
  return (
    <>
      {symbolRuns(text).map((r, i) => (r.sub ? <sub key={i}>{r.text}</sub> : <Fragment key={i}>{r.text}</Fragment>))}
    </>
  );
}
