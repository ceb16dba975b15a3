/** Where a capture file comes in: dropped on the area, or chosen with the button (keyboard reachable). */
import { useId, useRef, useState, type DragEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { Mono } from '../../../components/ui/quantity';
import { formatSI } from '../../../lib/units';

export interface FileDropProps {
  file: File | null;
  onFile: (file: File | null) => void;
  disabled?: boolean;
}

export function FileDrop({ file, onFile, disabled = false }: FileDropProps) {
  const inputRef = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const hintId = useId();

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault();
    setOver(false);
    if (disabled) return;
    const dropped = e.dataTransfer.files[0];
    if (dropped) onFile(dropped);
  };

  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      className={cn(
        'flex items-center justify-between gap-6 rounded-[4px] border border-dashed px-6 py-6 transition-colors',
        over ? 'border-accent bg-accent-soft/50' : 'border-rule-strong bg-paper-card/70',
        disabled && 'opacity-60',
      )}
      data-testid="file-drop"
    >
      <div className="min-w-0">
        {file ? (
          <>
            <p className="truncate font-medium text-ink" title={file.name}>
              {file.name}
            </p>
            <p className="mt-0.5 text-sm text-ink-soft">
              <Mono>{formatSI(file.size, 'B', { significant: 3 }).text}</Mono>
              {file.size > 0 && (
                <span className="text-ink-faint">
                  {' '}
                  · <Mono>{file.size.toLocaleString('en-GB')}</Mono> bytes
                </span>
              )}
            </p>
          </>
        ) : (
          <>
            <p className="font-medium text-ink">Drop a capture here</p>
            <p id={hintId} className="mt-0.5 text-sm text-ink-soft">
              Phase, IQ, beat-note or frequency records as CSV/TSV, NumPy .npy, WAV or raw binary.
            </p>
          </>
        )}
      </div>
      <div className="flex shrink-0 items-center gap-3">
        {file && !disabled && (
          <Button variant="quiet" size="sm" onClick={() => onFile(null)}>
            Clear
          </Button>
        )}
        <Button variant="secondary" onClick={() => inputRef.current?.click()} disabled={disabled} aria-describedby={file ? undefined : hintId}>
          {file ? 'Choose another file' : 'Choose a file'}
        </Button>
        <input
          ref={inputRef}
          type="file"
          className="sr-only"
          tabIndex={-1}
          aria-hidden="true"
          data-testid="capture-file-input"
          onChange={(e) => {
            const chosen = e.currentTarget.files?.[0];
            if (chosen) onFile(chosen);
            e.currentTarget.value = '';
          }}
        />
      </div>
    </div>
  );
}
