// web/src/session-head-start.js paints a system's first values from its status, in plain DOM outside Angular's
// root, before the dashboard's code has run; the live view takes the screen back here.

/** The id of the first glance's region. */
export const FIRST_GLANCE_ID = 'cw-first-glance';

/** Removes the first glance, if it stands: the live view's own values (or its message) are on screen now. */
export function removeFirstGlance(document: Document): void {
  document.getElementById(FIRST_GLANCE_ID)?.remove();
}
