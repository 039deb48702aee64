/**
 * The component kit's card dialogs draw their title as a `role="heading"` inside another `role="heading"`, neither
 * with a level, which assistive technology reads as a broken heading (axe: aria-required-attr). Call this when a
 * card dialog has opened: the outer box stops claiming to be a heading and the title becomes a level-2 heading.
 */
export function levelCardHeadings(): void {
  for (const header of document.querySelectorAll('.n-card-header[role="heading"]')) header.setAttribute('role', 'none');
  for (const title of document.querySelectorAll('.n-card-header__main[role="heading"]:not([aria-level])'))
    title.setAttribute('aria-level', '2');
}
