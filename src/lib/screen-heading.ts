import { useEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';

const appName = 'Halflight';
/** The heading of the screen on view; every screen has exactly one h1 inside the main area. */
const headingSelector = '#main h1';

/**
 * Calls `act` with the screen's heading as soon as it is in the page: at once, or when a screen
 * that is still loading renders it. Gives up after `patienceMs`. Returns the way to stop waiting.
 */
export function whenHeadingAppears(act: (heading: HTMLElement) => void, patienceMs = 10_000): () => void {
  const find = () => document.querySelector<HTMLElement>(headingSelector);
  const present = find();
  if (present) {
    act(present);
    return () => {};
  }
  const observer = new MutationObserver(() => {
    const heading = find();
    if (!heading) return;
    stop();
    act(heading);
  });
  const timer = window.setTimeout(() => observer.disconnect(), patienceMs);
  function stop() {
    observer.disconnect();
    window.clearTimeout(timer);
  }
  observer.observe(document.body, { childList: true, subtree: true });
  return stop;
}

/** Moves keyboard and screen-reader focus to a heading (or any element) without a visible jump of layout. */
export function focusHeading(heading: HTMLElement) {
  if (!heading.hasAttribute('tabindex')) heading.setAttribute('tabindex', '-1');
  heading.focus();
}

/**
 * What a screen change means for people who cannot see the page change: the tab's title follows
 * the screen's heading, and after a move to another address (sign-in, a link, a redirect) focus
 * goes to that heading, so the next Tab starts from the new screen and a screen reader reads its
 * name, unless the new screen already put the focus inside itself. The first screen of a visit
 * keeps the browser's own starting point.
 */
export function useScreenHeading() {
  const { pathname } = useLocation();
  const firstScreen = useRef(true);

  useEffect(() => {
    if (firstScreen.current) {
      firstScreen.current = false;
      return;
    }
    // A screen that has already placed the focus inside itself on arrival (a fresh result, say)
    // keeps it; otherwise the heading takes it.
    return whenHeadingAppears((heading) => {
      const active = document.activeElement;
      if (active && active !== document.body && document.querySelector('#main')?.contains(active)) return;
      focusHeading(heading);
    });
  }, [pathname]);

  useEffect(() => {
    const setTitle = () => {
      const heading = document.querySelector<HTMLElement>(headingSelector)?.textContent?.trim();
      const title = heading ? `${heading} · ${appName}` : appName;
      if (document.title !== title) document.title = title;
    };
    setTitle();
    const observer = new MutationObserver(setTitle);
    observer.observe(document.body, { childList: true, subtree: true, characterData: true });
    return () => observer.disconnect();
  }, []);
}
