/** The left column of the sign-in pages: what Phaseloom is for, in three lines. */
export function EntryAside() {
  const items: Array<[string, string]> = [
    ['Captures in', 'phase, IQ or beat-note records from the bench, as they came off the scope'],
    ['Spectra out', 'frequency-noise PSD by Welch, the white floor and the β\u2011separation line'],
    ['Kept together', 'lasers, settings and results on a shared bench, with roles'],
  ];
  return (
    <div className="mt-14 max-w-[26rem]">
      <p className="text-[1.375rem] leading-snug font-medium tracking-tight text-ink text-balance">
        Frequency-noise spectra and linewidths, kept with the bench they came from.
      </p>
      <dl className="mt-10 flex flex-col gap-5 border-l border-rule-strong pl-5">
        {items.map(([term, text]) => (
          <div key={term}>
            <dt className="text-xs font-medium tracking-[0.08em] text-ink-faint uppercase">{term}</dt>
            <dd className="mt-1 text-sm leading-relaxed text-ink-soft">{text}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
