/* global window, location */
// Starts the session renewal (POST /api/auth/refresh with the httpOnly cookie) as soon as the page is parsed,
// while the dashboard's own code is still downloading: Angular's first guard would otherwise ask only after
// bootstrap, about half a second later. The Auth service takes this answer over (core/session-head-start.ts)
// and never sends a second renewal beside it, since the server treats a reused refresh token as theft.
// Public pages (sign-in, invitation, password reset) do not renew: none of them asks for a session.
(function () {
  if (/^\/(sign-in|invitation\/|password-reset)/.test(location.pathname)) return;
  window.cwSessionHeadStart = fetch('/api/auth/refresh', {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: '{}',
  }).then(
    function (response) {
      return response.ok
        ? response.json().then(function (body) {
            return { status: response.status, body: body };
          })
        : { status: response.status, body: null };
    },
    // No connection: status 0, as Angular's HttpClient reports it.
    function () {
      return { status: 0, body: null };
    },
  );
})();
