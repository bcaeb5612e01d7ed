// A bar between two areas that the user drags (or moves with the arrow keys) to resize them.
// It reports a size in pixels for the area it belongs to; the caller keeps it within limits.
import { useRef, type KeyboardEvent, type PointerEvent } from 'react';

export interface SplitterProps {
  /** 'vertical' = a bar standing up between columns; 'horizontal' = a bar lying between rows. */
  orientation: 'vertical' | 'horizontal';
  label: string;
  size: number;
  min: number;
  max: number;
  /** +1 when dragging right/down makes the area larger, -1 when it makes it smaller. */
  grow: 1 | -1;
  onSize(size: number): void;
  hook: string;
}

export const clamp = (v: number, min: number, max: number) => Math.round(Math.min(max, Math.max(min, v)));

export function Splitter({ orientation, label, size, min, max, grow, onSize, hook }: SplitterProps) {
  const start = useRef<{ at: number; size: number } | null>(null);
  const along = (e: { clientX: number; clientY: number }) => (orientation === 'vertical' ? e.clientX : e.clientY);
  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0) return;
    e.preventDefault();
    e.currentTarget.setPointerCapture?.(e.pointerId);
    start.current = { at: along(e), size };
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (!start.current) return;
    onSize(clamp(start.current.size + grow * (along(e) - start.current.at), min, max));
  };
  const onPointerUp = () => {
    start.current = null;
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const step = e.shiftKey ? 80 : 20;
    const less = orientation === 'vertical' ? 'ArrowLeft' : 'ArrowUp';
    const more = orientation === 'vertical' ? 'ArrowRight' : 'ArrowDown';
    if (e.key !== less && e.key !== more) return;
    e.preventDefault();
    onSize(clamp(size + grow * (e.key === more ? step : -step), min, max));
  };
  return (
    <div
      className={`lw-splitter lw-splitter--${orientation}`}
      role="separator"
      tabIndex={0}
      aria-label={label}
      aria-orientation={orientation}
      aria-valuenow={size}
      aria-valuemin={min}
      aria-valuemax={max}
      title={`${label}: drag, or use the arrow keys`}
      data-splitter={hook}
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={onPointerUp}
      onKeyDown={onKeyDown}
    />
  );
}
