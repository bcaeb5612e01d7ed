// A small modal dialog: focus moves in, Escape closes.
import { useEffect, useRef, type ReactNode } from 'react';

export function Dialog({ title, onClose, children, wide }: { title: string; onClose(): void; children: ReactNode; wide?: boolean }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    // Focus the first field of the body (Find's search box), else its first control, else Close.
    const body = box.current?.querySelector('.lw-dialog-body');
    const first = body?.querySelector<HTMLElement>('input, textarea, select')
      ?? body?.querySelector<HTMLElement>('button, [tabindex]')
      ?? box.current?.querySelector<HTMLElement>('button');
    const before = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    first?.focus();
    // Focus goes back where it was (the sheet or a schedule row) when the dialog closes.
    return () => {
      if (before && before.isConnected) before.focus();
    };
  }, []);
  return (
    <div className="lw-overlay" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div
        ref={box}
        className={`lw-dialog${wide ? ' lw-dialog--wide' : ''}`}
        role="dialog"
        aria-modal="true"
        aria-label={title}
        onKeyDown={(e) => {
          if (e.key === 'Escape') {
            e.stopPropagation();
            onClose();
          }
        }}
      >
        <div className="lw-dialog-head">
          <h2>{title}</h2>
          <button type="button" className="lw-close" aria-label="Close" onClick={onClose}>×</button>
        </div>
        <div className="lw-dialog-body">{children}</div>
      </div>
    </div>
  );
}
