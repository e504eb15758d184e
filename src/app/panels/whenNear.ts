/**
 * Runs `start` once, when `element` comes within `margin` pixels of the viewport (at once where the browser has no
 * IntersectionObserver). The panels far down the page start their first jobs (the DEMO fits) this way, so that at
 * start-up the cores go to the sheet and its bands, not to panels nobody has looked at yet.
 */
export function whenNear(element: Element, start: () => void, margin = 800): void {
  if (typeof IntersectionObserver === 'undefined') {
    start();
    return;
  }
  const observer = new IntersectionObserver((entries) => {
    if (!entries.some((entry) => entry.isIntersecting)) return;
    observer.disconnect();
    start();
  }, { rootMargin: `${margin}px 0px` });
  observer.observe(element);
}
