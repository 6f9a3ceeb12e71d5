import { useLayoutEffect, useRef, useState } from 'react';

/**
 * Where a window-virtualised list starts on the page (TanStack Virtual's `scrollMargin`): the
 * list sits below headings, search and filters, and a virtualizer that thinks it starts at the
 * top lays its rows out too high and leaves blank rows at the bottom of the screen. Measured
 * again whenever `watched(list)` changes size (what sits above the list opens or closes) and when
 * the window does.
 */
export function useScrollMargin<T extends HTMLElement>(
  watched: (list: T) => Element | null | undefined,
) {
  const ref = useRef<T>(null);
  const [scrollMargin, setScrollMargin] = useState(0);
  const watchedRef = useRef(watched);
  useLayoutEffect(() => {
    const measure = () => {
      const el = ref.current;
      if (el) setScrollMargin(Math.round(el.getBoundingClientRect().top + window.scrollY));
    };
    measure();
    const observer = new ResizeObserver(measure);
    const target = ref.current && watchedRef.current(ref.current);
    if (target) observer.observe(target);
    window.addEventListener('resize', measure);
    return () => {
      observer.disconnect();
      window.removeEventListener('resize', measure);
    };
  }, []);
  return { ref, scrollMargin };
}

/**
 * The space a window-virtualised list leaves above and below the rows it renders, so the page
 * keeps the whole list's height (rows are laid out from `scrollMargin`).
 */
export function windowPadding(
  rows: readonly { start: number; end: number }[],
  totalSize: number,
  scrollMargin: number,
) {
  return {
    padTop: Math.max(0, (rows[0]?.start ?? scrollMargin) - scrollMargin),
    padBottom: Math.max(0, totalSize - ((rows.at(-1)?.end ?? scrollMargin) - scrollMargin)),
  };
}
