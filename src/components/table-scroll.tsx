import { useEffect, useRef, useState } from 'react';
import type { ReactNode } from 'react';

/**
 * Holds a table that may be wider than its card: on a narrow screen the table scrolls sideways
 * inside the card instead of widening the page. While it does scroll, it is a named region that
 * takes keyboard focus, so the arrow keys can scroll it too (axe: scrollable-region-focusable).
 * `relative` keeps visually hidden cells (sr-only, absolutely placed) inside the scroller.
 */
export function TableScroll({
  label,
  children,
  className = '',
}: {
  label: string;
  children: ReactNode;
  className?: string;
}) {
  const box = useRef<HTMLDivElement>(null);
  const [scrolls, setScrolls] = useState(false);

  useEffect(() => {
    const element = box.current;
    if (!element || typeof ResizeObserver === 'undefined') return;
    // No measuring here: reading scrollWidth inside the render's task forced a layout of the whole
    // new screen there (250 ms of a 400-point study's opening, bench:study-screen); the observer
    // reports every observed box once after the browser's own layout anyway.
    const observer = new ResizeObserver(() => setScrolls(element.scrollWidth > element.clientWidth + 1));
    observer.observe(element);
    for (const child of element.children) observer.observe(child);
    return () => observer.disconnect();
  }, []);

  return (
    <div
      ref={box}
      className={`relative max-w-full overflow-x-auto ${className}`}
      {...(scrolls ? { tabIndex: 0, role: 'region', 'aria-label': label } : {})}
    >
      {children}
    </div>
  );
}
